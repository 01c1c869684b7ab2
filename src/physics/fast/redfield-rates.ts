import { CM_TO_RAD_PER_PS } from '../constants.js';
import type { Excitons } from '../excitons.js';
import { Workspace } from '../linalg/workspace.js';
import { drudeSpectrum } from '../models/bath.js';
import { smallestSpacing } from '../models/redfield.js';

/**
 * Elements of the secular Bloch-Redfield tensor in the exciton basis, computed one at a time in O(N) each
 * after O(N^3) set-up, with the formula and units of models/redfield.ts (redfieldTensor):
 *   R_abcd = 1/2 W_acdb [S(w_ca) + S(w_db)] - 1/2 delta_bd T_ac - 1/2 delta_ac T_bd,
 *   W_acdb = sum_m lambda_m c_ma c_mc c_md c_mb,  T_xy = sum_k W_xkky S(w_yk) = sum_m lambda_m c_mx c_my Q_my,
 *   Q_my = sum_k c_mk^2 S(w_yk)  (the k-sum done once, so that any T_xy costs O(N)).
 * S is per unit reorganization energy, in ps^-1. The arrays behind a result live in module-level scratch (one set
 * per thread): a result is valid until the next call.
 */
export interface RedfieldRates {
  readonly n: number;
  /** Exciton energies, cm^-1 (ascending). */
  readonly energies: Float64Array;
  /** Secular threshold, cm^-1: couplings between coherences whose Bohr frequencies differ by less are kept. */
  readonly secular: number;
  /** R_abcd, ps^-1. */
  element(a: number, b: number, c: number, d: number): number;
  /** Whether the secular tensor keeps R_abcd (models/redfield.ts's rule). */
  kept(a: number, b: number, c: number, d: number): boolean;
}

const scratch = new Workspace();

class Rates implements RedfieldRates {
  constructor(
    readonly n: number,
    readonly energies: Float64Array,
    readonly secular: number,
    private readonly S: Float64Array,
    private readonly Ct: Float64Array,
    private readonly Lt: Float64Array,
    private readonly QLt: Float64Array,
  ) {}

  /** T_xy = sum_m (lambda_m c_mx) c_my Q_my. */
  private T(x: number, y: number): number {
    const { n, Ct, QLt } = this;
    const ox = x * n, oy = y * n;
    let s = 0;
    for (let m = 0; m < n; m++) s += Ct[ox + m] * QLt[oy + m];
    return s;
  }

  /** W_acdb = sum_m (lambda_m c_ma) c_mc c_md c_mb. */
  private W4(a: number, c: number, d: number, b: number): number {
    const { n, Ct, Lt } = this;
    const oa = a * n, oc = c * n, od = d * n, ob = b * n;
    let s = 0;
    for (let m = 0; m < n; m++) s += Lt[oa + m] * Ct[oc + m] * Ct[od + m] * Ct[ob + m];
    return s;
  }

  element(a: number, b: number, c: number, d: number): number {
    const { n, S } = this;
    let r = 0.5 * this.W4(a, c, d, b) * (S[c * n + a] + S[d * n + b]);
    if (b === d) r -= 0.5 * this.T(a, c);
    if (a === c) r -= 0.5 * this.T(b, d);
    return r;
  }

  kept(a: number, b: number, c: number, d: number): boolean {
    const E = this.energies;
    return (a === b && c === d) || (a === c && b === d) || Math.abs(E[a] - E[b] - (E[c] - E[d])) < this.secular;
  }
}

export function redfieldRates(ex: Excitons, reorganization: Float64Array, temperature: number, cutoff: number, secularFraction: number): RedfieldRates {
  const { n, energies: E, coefficients: C } = ex;
  const len = n * n;
  const sec = secularFraction * smallestSpacing(E);
  const S = scratch.f64('S', len);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) S[i * n + j] = drudeSpectrum(E[i] - E[j], cutoff, temperature) * CM_TO_RAD_PER_PS;
  // Q_my = sum_k c_mk^2 S_yk
  const Q = scratch.f64('Q', len);
  for (let m = 0; m < n; m++) {
    const rm = m * n;
    for (let y = 0; y < n; y++) {
      let s = 0;
      const ry = y * n;
      for (let k = 0; k < n; k++) s += C[rm + k] * C[rm + k] * S[ry + k];
      Q[rm + y] = s;
    }
  }
  // columns of C as contiguous rows (Ct[a][m] = c_ma) and lambda_m c_ma, so that the O(N) sums run along memory
  const Ct = scratch.f64('Ct', len), Lt = scratch.f64('Lt', len), QLt = scratch.f64('QLt', len);
  for (let m = 0; m < n; m++) for (let a = 0; a < n; a++) {
    Ct[a * n + m] = C[m * n + a];
    Lt[a * n + m] = reorganization[m] * C[m * n + a];
    QLt[a * n + m] = reorganization[m] * C[m * n + a] * Q[m * n + a];
  }
  return new Rates(n, E, sec, S, Ct, Lt, QLt);
}
