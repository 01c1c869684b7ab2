import { NumericalError } from '../../errors.js';
import { CM_TO_RAD_PER_PS } from '../constants.js';
import type { ComplexMatrix } from '../linalg/complex-dense.js';
import { complexLuFactor, complexLuInverse } from '../linalg/complex-lu.js';
import { STRUCTURED_UNAVAILABLE } from './structured-errors.js';
import type { RedfieldRates } from './redfield-rates.js';

/**
 * The part of the secular Redfield generator that does not mix exciton elements across Bohr frequencies:
 *   D(X)_ab = -i w_ab X_ab - kappa X_ab + sum_cd R_abcd X_cd   (R restricted to the kept, secular entries),
 * with a uniform sink kappa. The secular rule couples element ab only to elements cd with |w_ab - w_cd| below
 * the secular threshold (and populations to populations), so D is block diagonal over clusters of Bohr
 * frequencies: sorted by w_ab, consecutive elements closer than the threshold share a block, and all
 * populations share one. 1 x 1 blocks keep their reciprocal, larger ones their explicit inverse (the
 * population block is N x N), so that D^-1 of a matrix with a few non-zero entries costs only the blocks
 * those entries touch.
 */
export interface SecularBlocks {
  readonly n: number;
  /** Elements (a * n + b) grouped by block: block k is members[start[k]..start[k+1]). */
  readonly members: Int32Array;
  readonly start: Int32Array;
  /** Block of each element and its position in the block. */
  readonly blockOf: Int32Array;
  readonly position: Int32Array;
  /** Reciprocal of the diagonal of D for elements in 1 x 1 blocks (re, im). */
  readonly invRe: Float64Array;
  readonly invIm: Float64Array;
  /** Explicit inverses (row-major) of the larger blocks, by block index. */
  readonly inverses: (ComplexMatrix | undefined)[];
  /** Every kept off-diagonal coupling, for the residual: target element, source element, R value. */
  readonly couplings: { readonly to: Int32Array; readonly from: Int32Array; readonly value: Float64Array };
  /** Diagonal of D by element (re, im). */
  readonly diagRe: Float64Array;
  readonly diagIm: Float64Array;
}

export function secularBlocks(rates: RedfieldRates, kappa: number): SecularBlocks {
  const { n, energies: E, secular } = rates;
  const len = n * n;
  // order elements by Bohr frequency, populations first among equal frequencies
  const w = new Float64Array(len), pop = new Uint8Array(len);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) { w[a * n + b] = E[a] - E[b]; pop[a * n + b] = a === b ? 1 : 0; }
  const members = Int32Array.from({ length: len }, (_, e) => e);
  members.sort((x, y) => w[x] - w[y] || pop[y] - pop[x] || x - y);
  const startList: number[] = [0];
  for (let t = 1; t < len; t++) {
    const p = members[t - 1], q = members[t];
    if (!(w[q] - w[p] < secular || (pop[p] === 1 && pop[q] === 1))) startList.push(t);
  }
  startList.push(len);
  const start = Int32Array.from(startList);
  const blockOf = new Int32Array(len), position = new Int32Array(len);
  const invRe = new Float64Array(len), invIm = new Float64Array(len);
  const diagRe = new Float64Array(len), diagIm = new Float64Array(len);
  const inverses: (ComplexMatrix | undefined)[] = [];
  const to: number[] = [], from: number[] = [], value: number[] = [];
  for (let k = 0; k + 1 < start.length; k++) {
    const lo = start[k], s = start[k + 1] - lo;
    for (let i = 0; i < s; i++) { blockOf[members[lo + i]] = k; position[members[lo + i]] = i; }
    if (s === 1) {
      const e = members[lo], a = (e / n) | 0, b = e % n;
      const dr = rates.element(a, b, a, b) - kappa, di = -w[e] * CM_TO_RAD_PER_PS;
      diagRe[e] = dr; diagIm[e] = di;
      const m = dr * dr + di * di;
      if (!(m > 0)) throw new NumericalError('a secular Redfield element neither decays nor oscillates', STRUCTURED_UNAVAILABLE);
      invRe[e] = dr / m;
      invIm[e] = -di / m;
      inverses.push(undefined);
      continue;
    }
    const block: ComplexMatrix = { n: s, re: new Float64Array(s * s), im: new Float64Array(s * s) };
    for (let i = 0; i < s; i++) {
      const ei = members[lo + i], a = (ei / n) | 0, b = ei % n;
      for (let j = 0; j < s; j++) {
        const ej = members[lo + j], c = (ej / n) | 0, d = ej % n;
        if (!rates.kept(a, b, c, d)) continue;
        const r = rates.element(a, b, c, d);
        block.re[i * s + j] += r;
        if (i !== j && r !== 0) { to.push(ei); from.push(ej); value.push(r); }
      }
      block.re[i * s + i] -= kappa;
      block.im[i * s + i] -= w[ei] * CM_TO_RAD_PER_PS;
      diagRe[ei] = block.re[i * s + i];
      diagIm[ei] = block.im[i * s + i];
    }
    try {
      inverses.push(complexLuInverse(complexLuFactor(block)));
    } catch {
      throw new NumericalError(`a secular block of ${s} exciton elements is singular`, STRUCTURED_UNAVAILABLE);
    }
  }
  return {
    n, members, start, blockOf, position, invRe, invIm, inverses, diagRe, diagIm,
    couplings: { to: Int32Array.from(to), from: Int32Array.from(from), value: Float64Array.from(value) },
  };
}

/** Y = D^-1 X for a complex N x N matrix X (split re, im, row-major), into (yr, yi). */
export function applyInverse(D: SecularBlocks, xr: Float64Array, xi: Float64Array, yr: Float64Array, yi: Float64Array): void {
  const { members, start, invRe, invIm, inverses } = D;
  for (let k = 0; k + 1 < start.length; k++) {
    const lo = start[k], s = start[k + 1] - lo;
    if (s === 1) {
      const e = members[lo], ar = xr[e], ai = xi[e], br = invRe[e], bi = invIm[e];
      yr[e] = ar * br - ai * bi;
      yi[e] = ar * bi + ai * br;
      continue;
    }
    const inv = inverses[k]!;
    for (let i = 0; i < s; i++) {
      let sr = 0, si = 0;
      const ri = i * s;
      for (let j = 0; j < s; j++) {
        const e = members[lo + j], ar = inv.re[ri + j], ai = inv.im[ri + j], br = xr[e], bi = xi[e];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      yr[members[lo + i]] = sr;
      yi[members[lo + i]] = si;
    }
  }
}

/**
 * D^-1 of a matrix whose non-zero entries are `count` (element, re, im) triples, accumulated into the dense
 * (yr, yi), which must be zero on entry; the elements written are appended to `touched` (duplicates allowed).
 * Costs the sizes of the blocks the entries fall in.
 */
export function applyInverseSparse(D: SecularBlocks, el: Int32Array, vr: Float64Array, vi: Float64Array, count: number, yr: Float64Array, yi: Float64Array, touched: number[]): void {
  const { members, start, blockOf, position, invRe, invIm, inverses } = D;
  for (let t = 0; t < count; t++) {
    const e = el[t], ar = vr[t], ai = vi[t];
    const k = blockOf[e], lo = start[k], s = start[k + 1] - lo;
    if (s === 1) {
      const br = invRe[e], bi = invIm[e];
      yr[e] += ar * br - ai * bi;
      yi[e] += ar * bi + ai * br;
      touched.push(e);
      continue;
    }
    const inv = inverses[k]!, j = position[e];
    for (let i = 0; i < s; i++) {
      const br = inv.re[i * s + j], bi = inv.im[i * s + j], f = members[lo + i];
      yr[f] += ar * br - ai * bi;
      yi[f] += ar * bi + ai * br;
      touched.push(f);
    }
  }
}
