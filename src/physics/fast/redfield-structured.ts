import type { Excitons } from '../excitons.js';
import { complexLuFactor, complexLuSolve } from '../linalg/complex-lu.js';
import { toExcitonBasis } from '../models/redfield.js';
import { notApplicable, unavailable } from './structured-errors.js';
import { redfieldRates } from './redfield-rates.js';
import { applyInverse, applyInverseSparse, secularBlocks } from './secular-blocks.js';

/** Sites whose sink rate differs from the common one that the structured redfield solver accepts. */
export const MAX_SPECIAL_SITES = 4;
/** Largest relative residual of L(X) = B accepted. */
export const MAX_REDFIELD_RESIDUAL = 1e-10;

/** The redfield problem in plain arrays (validated by the caller). */
export interface RedfieldProblem {
  readonly ex: Excitons;
  readonly reorganization: Float64Array;
  readonly trapRates: Float64Array;
  readonly lossRates: Float64Array;
  readonly temperature: number;
  readonly cutoff: number;
  readonly secularFraction: number;
  /** Site-basis initial density matrix. */
  readonly rho0: Float64Array;
}

/**
 * Efficiency, loss and transfer time of the secular Redfield model in O(N^3) when the sink rate (loss +
 * trap) is the same on all but a few sites. In the exciton basis the generator is
 *   L(X) = D(X) - 1/2 sum_s delta_s (c_s c_s^T X + X c_s c_s^T),
 * D the block-diagonal secular part with the common sink kappa (secular-blocks.ts), c_s the exciton
 * amplitudes of special site s and delta_s its extra sink. The second term has rank 2N per special site
 * (X -> (X^T c_s, X c_s) and back), so the Sherman-Morrison-Woodbury identity (Hager, SIAM Rev. 31, 221
 * (1989))
 *   L^-1 = D^-1 - D^-1 U (I + V^T D^-1 U)^-1 V^T D^-1
 * needs a 2Nr x 2Nr capacitance matrix. U of a unit vector is one column or one row of a matrix, so each of
 * its columns needs D^-1 on N elements only: O(N^2 r^2) in all after the O(N^3) inversion of the population
 * block. Each solve is then O(N^2), and the residual of L(X) = B is checked exactly in O(N^2 r) plus the
 * couplings.
 * Not applicable (NumericalError, code STRUCTURED_NOT_APPLICABLE) when more than MAX_SPECIAL_SITES sites differ
 * (per-site lifetimes make the correction full rank) or when there is no common sink (kappa = 0: the
 * population block of D conserves population and is singular).
 */
export function structuredRedfield(p: RedfieldProblem): { efficiency: number; lossFraction: number; transferTime: number; balanceResidual: number } {
  const { ex } = p;
  const { n, coefficients: C } = ex;
  const len = n * n;
  const sink = Float64Array.from(p.lossRates, (k, m) => k + p.trapRates[m]);
  const kappa = commonValue(sink);
  const special: number[] = [];
  for (let m = 0; m < n; m++) if (sink[m] !== kappa) special.push(m);
  if (special.length > MAX_SPECIAL_SITES) notApplicable(`the sink rate (loss + trap) differs from the common one at ${special.length} sites; the structured redfield solver takes at most ${MAX_SPECIAL_SITES} (per-site lifetimes make the trap and loss term full rank)`);
  if (!(kappa > 0)) notApplicable('there is no loss common to the sites (kappa = 0), which the structured redfield solver needs');
  const rates = redfieldRates(ex, p.reorganization, p.temperature, p.cutoff, p.secularFraction);
  const D = secularBlocks(rates, kappa);
  const r = special.length, q = 2 * n * r;
  // c_s (exciton amplitudes of the special sites) and -delta_s / 2
  const cs = special.map((m) => C.subarray(m * n, m * n + n));
  const half = special.map((m) => -0.5 * (sink[m] - kappa));
  const tr = new Float64Array(len), ti = new Float64Array(len), ur = new Float64Array(len), ui = new Float64Array(len);
  /** (X^T c_s, X c_s) for every special s, into out (length q, split). */
  const readout = (xr: Float64Array, xi: Float64Array, outR: Float64Array, outI: Float64Array) => {
    for (let t = 0; t < r; t++) {
      const c = cs[t], yo = 2 * t * n, zo = yo + n;
      for (let j = 0; j < n; j++) { outR[yo + j] = 0; outI[yo + j] = 0; }
      for (let i = 0; i < n; i++) {
        const ri = i * n, ci = c[i];
        let zr = 0, zi = 0;
        for (let j = 0; j < n; j++) {
          const a = xr[ri + j], b = xi[ri + j];
          zr += a * c[j]; zi += b * c[j];
          outR[yo + j] += ci * a; outI[yo + j] += ci * b;
        }
        outR[zo + i] = zr; outI[zo + i] = zi;
      }
    }
  };
  /** U applied to (y_s, z_s): sum_s -delta_s/2 (c_s y_s^T + z_s c_s^T), into (xr, xi). */
  const expand = (vr: Float64Array, vi: Float64Array, xr: Float64Array, xi: Float64Array) => {
    xr.fill(0); xi.fill(0);
    for (let t = 0; t < r; t++) {
      const c = cs[t], h = half[t], yo = 2 * t * n, zo = yo + n;
      for (let i = 0; i < n; i++) {
        const ri = i * n, hc = h * c[i], zr = h * vr[zo + i], zi = h * vi[zo + i];
        for (let j = 0; j < n; j++) {
          xr[ri + j] += hc * vr[yo + j] + zr * c[j];
          xi[ri + j] += hc * vi[yo + j] + zi * c[j];
        }
      }
    }
  };
  // capacitance I + V^T D^-1 U, column by column: U of a unit vector is one column (y) or one row (z) of
  // the matrix, so D^-1 touches only the blocks of those N elements
  const cap = { n: q, re: new Float64Array(q * q), im: new Float64Array(q * q) };
  const el = new Int32Array(n), vr = new Float64Array(n), vi = new Float64Array(n);
  const touched: number[] = [];
  const seen = new Uint8Array(len);
  for (let t = 0; t < r; t++) {
    for (let type = 0; type < 2; type++) {
      for (let b = 0; b < n; b++) {
        const col = (2 * t + type) * n + b;
        for (let a = 0; a < n; a++) { el[a] = type === 0 ? a * n + b : b * n + a; vr[a] = half[t] * cs[t][a]; }
        touched.length = 0;
        applyInverseSparse(D, el, vr, vi, n, ur, ui, touched);
        for (const f of touched) {
          if (seen[f]) continue;
          seen[f] = 1;
          const i = (f / n) | 0, j = f % n, xr = ur[f], xi = ui[f];
          for (let t2 = 0; t2 < r; t2++) {
            const c = cs[t2], yo = (2 * t2 * n + j) * q + col, zo = ((2 * t2 + 1) * n + i) * q + col;
            // (X^T c)_j += c_i X_ij ; (X c)_i += X_ij c_j
            cap.re[yo] += c[i] * xr; cap.im[yo] += c[i] * xi;
            cap.re[zo] += c[j] * xr; cap.im[zo] += c[j] * xi;
          }
        }
        for (const f of touched) { seen[f] = 0; ur[f] = 0; ui[f] = 0; }
        cap.re[col * q + col] += 1;
      }
    }
  }
  let lu;
  try {
    lu = complexLuFactor(cap);
  } catch {
    unavailable('the Woodbury capacitance matrix of the trap term is singular');
  }
  const vR = new Float64Array(q), vI = new Float64Array(q);
  /** X = L^-1 B (B split), into (xr, xi). */
  const solve = (br: Float64Array, bi: Float64Array, xr: Float64Array, xi: Float64Array) => {
    applyInverse(D, br, bi, xr, xi);
    readout(xr, xi, vR, vI);
    complexLuSolve(lu, vR, vI);
    expand(vR, vI, tr, ti);
    applyInverse(D, tr, ti, ur, ui);
    for (let k = 0; k < len; k++) { xr[k] -= ur[k]; xi[k] -= ui[k]; }
  };
  // B = -C^T rho0 C (real), X = L^-1 B, Y = L^-1(-X)
  const bR = toExcitonBasis(n, p.rho0, C), bI = new Float64Array(len);
  for (let k = 0; k < len; k++) bR[k] = -bR[k];
  const xR = new Float64Array(len), xI = new Float64Array(len), yR = new Float64Array(len), yI = new Float64Array(len);
  solve(bR, bI, xR, xI);
  const mxR = xR.map((v) => -v), mxI = xI.map((v) => -v);
  solve(mxR, mxI, yR, yI);
  const generator = { D, sink, C };
  const worst = Math.max(residual(generator, xR, xI, bR, bI), residual(generator, yR, yI, mxR, mxI));
  if (!(worst <= MAX_REDFIELD_RESIDUAL)) unavailable(`the residual check failed (relative residual ${worst.toExponential(2)} > ${MAX_REDFIELD_RESIDUAL})`);
  const efficiency = siteWeighted(n, C, p.trapRates, xR);
  const lossFraction = siteWeighted(n, C, p.lossRates, xR);
  const trapTime = siteWeighted(n, C, p.trapRates, yR);
  const balanceResidual = Math.abs(efficiency + lossFraction - 1);
  if (!(balanceResidual <= 1e-9)) unavailable(`eta + loss misses 1 by ${balanceResidual.toExponential(2)}`);
  return { efficiency, lossFraction, transferTime: efficiency > 0 ? trapTime / efficiency : Infinity, balanceResidual };
}

/** The value most entries share exactly (the first of equally common ones). */
function commonValue(v: Float64Array): number {
  let best = v[0], bestCount = 0;
  for (let i = 0; i < v.length; i++) {
    let count = 0;
    for (let j = 0; j < v.length; j++) if (v[j] === v[i]) count++;
    if (count > bestCount) { best = v[i]; bestCount = count; }
    if (2 * count > v.length) break;
  }
  return best;
}

/** sum_m w_m [C X C^T]_mm = sum_ab (C^T diag(w) C)_ab Re X_ab for a Hermitian X (real part xr). */
function siteWeighted(n: number, C: Float64Array, w: Float64Array, xr: Float64Array): number {
  let total = 0;
  for (let m = 0; m < n; m++) {
    if (w[m] === 0) continue;
    const rm = m * n;
    let s = 0;
    for (let a = 0; a < n; a++) {
      const ca = C[rm + a];
      let t = 0;
      for (let b = 0; b < n; b++) t += xr[a * n + b] * C[rm + b];
      s += ca * t;
    }
    total += w[m] * s;
  }
  return total;
}

/**
 * ||B - L(X)||_F over the size of the terms, with L(X) = D(X) - 1/2 sum_s delta_s {c_s c_s^T, X} written as
 * the diagonal of D, its kept couplings, and -1/2 {C^T diag(sink - kappa) C, X}. O(N^3).
 */
function residual(g: { D: ReturnType<typeof secularBlocks>; sink: Float64Array; C: Float64Array }, xr: Float64Array, xi: Float64Array, br: Float64Array, bi: Float64Array): number {
  const { D, C } = g;
  const n = D.n, len = n * n;
  const lr = new Float64Array(len), li = new Float64Array(len);
  let size = 0;
  for (let k = 0; k < len; k++) {
    lr[k] = D.diagRe[k] * xr[k] - D.diagIm[k] * xi[k];
    li[k] = D.diagRe[k] * xi[k] + D.diagIm[k] * xr[k];
    size += abs1(lr[k], li[k]);
  }
  const { to, from, value } = D.couplings;
  for (let t = 0; t < to.length; t++) {
    lr[to[t]] += value[t] * xr[from[t]];
    li[to[t]] += value[t] * xi[from[t]];
    size += Math.abs(value[t]) * abs1(xr[from[t]], xi[from[t]]);
  }
  // the extra sink -1/2 sum_s delta_s (c_s c_s^T X + X c_s c_s^T), with c_s^T X and X c_s first (O(N^2) per site)
  const kappa = commonValue(g.sink);
  const yr = new Float64Array(n), yi = new Float64Array(n), zr = new Float64Array(n), zi = new Float64Array(n);
  for (let m = 0; m < n; m++) {
    const h = -0.5 * (g.sink[m] - kappa);
    if (h === 0) continue;
    const c = C.subarray(m * n, m * n + n);
    yr.fill(0); yi.fill(0);
    for (let i = 0; i < n; i++) {
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) {
        const a = xr[i * n + j], b = xi[i * n + j];
        sr += a * c[j]; si += b * c[j];
        yr[j] += c[i] * a; yi[j] += c[i] * b;
      }
      zr[i] = sr; zi[i] = si;
    }
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const k = i * n + j;
      const ar = h * (c[i] * yr[j] + zr[i] * c[j]), ai = h * (c[i] * yi[j] + zi[i] * c[j]);
      lr[k] += ar; li[k] += ai;
      size += abs1(ar, ai);
    }
  }
  let res = 0, bsize = 0;
  for (let k = 0; k < len; k++) { res += (br[k] - lr[k]) ** 2 + (bi[k] - li[k]) ** 2; bsize += abs1(br[k], bi[k]); }
  const scale = size + bsize;
  // sqrt(len) ||R||_2 bounds ||R||_1, which is what the term sizes (|re| + |im|) compare with
  return scale > 0 ? (Math.sqrt(res) * Math.sqrt(len)) / scale : 0;
}

const abs1 = (re: number, im: number) => Math.abs(re) + Math.abs(im);
