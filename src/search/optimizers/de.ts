/**
 * Differential evolution (Storn and Price, "Differential evolution - a simple and efficient heuristic
 * for global optimization over continuous spaces", J. Global Optim. 11, 1997), generational form:
 *   rand/1:            v = x_r1 + F (x_r2 - x_r3)
 *   current-to-best/1: v = x_i + F (x_best - x_i) + F (x_r1 - x_r2)
 * then binomial crossover with the target x_i (rate CR, one forced unit) and one-to-one selection
 * (the trial replaces its target when it is not worse, Deb's rules for constraints).
 * Coordinates leaving [0, 1] bounce back between the target value and the bound (common practice).
 * Categorical blocks have their own mutation, since a difference of choices has no meaning: where the
 * two difference members disagree, the block takes a uniformly random option with probability F,
 * otherwise the base member's option (rand/1); current-to-best/1 also moves to the best member's
 * option with probability F. A categorical block is one unit of the crossover.
 */
import type { Told } from '../core/base.js';
import { compareSingle } from '../core/compare.js';
import { loadEvaluated, plain, saveEvaluated } from '../core/evaluated.js';
import type { Family } from '../core/family.js';
import { GenerationalOptimizer } from '../core/generational.js';
import type { Evaluated, OptimizerContext } from '../core/types.js';
import type { ResolvedOptions } from '../options.js';

/** A crossover unit: one real coordinate (block -1) or one categorical block. */
interface Unit {
  offset: number;
  width: number;
  block: number;
}

class DifferentialEvolution extends GenerationalOptimizer {
  readonly family = 'de';
  private population: Evaluated[] | null = null;
  private readonly np: number;
  private readonly units: Unit[];

  constructor(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>) {
    super(name, ctx, options, given);
    const batch = Math.max(1, ctx.batch);
    const base = (options.popsize as number | undefined) ?? Math.max(20, 10 * this.space.dim);
    this.np = Math.ceil(base / batch) * batch;
    this.units = [];
    const blocks = this.space.categorical;
    let b = 0;
    for (let j = 0; j < this.space.dim; ) {
      if (b < blocks.length && blocks[b].offset === j) {
        this.units.push({ offset: j, width: blocks[b].width, block: b });
        j += blocks[b].width;
        b++;
      } else {
        this.units.push({ offset: j, width: 1, block: -1 });
        j++;
      }
    }
  }

  protected nextGeneration(): Float64Array[] {
    return this.population ? this.trials() : this.initialPoints(this.np);
  }

  /** `count` distinct indices of the population, all different from `avoid`. */
  private pick(count: number, avoid: number): number[] {
    const out: number[] = [];
    while (out.length < count) {
      const r = this.rng.int(this.np);
      if (r !== avoid && !out.includes(r)) out.push(r);
    }
    return out;
  }

  private trials(): Float64Array[] {
    const pop = this.population!;
    const F = this.options.F as number;
    const CR = this.options.CR as number;
    const toBest = this.options.strategy === 'current-to-best1';
    let bestIndex = 0;
    for (let i = 1; i < pop.length; i++) if (compareSingle(pop[i], pop[bestIndex]) < 0) bestIndex = i;
    const best = pop[bestIndex].x;
    return pop.map((target, i) => {
      const t = target.x;
      const [r1, r2, r3] = this.pick(toBest ? 2 : 3, i);
      const forced = this.rng.int(this.units.length);
      const trial = t.slice();
      this.units.forEach((u, k) => {
        if (k !== forced && !(this.rng.uniform() < CR)) return;
        if (u.block >= 0) {
          this.mutateBlock(trial, u.block, toBest ? [i, r1, r2, bestIndex] : [r1, r2, r3, -1], F);
          return;
        }
        const j = u.offset;
        let v = toBest ? t[j] + F * (best[j] - t[j]) + F * (pop[r1].x[j] - pop[r2].x[j]) : pop[r1].x[j] + F * (pop[r2].x[j] - pop[r3].x[j]);
        if (v < 0) v = this.rng.uniform() * t[j];
        else if (v > 1) v = t[j] + this.rng.uniform() * (1 - t[j]);
        trial[j] = v;
      });
      return trial;
    });
  }

  /** Categorical mutation of block `block`: members [base, diffA, diffB, best or -1]. */
  private mutateBlock(trial: Float64Array, block: number, members: number[], F: number): void {
    const pop = this.population!;
    const [base, a, b, best] = members;
    const cat = (m: number) => this.space.categoryOf(pop[m].x, block);
    let choice = cat(base);
    if (best >= 0 && this.rng.uniform() < F) choice = cat(best);
    if (cat(a) !== cat(b) && this.rng.uniform() < F) choice = this.rng.int(this.space.categorical[block].width);
    this.space.setCategory(trial, block, choice);
  }

  protected finishGeneration(scored: Told[]): void {
    if (!this.population) {
      this.population = scored.map(plain);
      return;
    }
    const pop = this.population;
    scored.forEach((trial, i) => {
      if (compareSingle(trial, pop[i]) <= 0) pop[i] = plain(trial);
    });
  }

  protected override detail(): Record<string, number | string> {
    return { generation: this.generations, popsize: this.np, strategy: this.options.strategy as string };
  }

  protected saveFamily(): unknown {
    return { population: this.population ? this.population.map(saveEvaluated) : null };
  }

  protected loadFamily(data: unknown): void {
    const d = data as { population: unknown[] | null };
    this.population = d.population ? d.population.map(loadEvaluated) : null;
  }
}

export const deFamily: Family = {
  family: 'de',
  description: 'differential evolution (Storn and Price 1997); robust on multimodal and mixed problems',
  multiObjective: false,
  options: {
    strategy: { type: 'string', default: 'rand1bin', choices: ['rand1bin', 'current-to-best1'], description: 'mutation strategy' },
    popsize: { type: 'integer', min: 4, defaultText: 'max(20, 10 n), rounded up to a multiple of the batch size', description: 'population size NP' },
    F: { type: 'number', default: 0.5, min: 0, max: 2, description: 'differential weight (common practice value)' },
    CR: { type: 'number', default: 0.9, min: 0, max: 1, description: 'crossover rate (common practice value)' },
  },
  create: (name, ctx, options, given) => new DifferentialEvolution(name, ctx, options, given),
};
