import { createHash } from 'node:crypto';
import { InputError } from '../errors.js';
import { optimizerNames } from '../search/registry.js';
import '../search/builtins.js';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import type { MetricName } from '../metrics/evaluate.js';
import type { Progress } from '../search/core/types.js';
import { optimizeDesign, type OptimizationOutcome, type ResumePoint } from './optimize-core.js';

/**
 * A self-contained, serializable optimization job: configs in, results out. A sweep is a list of these, so a
 * runner on a cluster can take the same jobs.
 */
export interface OptimizationJob {
  format: 'lumenfold.job/1';
  id: string;
  label: string;
  constraints: ConstraintSet;
  objective: Objective;
  search: { optimizer: string; budget: number; batch: number; seed: number; top: number };
}

/** SHA-256 of a text, hex. */
export function sha256Hex(text: string): string {
  return createHash('sha256').update(text).digest('hex');
}

/** SHA-256 of canonical JSON (keys sorted), hex. */
export function hashOf(value: unknown): string {
  const canon = (v: unknown): unknown => Array.isArray(v) ? v.map(canon)
    : v && typeof v === 'object' ? Object.fromEntries(Object.keys(v as object).sort().map((k) => [k, canon((v as Record<string, unknown>)[k])])) : v;
  return sha256Hex(JSON.stringify(canon(value)));
}

/** Search settings: command-line values over the objective's optimizer block over defaults. */
export function searchSettings(o: Objective, over: Partial<OptimizationJob['search']>): OptimizationJob['search'] {
  const d = o.optimizer;
  return {
    optimizer: over.optimizer ?? d?.name ?? 'auto',
    budget: over.budget ?? d?.budget ?? 2000,
    batch: over.batch ?? d?.batch ?? 8,
    seed: over.seed ?? d?.seed ?? 1,
    top: over.top ?? 5,
  };
}

/** Throw an InputError (before anything is written) when the optimizer name is not registered. */
export function checkOptimizerName(name: string): void {
  const known = ['auto', ...optimizerNames().filter((n) => n !== 'auto')];
  if (!known.includes(name)) throw new InputError(`unknown optimizer "${name}"; available: ${known.join(', ')}`);
}

export function makeJob(label: string, constraints: ConstraintSet, objective: Objective, search: OptimizationJob['search']): OptimizationJob {
  checkOptimizerName(search.optimizer);
  const id = hashOf({ constraints, objective, search }).slice(0, 16);
  return { format: 'lumenfold.job/1', id, label, constraints, objective, search };
}

export interface JobHooks {
  shouldStop?: () => boolean;
  onProgress?: (p: Progress) => void;
  onEvaluation?: (e: { index: number; score: number | number[]; feasible: boolean; metrics: Partial<Record<MetricName, number>>; error?: string }) => void;
}

export function runJob(job: OptimizationJob, hooks: JobHooks = {}, workers = 1, resume?: ResumePoint): Promise<OptimizationOutcome> {
  return optimizeDesign(job.constraints, job.objective, { ...job.search, ...hooks, workers, resume });
}
