/**
 * (1+1)-ES with the one-fifth success rule, for cheap local polishing: an isotropic Gaussian step
 * x' = x + sigma N(0, I) replaces the parent when not worse; the step size is multiplied by exp(1/3)
 * after a success (strictly better) and by exp(-1/12) after a failure, so it stays put when one step
 * in five succeeds (Rechenberg's rule in the form used by Auger, "Benchmarking the (1+1) evolution
 * strategy with one-fifth success rule on the BBOB-2009 function testbed", GECCO 2009; factors
 * from memory). With a batch size b > 1 it runs as a (1+b)-ES: every offspring counts as one trial
 * of the rule and the best offspring competes with the parent. Steps leaving [0, 1] are reflected.
 * No restarts: this optimizer refines around its start point (the space's init values if given).
 */
import type { Told } from '../core/base.js';
import { compareSingle } from '../core/compare.js';
import { loadEvaluated, plain, saveEvaluated } from '../core/evaluated.js';
import type { Family } from '../core/family.js';
import { GenerationalOptimizer } from '../core/generational.js';
import type { Evaluated, OptimizerContext } from '../core/types.js';
import type { ResolvedOptions } from '../options.js';

/** Folds any real into [0, 1] by reflection at the bounds. */
export function reflect01(v: number): number {
  let t = v % 2;
  if (t < 0) t += 2;
  return t <= 1 ? t : 2 - t;
}

class OnePlusOne extends GenerationalOptimizer {
  readonly family = 'one-plus-one';
  private parent: Evaluated | null = null;
  private sigma: number;
  private successes = 0;
  private trialsDone = 0;
  private readonly offspring: number;

  constructor(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>) {
    super(name, ctx, options, given);
    this.sigma = options.sigma0 as number;
    this.offspring = (options.offspring as number | undefined) ?? Math.max(1, ctx.batch);
  }

  protected nextGeneration(): Float64Array[] {
    if (!this.parent) return this.initialPoints(1);
    const p = this.parent.x;
    const dim = this.space.dim;
    return Array.from({ length: this.offspring }, () => {
      const x = new Float64Array(dim);
      for (let i = 0; i < dim; i++) x[i] = reflect01(p[i] + this.sigma * this.rng.normal());
      return x;
    });
  }

  protected finishGeneration(scored: Told[]): void {
    if (!this.parent) {
      this.parent = plain(scored[0]);
      return;
    }
    let best = scored[0];
    let logStep = 0;
    for (const t of scored) {
      const success = compareSingle(t, this.parent) < 0;
      if (success) this.successes++;
      this.trialsDone++;
      logStep += success ? 1 / 3 : -1 / 12;
      if (compareSingle(t, best) < 0) best = t;
    }
    this.sigma = Math.max(Number.MIN_VALUE, this.sigma * Math.exp(logStep));
    if (compareSingle(best, this.parent) <= 0) this.parent = plain(best);
  }

  protected override detail(): Record<string, number | string> {
    return { sigma: this.sigma, successRate: this.trialsDone ? this.successes / this.trialsDone : 0 };
  }

  protected saveFamily(): unknown {
    return {
      parent: this.parent ? saveEvaluated(this.parent) : null,
      sigma: this.sigma,
      successes: this.successes,
      trialsDone: this.trialsDone,
    };
  }

  protected loadFamily(data: unknown): void {
    const d = data as { parent: unknown; sigma: number; successes: number; trialsDone: number };
    this.parent = d.parent ? loadEvaluated(d.parent) : null;
    this.sigma = d.sigma;
    this.successes = d.successes;
    this.trialsDone = d.trialsDone;
  }
}

export const onePlusOneFamily: Family = {
  family: 'one-plus-one',
  description: '(1+1)-ES with the one-fifth success rule; cheap local polishing from a start point',
  multiObjective: false,
  options: {
    sigma0: { type: 'number', default: 0.1, min: 0, minExclusive: true, description: 'initial step size, in box widths' },
    offspring: { type: 'integer', min: 1, defaultText: 'the batch size', description: 'offspring per generation ((1+b)-ES)' },
  },
  create: (name, ctx, options, given) => new OnePlusOne(name, ctx, options, given),
};
