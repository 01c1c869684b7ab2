/** Random search: independent uniform points of the space (each variable with its natural law). */
import { BaseOptimizer, type Proposal } from '../core/base.js';
import type { Family } from '../core/family.js';

class RandomSearch extends BaseOptimizer {
  readonly family = 'random';

  protected propose(n: number): Proposal[] {
    return Array.from({ length: n }, () => {
      const x = new Float64Array(this.space.dim);
      this.space.sampleInto(this.rng, x);
      return { x, tag: 0 };
    });
  }

  protected absorb(): void {}

  protected saveSearch(): unknown {
    return null;
  }

  protected loadSearch(): void {}
}

export const randomFamily: Family = {
  family: 'random',
  description: 'uniform random sampling; a baseline, and a fair choice for tiny budgets',
  options: {},
  multiObjective: true,
  create: (name, ctx, options, given) => new RandomSearch(name, ctx, options, given),
};
