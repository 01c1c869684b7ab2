import { InputError } from '../errors.js';
import { matVec } from './linalg/dense.js';
import { expm } from './linalg/expm.js';
import type { LinearModel } from './models/common.js';

/** Population traces: per time, the population of every site, of the sink(s) and of the loss channel. */
export interface PopulationTraces {
  readonly times: readonly number[];
  /** sites[t][m]: population of site m at times[t]. */
  readonly sites: readonly (readonly number[])[];
  readonly sink: readonly number[];
  readonly lost: readonly number[];
  /** Trace of the excitonic density matrix at each time (1 - sink - lost). */
  readonly trace: readonly number[];
}

/** Largest generator dimension propagated densely (a 33-site array for the coherent models). */
export const MAX_PROPAGATION_DIM = 1200;

/**
 * Exact propagation by the matrix exponential of the generator augmented with the sink and loss
 * channels (which integrate the readouts): v(t + dt) = exp(G_aug dt) v(t). One exponential per distinct
 * time step; times must be non-decreasing and start at or after 0.
 */
export function propagate(m: LinearModel, times: readonly number[]): PopulationTraces {
  const D = m.dim;
  if (D > MAX_PROPAGATION_DIM) {
    throw new InputError(`population traces are computed for up to ${MAX_PROPAGATION_DIM} unknowns; this array needs ${D}`);
  }
  times.forEach((t, i) => {
    if (!Number.isFinite(t) || t < 0 || (i > 0 && t < times[i - 1])) throw new InputError('times must be finite, non-negative and non-decreasing');
  });
  const A = D + 2;
  const G = new Float64Array(A * A);
  for (let i = 0; i < D; i++) for (let j = 0; j < D; j++) G[i * A + j] = m.generator[i * D + j];
  for (let j = 0; j < D; j++) { G[D * A + j] = m.trapReadout[j]; G[(D + 1) * A + j] = m.lossReadout[j]; }
  let v: Float64Array = new Float64Array(A);
  v.set(m.initial);
  const cache = new Map<number, Float64Array>();
  const step = (dt: number) => {
    const key = Number(dt.toPrecision(12));
    let E = cache.get(key);
    if (!E) {
      E = expm(G.map((g) => g * dt), A);
      cache.set(key, E);
    }
    return E;
  };
  const out = { times: [...times], sites: [] as number[][], sink: [] as number[], lost: [] as number[], trace: [] as number[] };
  let tPrev = 0;
  for (const t of times) {
    if (t > tPrev) v = matVec(step(t - tPrev), v, A);
    tPrev = t;
    const pops = m.populationReadout.map((r) => { let s = 0; for (let j = 0; j < D; j++) s += r[j] * v[j]; return s; });
    out.sites.push(pops);
    out.sink.push(v[D]);
    out.lost.push(v[D + 1]);
    out.trace.push(pops.reduce((s, p) => s + p, 0));
  }
  return out;
}
