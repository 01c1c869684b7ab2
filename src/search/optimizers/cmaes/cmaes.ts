/**
 * CMA-ES with IPOP restarts (Auger and Hansen, CEC 2005): when a run meets a stop criterion
 * (termination.ts) a new run starts from a uniform random mean with the population size multiplied
 * by `incPopSize`. Bounds are handled by the box transformation of boundTransform.ts.
 */
import type { Told } from '../../core/base.js';
import { compareSingle } from '../../core/compare.js';
import type { Family } from '../../core/family.js';
import { GenerationalOptimizer } from '../../core/generational.js';
import { f64Rows } from '../../core/state.js';
import type { OptimizerContext } from '../../core/types.js';
import type { ResolvedOptions } from '../../options.js';
import { boxTransform } from './boundTransform.js';
import { CmaState } from './cmaState.js';
import { cmaParams, defaultPopulation } from './params.js';
import { historyLength, stopReason } from './termination.js';

/**
 * Generations between eigendecompositions: 4 / ((c1 + cmu) n). The tutorial's lazy update uses
 * 0.1 / (...) and pycma 0.5 / (...) (from memory); C changes by a fraction ~ (c1 + cmu) per generation,
 * so B and D lag by at most ~4/n of it. Measured on the 30-D separable ellipsoid and Rosenbrock
 * (8 seeds): 5 % more evaluations to 1e-8 than with a gap of 1 (gap 18 against 1), while the
 * decomposition (ml-matrix, ~0.4 ms for 30 x 30) costs 1.5 us per candidate instead of 28 us.
 */
export function defaultEigenGap(c1PlusCmu: number, n: number): number {
  return Math.max(1, Math.floor(4 / (c1PlusCmu * n)));
}

class Cmaes extends GenerationalOptimizer {
  readonly family = 'cmaes';
  private run: CmaState;
  private steps: Float64Array[] = [];
  private history: number[] = [];
  private restarts = 0;
  private lastStop = 'none';
  private readonly lambda0: number;
  private readonly sigma0: number;
  private readonly z: Float64Array;

  constructor(name: string, ctx: OptimizerContext, options: ResolvedOptions, given: Record<string, unknown>) {
    super(name, ctx, options, given);
    const n = this.space.dim;
    const batch = Math.max(1, ctx.batch);
    const base = (options.popsize as number | undefined) ?? defaultPopulation(n);
    this.lambda0 = Math.ceil(base / batch) * batch;
    this.sigma0 = options.sigma0 as number;
    this.z = new Float64Array(n);
    const mean = new Float64Array(n);
    this.space.startInto(this.rng, mean);
    this.run = this.newRun(mean, this.lambda0);
  }

  private newRun(mean: Float64Array, lambda: number): CmaState {
    const n = this.space.dim;
    const p = cmaParams(n, lambda);
    const gap = (this.options.eigenGap as number | undefined) ?? defaultEigenGap(p.c1 + p.cmu, n);
    return new CmaState(n, lambda, mean, this.sigma0, gap);
  }

  protected nextGeneration(): Float64Array[] {
    const { run } = this;
    const dim = this.space.dim;
    const lambda = run.p.lambda;
    // The step buffers of the last generation are free again (its update is done): reuse them.
    if (this.steps.length !== lambda) this.steps = Array.from({ length: lambda }, () => new Float64Array(dim));
    const xs: Float64Array[] = new Array(lambda);
    const { mean, sigma } = run;
    const block = new Float64Array(lambda * dim); // one allocation for the generation's points
    for (let k = 0; k < lambda; k++) {
      const y = this.steps[k];
      run.sampleStep(this.rng, y, this.z);
      const x = block.subarray(k * dim, (k + 1) * dim);
      for (let i = 0; i < dim; i++) x[i] = boxTransform(mean[i] + sigma * y[i]);
      xs[k] = x;
    }
    return xs;
  }

  protected finishGeneration(scored: Told[]): void {
    const order = scored.map((_, i) => i).sort((a, b) => compareSingle(scored[a], scored[b]));
    const { run } = this;
    const flatAt = Math.min(run.p.lambda - 1, Math.ceil(0.7 * run.p.lambda) - 1);
    const flat = compareSingle(scored[order[0]], scored[order[flatAt]]) === 0;
    this.history.push(scored[order[0]].f[0]);
    if (this.history.length > historyLength(run.n, run.p.lambda)) this.history.shift();
    run.update(order.slice(0, run.p.mu).map((k) => this.steps[k]));
    // Flat fitness: most of the population scored the same, so the ranking says nothing; widen.
    if (flat) run.sigma *= Math.exp(0.2 + run.p.cs / run.p.ds);
    const tolX = (this.options.tolX as number | undefined) ?? 1e-11 * this.sigma0;
    const stop = stopReason(run, this.history, scored.map((t) => t.f[0]), { tolFun: this.options.tolFun as number, tolX });
    if (stop && this.restarts < (this.options.restarts as number)) {
      this.lastStop = stop;
      this.restarts++;
      const lambda = Math.round(this.lambda0 * Math.pow(this.options.incPopSize as number, this.restarts));
      const mean = new Float64Array(this.space.dim);
      this.space.sampleInto(this.rng, mean);
      this.run = this.newRun(mean, lambda);
      this.history = [];
    }
  }

  protected override detail(): Record<string, number | string> {
    return {
      generation: this.generations,
      restarts: this.restarts,
      popsize: this.run.p.lambda,
      sigma: this.run.sigma,
      condition: this.run.condition(),
      lastStop: this.lastStop,
    };
  }

  protected saveFamily(): unknown {
    return { run: this.run.save(), steps: this.steps, history: this.history, restarts: this.restarts, lastStop: this.lastStop };
  }

  protected loadFamily(data: unknown): void {
    const d = data as Record<string, unknown>;
    this.run = CmaState.load(this.space.dim, d.run);
    this.steps = f64Rows(d.steps, 'steps');
    this.history = [...(d.history as number[])];
    this.restarts = d.restarts as number;
    this.lastStop = d.lastStop as string;
  }
}

export const cmaesFamily: Family = {
  family: 'cmaes',
  description: 'CMA-ES (Hansen 2016) with IPOP restarts (Auger and Hansen 2005); the default for real variables',
  multiObjective: false,
  options: {
    popsize: {
      type: 'integer',
      min: 2,
      defaultText: '4 + floor(3 ln n), rounded up to a multiple of the batch size',
      description: 'population size lambda of the first run',
    },
    sigma0: { type: 'number', default: 0.25, min: 0, minExclusive: true, description: 'initial step size, in box widths' },
    restarts: { type: 'integer', default: 20, min: 0, description: 'how many IPOP restarts are allowed' },
    incPopSize: { type: 'number', default: 2, min: 1, description: 'population growth factor at each restart' },
    tolFun: { type: 'number', default: 1e-12, min: 0, description: 'restart when recent objective values span less than this' },
    tolX: { type: 'number', min: 0, defaultText: '1e-11 * sigma0', description: 'restart when the search spread is below this in every coordinate' },
    eigenGap: {
      type: 'integer',
      min: 1,
      defaultText: 'max(1, floor(4 / ((c1 + cmu) n)))',
      description: 'generations between eigendecompositions of C',
    },
  },
  create: (name, ctx, options, given) => new Cmaes(name, ctx, options, given),
};
