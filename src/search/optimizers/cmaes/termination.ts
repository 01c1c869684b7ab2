/**
 * Restart criteria of one CMA-ES run, after Auger and Hansen, "A restart CMA evolution strategy with
 * increasing population size", CEC 2005, and the defaults of Hansen's reference code:
 *   tolfun      - the range of the best values of the last 10 + ceil(30 n / lambda) generations and of
 *                 all values of the current generation is below tolFun;
 *   tolx        - sigma p_c and sigma sqrt(C_ii) are below tolX in every coordinate;
 *   noeffectaxis - adding 0.1 sigma sqrt(d_i) b_i (i = generation mod n) leaves the mean unchanged;
 *   noeffectcoord - adding 0.2 sigma sqrt(C_ii) to any m_i leaves it unchanged;
 *   conditioncov - the condition number of C exceeds 1e14;
 *   sigma-too-large - the search spread is beyond 1e4 box widths (the genotype of the bounded box
 *                 transformation is periodic, so such a step size only means a lost run);
 *   broken      - C lost positive definiteness through rounding.
 */
import type { CmaState } from './cmaState.js';

export interface StopTolerances {
  tolFun: number;
  tolX: number;
}

export function historyLength(n: number, lambda: number): number {
  return 10 + Math.ceil((30 * n) / lambda);
}

export function stopReason(s: CmaState, history: readonly number[], values: readonly number[], tol: StopTolerances): string | null {
  const { n, mean, sigma, C, B, D, pc } = s;
  if (s.broken) return 'broken';
  if (history.length >= historyLength(n, s.p.lambda)) {
    let lo = Infinity;
    let hi = -Infinity;
    for (const v of history) {
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
    for (const v of values) {
      lo = Math.min(lo, v);
      hi = Math.max(hi, v);
    }
    if (hi - lo < tol.tolFun) return 'tolfun';
  }
  let small = true;
  for (let i = 0; i < n && small; i++) {
    if (!(sigma * Math.abs(pc[i]) < tol.tolX && sigma * Math.sqrt(C[i * n + i]) < tol.tolX)) small = false;
  }
  if (small) return 'tolx';
  const axis = s.generation % n;
  let moved = false;
  for (let i = 0; i < n && !moved; i++) {
    if (mean[i] + 0.1 * sigma * D[axis] * B[i * n + axis] !== mean[i]) moved = true;
  }
  if (!moved) return 'noeffectaxis';
  for (let i = 0; i < n; i++) {
    if (mean[i] + 0.2 * sigma * Math.sqrt(C[i * n + i]) === mean[i]) return 'noeffectcoord';
  }
  if (s.condition() > 1e14) return 'conditioncov';
  let dmax = 0;
  for (const d of D) dmax = Math.max(dmax, d);
  if (sigma * dmax > 1e4) return 'sigma-too-large';
  return null;
}
