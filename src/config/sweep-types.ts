import type { ConstraintSet } from './constraints-types.js';
import type { Objective } from './objective-types.js';

/** One varied field: a dotted path and its values (a list, or an evenly spaced range). */
export type SweepAxis =
  | { path: string; values: unknown[] }
  | { path: string; range: { start: number; stop: number; steps: number } };

/** Typed view of a lumenfold.sweep/1 document after loading, defaults filled in. */
export interface Sweep {
  format: 'lumenfold.sweep/1';
  $schema?: string;
  name?: string;
  description?: string;
  /** Path of the base constraint set, relative to the sweep file. */
  constraints: string;
  /** Path of the base objective, relative to the sweep file. */
  objective: string;
  combine: 'grid' | 'zip';
  vary: SweepAxis[];
}

/** One point of a sweep: self-contained configs (pure JSON data) and a stable id. */
export interface SweepJob {
  /** Position in the expansion, from 0. */
  index: number;
  /** First 16 hex digits of the SHA-256 of the canonical JSON of {constraints, objective}. */
  id: string;
  /** The varied values at this point, by path. */
  point: Record<string, unknown>;
  /** The point as text, e.g. "objective.model.temperature=77". */
  label: string;
  constraints: ConstraintSet;
  objective: Objective;
}
