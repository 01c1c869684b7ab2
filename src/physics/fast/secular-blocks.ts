import { NumericalError } from '../../errors.js';
import { CM_TO_RAD_PER_PS } from '../constants.js';
import { complexLuFactorInPlace, complexLuInverseInto } from '../linalg/complex-lu.js';
import { Workspace } from '../linalg/workspace.js';
import { STRUCTURED_UNAVAILABLE } from './structured-errors.js';
import type { RedfieldRates } from './redfield-rates.js';

/**
 * The part of the secular Redfield generator that does not mix exciton elements across Bohr frequencies:
 *   D(X)_ab = -i w_ab X_ab - kappa X_ab + sum_cd R_abcd X_cd   (R restricted to the kept, secular entries),
 * with a uniform sink kappa. The secular rule couples element ab only to elements cd with |w_ab - w_cd| below
 * the secular threshold (and populations to populations), so D is block diagonal over clusters of Bohr
 * frequencies: sorted by w_ab, consecutive elements closer than the threshold share a block, and all
 * populations share one. 1 x 1 blocks keep their reciprocal, larger ones their explicit inverse (the
 * population block is N x N), so that D^-1 of a matrix costs O(N^2) plus the squares of the larger blocks. D maps Hermitian matrices to Hermitian ones (R_abcd = R_badc, w_ab = -w_ba), so
 * D^-1(X^H) = D^-1(X)^H.
 * The arrays live in module-level scratch (one set per thread): a result is valid until the next call.
 */
export interface SecularBlocks {
  readonly n: number;
  /** Number of blocks. */
  readonly blocks: number;
  /** Elements (a * n + b) grouped by block: block k is members[start[k]..start[k+1]). */
  readonly members: Int32Array;
  readonly start: Int32Array;
  /** Reciprocal of the diagonal of D for elements in 1 x 1 blocks (re, im). */
  readonly invRe: Float64Array;
  readonly invIm: Float64Array;
  /** Explicit inverses (row-major) of the larger blocks, packed: block k's s x s inverse starts at invAt[k]. */
  readonly packRe: Float64Array;
  readonly packIm: Float64Array;
  readonly invAt: Int32Array;
  /** Every kept off-diagonal coupling, for the residual: target element, source element, R value (first `count`). */
  readonly couplings: { readonly count: number; readonly to: Int32Array; readonly from: Int32Array; readonly value: Float64Array };
  /** Diagonal of D by element (re, im). */
  readonly diagRe: Float64Array;
  readonly diagIm: Float64Array;
}

const scratch = new Workspace();
let sortW = new Float64Array(0);
let sortPop = new Uint8Array(0);
/**
 * Bohr frequency, then populations first, then element index: a total order. It returns small integers only
 * (a difference of frequencies would be a fresh heap number on every comparison).
 */
const byFrequency = (x: number, y: number) => {
  const a = sortW[x], b = sortW[y];
  if (a !== b) return a < b ? -1 : 1;
  return sortPop[y] - sortPop[x] || x - y;
};

export function secularBlocks(rates: RedfieldRates, kappa: number): SecularBlocks {
  const { n, energies: E, secular } = rates;
  const len = n * n;
  // order elements by Bohr frequency, populations first among equal frequencies
  const w = scratch.f64('w', len);
  if (sortPop.length < len) sortPop = new Uint8Array(Math.max(len, 2 * sortPop.length));
  const pop = sortPop;
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) { w[a * n + b] = E[a] - E[b]; pop[a * n + b] = a === b ? 1 : 0; }
  sortW = w;
  const members = scratch.i32('members', len).subarray(0, len);
  for (let e = 0; e < len; e++) members[e] = e;
  members.sort(byFrequency);
  const start = scratch.i32('start', len + 1);
  let blocks = 0;
  start[0] = 0;
  for (let t = 1; t < len; t++) {
    const p = members[t - 1], q = members[t];
    if (!(w[q] - w[p] < secular || (pop[p] === 1 && pop[q] === 1))) start[++blocks] = t;
  }
  start[++blocks] = len;
  const invAt = scratch.i32('invAt', blocks);
  let packed = 0;
  for (let k = 0; k < blocks; k++) {
    const s = start[k + 1] - start[k];
    invAt[k] = packed;
    if (s > 1) packed += s * s;
  }
  const invRe = scratch.zeros('invRe', len), invIm = scratch.zeros('invIm', len);
  const diagRe = scratch.f64('diagRe', len), diagIm = scratch.f64('diagIm', len);
  const packRe = scratch.f64('packRe', packed), packIm = scratch.f64('packIm', packed);
  // at most s (s - 1) couplings per block
  const to = scratch.i32('to', packed), from = scratch.i32('from', packed), value = scratch.f64('value', packed);
  let count = 0;
  for (let k = 0; k < blocks; k++) {
    const lo = start[k], s = start[k + 1] - lo;
    if (s === 1) {
      const e = members[lo], a = (e / n) | 0, b = e % n;
      const dr = rates.element(a, b, a, b) - kappa, di = -w[e] * CM_TO_RAD_PER_PS;
      diagRe[e] = dr; diagIm[e] = di;
      const m = dr * dr + di * di;
      if (!(m > 0)) throw new NumericalError('a secular Redfield element neither decays nor oscillates', STRUCTURED_UNAVAILABLE);
      invRe[e] = dr / m;
      invIm[e] = -di / m;
      continue;
    }
    const ss = s * s;
    const re = scratch.zeros('blockRe', ss), im = scratch.zeros('blockIm', ss);
    for (let i = 0; i < s; i++) {
      const ei = members[lo + i], a = (ei / n) | 0, b = ei % n;
      for (let j = 0; j < s; j++) {
        const ej = members[lo + j], c = (ej / n) | 0, d = ej % n;
        if (!rates.kept(a, b, c, d)) continue;
        const r = rates.element(a, b, c, d);
        re[i * s + j] += r;
        if (i !== j && r !== 0) { to[count] = ei; from[count] = ej; value[count] = r; count++; }
      }
      re[i * s + i] -= kappa;
      im[i * s + i] -= w[ei] * CM_TO_RAD_PER_PS;
      diagRe[ei] = re[i * s + i];
      diagIm[ei] = im[i * s + i];
    }
    const at = invAt[k], pivots = scratch.i32('pivots', s);
    try {
      complexLuFactorInPlace(s, re, im, pivots);
    } catch {
      throw new NumericalError(`a secular block of ${s} exciton elements is singular`, STRUCTURED_UNAVAILABLE);
    }
    complexLuInverseInto(s, re, im, pivots, packRe.subarray(at, at + ss), packIm.subarray(at, at + ss));
  }
  return { n, blocks, members, start, invRe, invIm, packRe, packIm, invAt, diagRe, diagIm, couplings: { count, to, from, value } };
}

/** Y = D^-1 X for a complex N x N matrix X (split re, im, row-major), into (yr, yi). */
export function applyInverse(D: SecularBlocks, xr: Float64Array, xi: Float64Array, yr: Float64Array, yi: Float64Array): void {
  const { members, start, invRe, invIm, packRe, packIm, invAt, blocks } = D;
  for (let k = 0; k < blocks; k++) {
    const lo = start[k], s = start[k + 1] - lo;
    if (s === 1) {
      const e = members[lo], ar = xr[e], ai = xi[e], br = invRe[e], bi = invIm[e];
      yr[e] = ar * br - ai * bi;
      yi[e] = ar * bi + ai * br;
      continue;
    }
    const at = invAt[k];
    for (let i = 0; i < s; i++) {
      let sr = 0, si = 0;
      const ri = at + i * s;
      for (let j = 0; j < s; j++) {
        const e = members[lo + j], ar = packRe[ri + j], ai = packIm[ri + j], br = xr[e], bi = xi[e];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      yr[members[lo + i]] = sr;
      yi[members[lo + i]] = si;
    }
  }
}
