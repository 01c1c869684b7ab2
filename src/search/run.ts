/**
 * A search run: one optimizer, one search space, one seeded generator, and the loop that asks a
 * batch, checks the cheap constraints, evaluates the feasible points (in parallel when the objective
 * is asynchronous) and tells the scores. Its state is plain JSON, so a run can be saved and resumed
 * with the same result as a run straight through.
 */
import './builtins.js';
import { InputError } from '../errors.js';
import { AutoOptimizer, type AutoChoice } from './optimizers/auto.js';
import type { Optimizer, OptimizerContext, OptimizerState, Progress, Score } from './core/types.js';
import { createOptimizer, restoreOptimizer } from './registry.js';
import { Rng } from './rng.js';
import type { SearchSpace } from './space/space.js';

export interface RunState {
  format: 'lumenfold-search-run';
  version: 1;
  seed: number;
  batch: number;
  objectives: 'single' | 'multi';
  /** Variable signatures of the space the run belongs to. */
  space: string[];
  optimizer: OptimizerState;
}

export interface RunSettings {
  /** Registry name; default 'auto'. */
  optimizer?: string;
  /** Options of the optimizer (see describeOptimizer). */
  options?: Record<string, unknown>;
  /** Number of candidates told (feasible or not) after which the run ends. Default 1000. */
  budget?: number;
  /** Seed of the run's random generator. Default 0. */
  seed?: number;
  /** Candidates asked and evaluated together. Default 1. */
  batch?: number;
  /** Called after every tell; return false to stop the run early. */
  onProgress?: (progress: Progress) => void | boolean;
  /** A saved RunState to continue from (the optimizer and seed then come from it). */
  resume?: RunState;
  /** Hypervolume reference point, several objectives only. */
  reference?: readonly number[];
}

export type BatchEvaluator<P> = (points: P[]) => readonly Score[] | Promise<readonly Score[]>;

function positiveInteger(value: number, what: string): number {
  if (!Number.isInteger(value) || value < 1) throw new InputError(`${what} must be a positive integer, got ${value}`);
  return value;
}

export class SearchRun<P extends object> {
  readonly optimizer: Optimizer;
  readonly seed: number;
  readonly batch: number;
  private stopRequested = false;

  constructor(
    readonly space: SearchSpace<P>,
    readonly objectives: 'single' | 'multi',
    settings: RunSettings,
  ) {
    const budget = settings.budget ?? 1000;
    if (!(budget >= 0) || !Number.isFinite(budget)) throw new InputError(`budget must be a finite number >= 0, got ${budget}`);
    if (space.dim === 0) throw new InputError('the search space has no variables');
    const resume = settings.resume;
    if (resume) {
      if (resume.format !== 'lumenfold-search-run' || resume.version !== 1) throw new InputError('resume: not a saved search run (format lumenfold-search-run, version 1)', 'bad-state');
      if (JSON.stringify(resume.space) !== JSON.stringify(space.signature())) {
        throw new InputError('resume: the saved run belongs to a different search space (variables differ)', 'bad-state');
      }
      if (resume.objectives !== objectives) throw new InputError(`resume: the saved run has ${resume.objectives === 'multi' ? 'several objectives' : 'one objective'}`, 'bad-state');
      if (settings.optimizer && settings.optimizer !== resume.optimizer.name) {
        throw new InputError(`resume: the saved run uses optimizer "${resume.optimizer.name}", not "${settings.optimizer}"`, 'bad-state');
      }
    }
    this.seed = resume ? resume.seed : settings.seed ?? 0;
    this.batch = positiveInteger(resume ? resume.batch : settings.batch ?? 1, 'batch');
    const ctx: OptimizerContext = {
      space,
      rng: Rng.fromSeed(this.seed),
      batch: this.batch,
      budget,
      objectives,
      reference: settings.reference,
      onProgress: settings.onProgress
        ? (p) => {
            if (settings.onProgress!(p) === false) this.stopRequested = true;
          }
        : undefined,
    };
    this.optimizer = resume ? restoreOptimizer(resume.optimizer, ctx) : createOptimizer(settings.optimizer ?? 'auto', ctx, settings.options ?? {});
  }

  /** What 'auto' picked, if the run uses it. */
  get choice(): AutoChoice | undefined {
    return this.optimizer instanceof AutoOptimizer ? this.optimizer.choice : undefined;
  }

  get evaluations(): number {
    return this.optimizer.progress().evaluations;
  }

  get stopped(): boolean {
    return this.stopRequested;
  }

  /** Runs until `budget` candidates have been told in total, or onProgress returns false. */
  async runUntil(budget: number, evaluate: BatchEvaluator<P>): Promise<void> {
    let used = this.evaluations;
    while (used < budget && !this.stopRequested) {
      const candidates = this.optimizer.ask(Math.min(this.batch, budget - used));
      if (candidates.length === 0) throw new InputError('internal: the optimizer proposed no candidate although none is outstanding');
      const points = candidates.map((c) => this.space.decode(c.x));
      const violations = points.map((p) => this.space.violation(p));
      const feasible = points.filter((_, i) => violations[i] === 0);
      const values = feasible.length > 0 ? await evaluate(feasible) : [];
      if (!Array.isArray(values) || values.length !== feasible.length) {
        throw new InputError(`the batch evaluation returned ${Array.isArray(values) ? values.length : 'no'} scores for ${feasible.length} points`);
      }
      let k = 0;
      const scores: Score[] = violations.map((v) => (v === 0 ? values[k++] : null));
      this.optimizer.tell(candidates, scores, violations);
      used += candidates.length;
    }
  }

  dump(): RunState {
    return {
      format: 'lumenfold-search-run',
      version: 1,
      seed: this.seed,
      batch: this.batch,
      objectives: this.objectives,
      space: this.space.signature(),
      optimizer: this.optimizer.dump(),
    };
  }
}
