/**
 * NSGA-II (Deb, Pratap, Agarwal and Meyarivan, "A fast and elitist multiobjective genetic algorithm:
 * NSGA-II", IEEE TEC 6(2), 2002): binary tournaments on (rank, crowding distance), SBX and polynomial
 * mutation, then elitist selection of the next population from parents and offspring by fast
 * non-dominated sorting and crowding distance. Constraints enter through constrained domination.
 * With one objective it reduces to an elitist genetic algorithm. The hypervolume of the archived
 * front is reported with every progress report.
 */
import type { Told } from '../../core/base.js';
import { dominates } from '../../core/compare.js';
import { loadEvaluated, plain, saveEvaluated } from '../../core/evaluated.js';
import type { Family } from '../../core/family.js';
import { GenerationalOptimizer } from '../../core/generational.js';
import type { Evaluated, OptimizerContext } from '../../core/types.js';
import { crowdingDistance } from '../../multi/crowding.js';
import { nondominatedSort } from '../../multi/nondominatedSort.js';
import type { ResolvedOptions } from '../../options.js';
import { vary, type VariationSettings } from './variation.js';

interface Member {
  e: Evaluated;
  rank: number;
  crowding: number;
}

/** Selects `size` members out of `pool` by front, then by crowding distance within the last front. */
export function environmentalSelection(pool: Evaluated[], size: number): Member[] {
  const fronts = nondominatedSort(pool, dominates);
  const next: Member[] = [];
  for (let r = 0; r < fronts.length && next.length < size; r++) {
    const members = fronts[r].map((i) => pool[i]);
    const d = crowdingDistance(members.map((e) => e.f));
    const order = members.map((_, i) => i);
    if (next.length + members.length > size) order.sort((a, b) => d[b] - d[a] || a - b);
    for (const i of order) {
      if (next.length === size) break;
      next.push({ e: members[i], rank: r, crowding: d[i] });
    }
  }
  return next;
}

class Nsga2 extends GenerationalOptimizer {
  readonly family = 'nsga2';
  private population: Member[] | null = null;
  private readonly size: number;
  private readonly settings: VariationSettings;

  constructor(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>) {
    super(name, ctx, options, given);
    const batch = Math.max(1, ctx.batch);
    const step = batch % 2 === 0 ? batch : 2 * batch;
    this.size = Math.ceil((options.popsize as number) / step) * step;
    const units = this.space.dim - this.space.categorical.reduce((s, b) => s + b.width - 1, 0);
    this.settings = {
      crossoverRate: options.crossoverRate as number,
      etaC: options.etaC as number,
      etaM: options.etaM as number,
      mutationRate: (options.mutationRate as number | undefined) ?? 1 / units,
    };
  }

  protected nextGeneration(): Float64Array[] {
    return this.population ? this.offspring() : this.initialPoints(this.size);
  }

  /** Binary tournament on the crowded-comparison order. */
  private tournament(): Float64Array {
    const pop = this.population!;
    const a = pop[this.rng.int(pop.length)];
    const b = pop[this.rng.int(pop.length)];
    if (a.rank !== b.rank) return (a.rank < b.rank ? a : b).e.x;
    if (a.crowding !== b.crowding) return (a.crowding > b.crowding ? a : b).e.x;
    return (this.rng.uniform() < 0.5 ? a : b).e.x;
  }

  private offspring(): Float64Array[] {
    const out: Float64Array[] = [];
    while (out.length < this.size) {
      const [c1, c2] = vary(this.tournament(), this.tournament(), this.space, this.settings, this.rng);
      out.push(c1, c2);
    }
    return out.slice(0, this.size);
  }

  protected finishGeneration(told: Told[]): void {
    const scored: Evaluated[] = told.map(plain);
    const pool = this.population ? [...this.population.map((m) => m.e), ...scored] : scored;
    this.population = environmentalSelection(pool, this.size);
  }

  protected override detail(): Record<string, number | string> {
    return { generation: this.generations, popsize: this.size };
  }

  protected saveFamily(): unknown {
    return { population: this.population ? this.population.map((m) => ({ e: saveEvaluated(m.e), rank: m.rank, crowding: m.crowding })) : null };
  }

  protected loadFamily(data: unknown): void {
    const d = data as { population: { e: unknown; rank: number; crowding: number }[] | null };
    this.population = d.population ? d.population.map((m) => ({ e: loadEvaluated(m.e), rank: m.rank, crowding: m.crowding })) : null;
  }
}

export const nsga2Family: Family = {
  family: 'nsga2',
  description: 'NSGA-II (Deb et al. 2002) for several objectives; tracks the hypervolume of the front',
  multiObjective: true,
  options: {
    popsize: { type: 'integer', default: 100, min: 4, description: 'population size, rounded up to a multiple of the batch size (and even)' },
    crossoverRate: { type: 'number', default: 0.9, min: 0, max: 1, description: 'probability that a pair of parents is crossed (Deb et al. 2002)' },
    etaC: { type: 'number', default: 20, min: 0, description: 'distribution index of SBX (Deb et al. 2002)' },
    etaM: { type: 'number', default: 20, min: 0, description: 'distribution index of polynomial mutation (Deb et al. 2002)' },
    mutationRate: { type: 'number', min: 0, max: 1, defaultText: '1 / (number of real coordinates + categorical blocks)', description: 'mutation probability per unit' },
  },
  create: (name, ctx, options, given) => new Nsga2(name, ctx, options, given),
};
