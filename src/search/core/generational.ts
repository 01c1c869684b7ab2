/**
 * Base of the population methods (CMA-ES, DE, NSGA-II, (1+1)-ES): candidates come in generations,
 * handed out in slot order in batches of any size; when every slot has its score the family updates
 * itself from the scored generation (in slot order, so batching never changes the result).
 */
import { BaseOptimizer, type Proposal, type Told } from './base.js';
import { Generation } from './generation.js';

export abstract class GenerationalOptimizer extends BaseOptimizer {
  private current: Generation | null = null;
  /** Completed generations. */
  protected generations = 0;

  /** The candidates of the next generation (standardized points). */
  protected abstract nextGeneration(): Float64Array[];
  /** Updates the family's state from a fully scored generation, in slot order. */
  protected abstract finishGeneration(scored: Told[]): void;
  protected abstract saveFamily(): unknown;
  protected abstract loadFamily(data: unknown): void;

  protected propose(n: number): Proposal[] {
    if (!this.current) this.current = new Generation(this.nextGeneration());
    return this.current.take(n);
  }

  protected absorb(results: Told[]): void {
    const g = this.current!;
    for (const t of results) g.put(t);
    if (!g.complete) return;
    this.current = null;
    this.generations++;
    this.finishGeneration(g.scored());
  }

  /** `size` starting points: the space's start point first, uniform random ones after it. */
  protected initialPoints(size: number): Float64Array[] {
    return Array.from({ length: size }, (_, i) => {
      const x = new Float64Array(this.space.dim);
      if (i === 0) this.space.startInto(this.rng, x);
      else this.space.sampleInto(this.rng, x);
      return x;
    });
  }

  protected saveSearch(): unknown {
    return { generation: this.current ? this.current.save() : null, generations: this.generations, family: this.saveFamily() };
  }

  protected loadSearch(data: unknown): void {
    const d = data as { generation: unknown; generations: number; family: unknown };
    this.current = d.generation ? Generation.load(d.generation) : null;
    this.generations = d.generations;
    this.loadFamily(d.family);
  }
}
