import type { Excitons } from '../excitons.js';
import { Scratch } from '../linalg/dense.js';
import { luFactor, luSolveInPlace, type LuFactors } from '../linalg/lu.js';
import { toExcitonBasis } from '../models/redfield.js';
import { notApplicable, unavailable } from './structured-errors.js';
import { redfieldRates } from './redfield-rates.js';
import { applyInverse, applyInverseSparseReal, secularBlocks, type SecularBlocks } from './secular-blocks.js';

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
 *   L(X) = D(X) - 1/2 sum_s delta_s (P_s X + X P_s),   P_s = c_s c_s^T,
 * D the block-diagonal secular part with the common sink kappa (secular-blocks.ts), c_s the (real) exciton
 * amplitudes of special site s and delta_s its extra sink. The right-hand sides and so the solutions are
 * Hermitian (L and D map Hermitian matrices to Hermitian ones), and for a Hermitian X
 *   P_s X + X P_s = c_s z_s^H + z_s c_s^T,   z_s = X c_s,
 * so the second term is fixed by one complex N-vector, 2N reals, per special site. Writing
 * M_s(z) = c_s z^H + z c_s^T (real-linear in z), the Sherman-Morrison-Woodbury identity (Hager, SIAM Rev. 31,
 * 221 (1989)) restricted to Hermitian matrices reads
 *   X = X0 + D^-1 sum_s (delta_s / 2) M_s(z_s),   X0 = D^-1 B,   (I + K) z = (X0 c_t)_t,
 * K the real 2Nr x 2Nr capacitance map z -> ([D^-1 sum_s -(delta_s / 2) M_s(z_s)] c_t)_t. (I + K) is
 * singular exactly when L is on Hermitian matrices. Since D^-1(X^H) = D^-1(X)^H, the columns of K for
 * z = e_b and z = i e_b both follow from P = D^-1(c_s e_b^T) (one column of a matrix: D^-1 touches only the
 * blocks of those N elements): they are the readouts of P + P^H and i (P^H - P). Building K is O(N^2 r^2)
 * after the O(N^3) inversion of the population block, its real LU O((2Nr)^3), each solve O(N^2 r), and the
 * residual of L(X) = B is checked exactly in O(N^2 r) plus the couplings.
 * Not applicable (NumericalError, code STRUCTURED_NOT_APPLICABLE) when more than MAX_SPECIAL_SITES sites differ
 * (per-site lifetimes make the correction full rank) or when there is no common sink (kappa = 0: the
 * population block of D conserves population and is singular). Scratch arrays are reused between calls (one
 * set per thread); nothing returned lives in them.
 */
export function structuredRedfield(p: RedfieldProblem): { efficiency: number; lossFraction: number; transferTime: number; balanceResidual: number } {
  const { ex } = p;
  const { n, coefficients: C } = ex;
  const len = n * n;
  const sink = scratch.f64('sink', n);
  for (let m = 0; m < n; m++) sink[m] = p.lossRates[m] + p.trapRates[m];
  const kappa = commonValue(sink, n);
  const special = scratch.i32('special', n);
  let r = 0;
  for (let m = 0; m < n; m++) if (sink[m] !== kappa) special[r++] = m;
  if (r > MAX_SPECIAL_SITES) notApplicable(`the sink rate (loss + trap) differs from the common one at ${r} sites; the structured redfield solver takes at most ${MAX_SPECIAL_SITES} (per-site lifetimes make the trap and loss term full rank)`);
  if (!(kappa > 0)) notApplicable('there is no loss common to the sites (kappa = 0), which the structured redfield solver needs');
  const rates = redfieldRates(ex, p.reorganization, p.temperature, p.cutoff, p.secularFraction);
  const D = secularBlocks(rates, kappa);
  const half = scratch.f64('half', r);
  for (let t = 0; t < r; t++) half[t] = -0.5 * (sink[special[t]] - kappa);
  const g: Correction = { D, C, n, r, special, half, lu: undefined };
  if (r > 0) {
    const q = 2 * n * r;
    const cap = capacitance(g);
    try {
      g.lu = luFactor(cap, q, false, scratch.i32('pivots', q));
    } catch {
      unavailable('the Woodbury capacitance matrix of the trap term is singular');
    }
  }
  // B = -C^T rho0 C (real), X = L^-1 B, Y = L^-1(-X)
  const bR = toExcitonBasis(n, p.rho0, C, scratch.f64('bR', len), scratch.f64('tmp', len)), bI = scratch.zeros('bI', len);
  for (let k = 0; k < len; k++) bR[k] = -bR[k];
  const xR = scratch.f64('xR', len), xI = scratch.f64('xI', len), yR = scratch.f64('yR', len), yI = scratch.f64('yI', len);
  solve(g, bR, bI, xR, xI);
  const mxR = scratch.f64('mxR', len), mxI = scratch.f64('mxI', len);
  for (let k = 0; k < len; k++) { mxR[k] = -xR[k]; mxI[k] = -xI[k]; }
  solve(g, mxR, mxI, yR, yI);
  const worst = Math.max(residual(g, sink, kappa, xR, xI, bR, bI), residual(g, sink, kappa, yR, yI, mxR, mxI));
  if (!(worst <= MAX_REDFIELD_RESIDUAL)) unavailable(`the residual check failed (relative residual ${worst.toExponential(2)} > ${MAX_REDFIELD_RESIDUAL})`);
  const efficiency = siteWeighted(n, C, p.trapRates, xR);
  const lossFraction = siteWeighted(n, C, p.lossRates, xR);
  const trapTime = siteWeighted(n, C, p.trapRates, yR);
  const balanceResidual = Math.abs(efficiency + lossFraction - 1);
  if (!(balanceResidual <= 1e-9)) unavailable(`eta + loss misses 1 by ${balanceResidual.toExponential(2)}`);
  return { efficiency, lossFraction, transferTime: efficiency > 0 ? trapTime / efficiency : Infinity, balanceResidual };
}

const scratch = new Scratch();

/** The secular part and the low-rank sink correction of one problem. */
interface Correction {
  readonly D: SecularBlocks;
  readonly C: Float64Array;
  readonly n: number;
  /** Number of special sites, their indices (first r entries) and -delta_s / 2. */
  readonly r: number;
  readonly special: Int32Array;
  readonly half: Float64Array;
  /** Real LU of the 2Nr x 2Nr capacitance matrix (none when r = 0). */
  lu: LuFactors | undefined;
}

/**
 * The capacitance matrix I + K (row-major, 2Nr x 2Nr, in scratch). Unknown z_t sits at 2Nt (real parts) and
 * 2Nt + N (imaginary parts). For P = D^-1(-(delta_s / 2) c_s e_b^T) each entry P_ij = pr + i pi adds
 * pr c_j + i pi c_j to (P c_t)_i and pr c_i - i pi c_i to (P^H c_t)_j; column z_s = e_b takes their sum,
 * column z_s = i e_b i times their difference (P^H - P).
 */
function capacitance(g: Correction): Float64Array {
  const { D, C, n, r, special, half } = g;
  const len = n * n, q = 2 * n * r;
  const A = scratch.zeros('cap', q * q);
  let widest = 1;
  for (let k = 0; k < D.blocks; k++) widest = Math.max(widest, D.start[k + 1] - D.start[k]);
  const el = scratch.i32('el', n), v = scratch.f64('v', n), touched = scratch.i32('touched', n * widest);
  const pr = scratch.zeros('pr', len), pi = scratch.zeros('pi', len);
  const seen = scratch.i32('seen', len);
  seen.fill(0, 0, len);
  for (let s = 0; s < r; s++) {
    const cs = special[s] * n, h = half[s];
    for (let b = 0; b < n; b++) {
      for (let a = 0; a < n; a++) { el[a] = a * n + b; v[a] = h * C[cs + a]; }
      const count = applyInverseSparseReal(D, el, v, n, pr, pi, touched, 0);
      const colRe = 2 * n * s + b, colIm = colRe + n;
      for (let k = 0; k < count; k++) {
        const f = touched[k];
        if (seen[f]) continue;
        seen[f] = 1;
        const i = (f / n) | 0, j = f - i * n, xr = pr[f], xi = pi[f];
        for (let t = 0; t < r; t++) {
          const ct = special[t] * n, ci = C[ct + i], cj = C[ct + j];
          const ri = (2 * n * t + i) * q, ii = ri + n * q, rj = (2 * n * t + j) * q, ij = rj + n * q;
          const a1 = xr * cj, b1 = xi * cj, c1 = xr * ci, d1 = xi * ci;
          A[ri + colRe] += a1; A[ii + colRe] += b1; A[rj + colRe] += c1; A[ij + colRe] -= d1;
          A[ri + colIm] += b1; A[ii + colIm] -= a1; A[rj + colIm] += d1; A[ij + colIm] += c1;
        }
      }
      for (let k = 0; k < count; k++) { const f = touched[k]; seen[f] = 0; pr[f] = 0; pi[f] = 0; }
      A[colRe * q + colRe] += 1;
      A[colIm * q + colIm] += 1;
    }
  }
  return A;
}

/** z_t = X c_t for every special t, into u (real parts at 2Nt, imaginary at 2Nt + N). */
function readout(g: Correction, xr: Float64Array, xi: Float64Array, u: Float64Array): void {
  const { C, n, r, special } = g;
  for (let t = 0; t < r; t++) {
    const ct = special[t] * n, o = 2 * n * t;
    for (let i = 0; i < n; i++) {
      const ri = i * n;
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) { sr += xr[ri + j] * C[ct + j]; si += xi[ri + j] * C[ct + j]; }
      u[o + i] = sr;
      u[o + n + i] = si;
    }
  }
}

/** sum_s -(delta_s / 2) M_s(z_s) = sum_s -(delta_s / 2) (c_s z_s^H + z_s c_s^T), into (xr, xi). */
function expand(g: Correction, u: Float64Array, xr: Float64Array, xi: Float64Array): void {
  const { C, n, r, special, half } = g;
  xr.fill(0, 0, n * n);
  xi.fill(0, 0, n * n);
  for (let t = 0; t < r; t++) {
    const ct = special[t] * n, o = 2 * n * t, h = half[t];
    for (let i = 0; i < n; i++) {
      const ri = i * n, hc = h * C[ct + i], hzr = h * u[o + i], hzi = h * u[o + n + i];
      for (let j = 0; j < n; j++) {
        const cj = C[ct + j];
        xr[ri + j] += hc * u[o + j] + hzr * cj;
        xi[ri + j] += hzi * cj - hc * u[o + n + j];
      }
    }
  }
}

/** X = L^-1 B for a Hermitian B (split), into (xr, xi). */
function solve(g: Correction, br: Float64Array, bi: Float64Array, xr: Float64Array, xi: Float64Array): void {
  const { D, n, lu } = g;
  applyInverse(D, br, bi, xr, xi);
  if (lu === undefined) return;
  const len = n * n, u = scratch.f64('u', lu.n);
  readout(g, xr, xi, u);
  luSolveInPlace(lu, u);
  const tr = scratch.f64('tr', len), ti = scratch.f64('ti', len), ur = scratch.f64('ur', len), ui = scratch.f64('ui', len);
  expand(g, u, tr, ti);
  applyInverse(D, tr, ti, ur, ui);
  for (let k = 0; k < len; k++) { xr[k] -= ur[k]; xi[k] -= ui[k]; }
}

/** The value most entries share exactly (the first of equally common ones). */
function commonValue(v: Float64Array, n: number): number {
  let best = v[0], bestCount = 0;
  for (let i = 0; i < n; i++) {
    let count = 0;
    for (let j = 0; j < n; j++) if (v[j] === v[i]) count++;
    if (count > bestCount) { best = v[i]; bestCount = count; }
    if (2 * count > n) break;
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
function residual(g: Correction, sink: Float64Array, kappa: number, xr: Float64Array, xi: Float64Array, br: Float64Array, bi: Float64Array): number {
  const { D, C, n } = g;
  const len = n * n;
  const lr = scratch.f64('lr', len), li = scratch.f64('li', len);
  let size = 0;
  for (let k = 0; k < len; k++) {
    lr[k] = D.diagRe[k] * xr[k] - D.diagIm[k] * xi[k];
    li[k] = D.diagRe[k] * xi[k] + D.diagIm[k] * xr[k];
    size += abs1(lr[k], li[k]);
  }
  const { count, to, from, value } = D.couplings;
  for (let t = 0; t < count; t++) {
    lr[to[t]] += value[t] * xr[from[t]];
    li[to[t]] += value[t] * xi[from[t]];
    size += Math.abs(value[t]) * abs1(xr[from[t]], xi[from[t]]);
  }
  // the extra sink -1/2 sum_s delta_s (c_s c_s^T X + X c_s c_s^T), with c_s^T X and X c_s first (O(N^2) per site)
  const yr = scratch.f64('ryr', n), yi = scratch.f64('ryi', n), zr = scratch.f64('rzr', n), zi = scratch.f64('rzi', n);
  for (let m = 0; m < n; m++) {
    const h = -0.5 * (sink[m] - kappa);
    if (h === 0) continue;
    const c = m * n;
    yr.fill(0, 0, n); yi.fill(0, 0, n);
    for (let i = 0; i < n; i++) {
      let sr = 0, si = 0;
      for (let j = 0; j < n; j++) {
        const a = xr[i * n + j], b = xi[i * n + j];
        sr += a * C[c + j]; si += b * C[c + j];
        yr[j] += C[c + i] * a; yi[j] += C[c + i] * b;
      }
      zr[i] = sr; zi[i] = si;
    }
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const k = i * n + j;
      const ar = h * (C[c + i] * yr[j] + zr[i] * C[c + j]), ai = h * (C[c + i] * yi[j] + zi[i] * C[c + j]);
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
