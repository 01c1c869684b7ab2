/**
 * 'auto': picks an optimizer from the shape of the problem and says why. Rules, first match wins:
 *   1. several objectives                                   -> nsga2
 *   2. fewer than 10 evaluations per standardized coordinate,
 *      or fewer than 8 rounds of parallel batches            -> halton (space filling beats adaptation)
 *   3. every variable has a start value and the budget is
 *      under 50 evaluations per coordinate                   -> one-plus-one (polish around the start)
 *   4. any integer or categorical variable                   -> de-rand1bin (own categorical mutation)
 *   5. otherwise (real variables)                            -> cmaes (IPOP restarts)
 * The thresholds are our own rules of thumb (common practice, not from a published study). Rule 4
 * follows our test problem with a 4-way choice, an integer and 3 reals: de-rand1bin found the optimum
 * from every seed tried, while CMA-ES, NSGA-II and de-current-to-best1 often settled on a wrong option.
 */
import { InputError } from '../../errors.js';
import type { Family } from '../core/family.js';
import type { Candidate, Optimizer, OptimizerContext, OptimizerState, Score } from '../core/types.js';

export interface AutoChoice {
  name: string;
  reason: string;
}

export function chooseOptimizer(ctx: Pick<OptimizerContext, 'space' | 'budget' | 'batch' | 'objectives'>): AutoChoice {
  const { space, objectives } = ctx;
  const n = space.dim;
  const budget = ctx.budget;
  const batch = Math.max(1, ctx.batch);
  const discrete = space.discreteShare;
  const shape = `${n} coordinates, budget ${Number.isFinite(budget) ? budget : 'unlimited'}, batch ${batch}, ${Math.round(discrete * 100)}% discrete variables`;
  if (objectives === 'multi') return { name: 'nsga2', reason: `several objectives (${shape})` };
  const rounds = budget / batch;
  if (budget < 10 * n || rounds < 8) {
    const why = budget < 10 * n ? `under 10 evaluations per coordinate` : `only ${Math.floor(rounds)} rounds of ${batch} parallel evaluations`;
    return { name: 'halton', reason: `${why}: even low-discrepancy coverage (${shape})` };
  }
  if (space.startGiven && budget < 50 * n) {
    return { name: 'one-plus-one', reason: `start point given and under 50 evaluations per coordinate: local polishing (${shape})` };
  }
  if (discrete > 0) return { name: 'de-rand1bin', reason: `discrete variables: differential evolution with its own categorical mutation (${shape})` };
  return { name: 'cmaes', reason: `real variables and enough budget for CMA-ES with restarts (${shape})` };
}

export type Create = (name: string, ctx: OptimizerContext) => Optimizer;

/** Wraps the chosen optimizer; its state records the choice so a resumed run keeps it. */
export class AutoOptimizer implements Optimizer {
  readonly name = 'auto';
  readonly family = 'auto';
  readonly choice: AutoChoice;
  private inner: Optimizer;

  constructor(
    private readonly ctx: OptimizerContext,
    private readonly create: Create,
  ) {
    this.choice = chooseOptimizer(ctx);
    this.inner = create(this.choice.name, ctx);
  }

  ask(n?: number): Candidate[] {
    return this.inner.ask(n);
  }

  tell(candidates: readonly Candidate[], scores: readonly Score[], violations?: readonly number[]): void {
    this.inner.tell(candidates, scores, violations);
  }

  recommend() {
    return this.inner.recommend();
  }

  archive() {
    return this.inner.archive();
  }

  progress() {
    const p = this.inner.progress();
    return { ...p, optimizer: `auto:${this.choice.name}`, detail: { ...p.detail, chosen: this.choice.name, reason: this.choice.reason } };
  }

  dump(): OptimizerState {
    return { format: 'lumenfold-optimizer', version: 1, name: 'auto', options: {}, data: { choice: this.choice, inner: this.inner.dump() } };
  }

  load(state: OptimizerState): void {
    if (!state || state.name !== 'auto') throw new InputError('saved state does not belong to the auto optimizer', 'bad-state');
    const d = state.data as { choice: AutoChoice; inner: OptimizerState };
    (this as { choice: AutoChoice }).choice = d.choice;
    this.inner = this.create(d.choice.name, this.ctx);
    this.inner.load(d.inner);
  }
}

export function autoFamily(create: Create): Family {
  return {
    family: 'auto',
    description: 'picks among the optimizers from dimension, budget, discrete share, objectives and batch size',
    options: {},
    multiObjective: true,
    create: (_name, ctx) => new AutoOptimizer(ctx, create),
  };
}
