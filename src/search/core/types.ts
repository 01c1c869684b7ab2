/** Types shared by every optimizer: the standardized space they see and the ask/tell interface. */
import type { Rng } from '../rng.js';

/** A categorical block: `width` coordinates starting at `offset`, decoded by argmax. */
export interface CategoricalBlock {
  readonly offset: number;
  readonly width: number;
}

/** What an optimizer knows of a search space: a box [0, 1]^dim and how to sample it. */
export interface StandardSpace {
  readonly dim: number;
  readonly categorical: readonly CategoricalBlock[];
  /** Share of variables (not coordinates) that are integer or categorical, in [0, 1]. */
  readonly discreteShare: number;
  /** True when every variable has a starting value (`init`). */
  readonly startGiven: boolean;
  /** Maps `dim` numbers uniform in [0, 1) to a standardized point with each variable's natural law. */
  fromUnitInto(u: ArrayLike<number>, out: Float64Array): void;
  /** A random standardized point (uniform reals, uniform choices, uniform directions). */
  sampleInto(rng: Rng, out: Float64Array): void;
  /** A starting point: the user's `init` values where given, random elsewhere. */
  startInto(rng: Rng, out: Float64Array): void;
  /** Index of the option chosen in categorical block `block` of x. */
  categoryOf(x: ArrayLike<number>, block: number): number;
  /** Writes option `index` into categorical block `block` of x. */
  setCategory(x: Float64Array, block: number, index: number): void;
}

/** One point handed out by ask(); `x` is in standardized coordinates. */
export interface Candidate {
  readonly id: number;
  readonly x: Float64Array;
}

/**
 * A score: one number for a single objective, a vector for several (all minimized), or null for a
 * point that was not evaluated (the runner skips the objective at points that break a constraint).
 */
export type Score = number | readonly number[] | null;

/** An evaluated point as kept in archives and recommendations. */
export interface Evaluated {
  readonly id: number;
  readonly x: Float64Array;
  /** Objective values after sanitizing (NaN and infinities replaced by +Infinity). */
  readonly f: Float64Array;
  /** Total constraint violation, 0 when feasible. */
  readonly violation: number;
}

export interface Progress {
  optimizer: string;
  evaluations: number;
  /** Best objective value (single objective) so far, feasible points first; undefined before any tell. */
  best?: number;
  /** Hypervolume of the current front (several objectives), with `reference`. */
  hypervolume?: number;
  reference?: number[];
  /** Family-specific counters: generation, restarts, step size... */
  detail: Record<string, number | string>;
}

export type ProgressCallback = (progress: Progress) => void;

/** What an optimizer is created with. */
export interface OptimizerContext {
  space: StandardSpace;
  rng: Rng;
  /** Number of candidates the caller evaluates at once (a hint; 1 if absent). */
  batch: number;
  /** Number of evaluations the caller intends to spend (a hint, may be Infinity). */
  budget: number;
  /** 'single' for one objective, 'multi' for several. */
  objectives: 'single' | 'multi';
  /** Hypervolume reference point for several objectives; fixed from the first 20 scores if absent. */
  reference?: readonly number[];
  onProgress?: ProgressCallback;
}

/** Plain JSON state of an optimizer: enough to resume it exactly. */
export interface OptimizerState {
  format: 'lumenfold-optimizer';
  version: 1;
  name: string;
  options: Record<string, unknown>;
  data: unknown;
}

export interface Optimizer {
  /** Registry name (for example 'cmaes' or 'de-rand1bin'). */
  readonly name: string;
  readonly family: string;
  /**
   * Up to `n` new candidates (default 1). May return fewer, or none, when the optimizer must wait
   * for outstanding scores before it can propose more (the end of a generation).
   */
  ask(n?: number): Candidate[];
  /**
   * Scores for asked candidates, in any order and any grouping. `violations` (default 0) are the
   * constraint violations; infeasible points rank after feasible ones (Deb's rules).
   */
  tell(candidates: readonly Candidate[], scores: readonly Score[], violations?: readonly number[]): void;
  /** Best point seen (feasible first); undefined before any tell. */
  recommend(): Evaluated | undefined;
  /** The archive: best points for one objective, the non-dominated set for several. */
  archive(): Evaluated[];
  progress(): Progress;
  dump(): OptimizerState;
  load(state: OptimizerState): void;
}
