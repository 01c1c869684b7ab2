/** Low-discrepancy baseline: points of a (scrambled) Halton sequence mapped into the space. */
import { BaseOptimizer, type Proposal } from '../core/base.js';
import type { Family } from '../core/family.js';
import type { OptimizerContext } from '../core/types.js';
import type { ResolvedOptions } from '../options.js';
import { Halton } from '../sampling/halton.js';

class HaltonSearch extends BaseOptimizer {
  readonly family = 'halton';
  private index: number;
  private sequence: Halton;
  private readonly u: Float64Array;

  constructor(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>) {
    super(name, ctx, options, given);
    const seed = options.scramble ? this.rng.nextU32() : null;
    this.sequence = new Halton(this.space.dim, seed);
    this.index = seed === null ? 1 : 0; // the plain sequence starts at the origin: skip it
    this.u = new Float64Array(this.space.dim);
  }

  protected propose(n: number): Proposal[] {
    return Array.from({ length: n }, () => {
      this.sequence.point(this.index++, this.u);
      const x = new Float64Array(this.space.dim);
      this.space.fromUnitInto(this.u, x);
      return { x, tag: 0 };
    });
  }

  protected absorb(): void {}

  protected saveSearch(): unknown {
    return { index: this.index, scrambleSeed: this.sequence.scrambleSeed };
  }

  protected loadSearch(data: unknown): void {
    const d = data as { index: number; scrambleSeed: number | null };
    this.index = d.index;
    this.sequence = new Halton(this.space.dim, d.scrambleSeed);
  }
}

export const haltonFamily: Family = {
  family: 'halton',
  description: 'scrambled Halton low-discrepancy points; fills the space evenly, fully parallel',
  options: {
    scramble: { type: 'boolean', default: true, description: 'random digit permutations (Owen 2017); false gives the plain sequence' },
  },
  multiObjective: true,
  create: (name, ctx, options, given) => new HaltonSearch(name, ctx, options, given),
};
