import type { Excitons } from '../excitons.js';
import { Workspace } from '../linalg/workspace.js';
import { luFactor, luSolveInPlace, type LuFactors } from '../linalg/lu.js';
import { toExcitonBasis } from '../models/redfield.js';
import { notApplicable, unavailable } from './structured-errors.js';
import { redfieldRates } from './redfield-rates.js';
import { applyInverse, secularBlocks, type SecularBlocks } from './secular-blocks.js';

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
 *   L(X) = D(X) + S(X),   S(X) = C^T S'(C X C^T) C,   S'(rho)_ij = -1/2 (delta_i + delta_j) rho_ij,
 * D the block-diagonal secular part with the common sink kappa (secular-blocks.ts), C the exciton coefficients
 * and delta_m = sink_m - kappa, non-zero only at the r special sites. The right-hand sides and so the solutions
 * are Hermitian (L and D map Hermitian matrices to Hermitian ones), and S' touches only the entries rho_ms with m
 * or s special: 2Nr - r^2 real parameters of a Hermitian matrix. So S = U V^T on the real space of Hermitian
 * matrices, V^T reading those parameters of C X C^T and U putting them back times -1/2 (delta_m + delta_s), and
 * the Sherman-Morrison-Woodbury identity (Hager, SIAM Rev. 31, 221 (1989))
 *   L^-1 = D^-1 - D^-1 U (I + V^T D^-1 U)^-1 V^T D^-1
 * needs a real (2Nr - r^2) x (2Nr - r^2) capacitance matrix (I + V^T D^-1 U is singular exactly when L is on
 * Hermitian matrices). Since D^-1(X^H) = D^-1(X)^H, both columns of an off-diagonal entry follow from one
 * D^-1(c_m c_s^T) (capacitance below). Building it is O(N^3 r^2), its real LU O((2Nr)^3), each solve
 * O(N^2 r + N^3), and the residual of L(X) = B is checked exactly in O(N^2 r) plus the couplings.
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
  const g = correction(D, C, n, r, special, sink, kappa);
  if (r > 0) {
    const cap = capacitance(g);
    try {
      g.lu = luFactor(cap, g.p, false, scratch.i32('pivots', g.p));
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

const scratch = new Workspace();

/**
 * The secular part and the low-rank sink correction of one problem. The unknowns of the correction are the
 * site-basis entries rho_ms (rho = C X C^T) with s special, each Hermitian pair once: for the t-th special site
 * s and every site m not an earlier special one, Re rho_ms and Im rho_ms, only Re rho_ss on the diagonal:
 * 2Nr - r^2 reals. Parameter k sits at entry (site[k], special[tIndex[k]]), kind[k] 0 (diagonal), 1 (real
 * part) or 2 (imaginary part, always right after its real part).
 */
interface Correction {
  readonly D: SecularBlocks;
  readonly C: Float64Array;
  readonly n: number;
  readonly r: number;
  readonly special: Int32Array;
  readonly p: number;
  readonly site: Int32Array;
  readonly tIndex: Int32Array;
  readonly kind: Int32Array;
  /** -1/2 (delta_m + delta_s) of each parameter's entry, delta = sink - kappa. */
  readonly gain: Float64Array;
  /** Real LU of the p x p capacitance matrix (none when r = 0). */
  lu: LuFactors | undefined;
}

function correction(D: SecularBlocks, C: Float64Array, n: number, r: number, special: Int32Array, sink: Float64Array, kappa: number): Correction {
  const rank = scratch.i32('rank', n);
  rank.fill(-1, 0, n);
  for (let t = 0; t < r; t++) rank[special[t]] = t;
  const p = 2 * n * r - r * r;
  const site = scratch.i32('site', p), tIndex = scratch.i32('tIndex', p), kind = scratch.i32('kind', p), gain = scratch.f64('gain', p);
  let k = 0;
  for (let t = 0; t < r; t++) {
    const s = special[t];
    for (let m = 0; m < n; m++) {
      if (rank[m] >= 0 && rank[m] < t) continue;
      const g = -0.5 * (sink[m] - kappa + (sink[s] - kappa));
      for (let part = m === s ? 0 : 1; part <= (m === s ? 0 : 2); part++) { site[k] = m; tIndex[k] = t; kind[k] = part; gain[k] = g; k++; }
    }
  }
  return { D, C, n, r, special, p, site, tIndex, kind, gain, lu: undefined };
}

/**
 * The capacitance matrix I + V^T D^-1 U (row-major p x p, in scratch), V^T reading the parameters of a Hermitian
 * X and U w = C^T (sum_k w_k gain_k B_k) C, B_k the Hermitian unit matrix of parameter k (E_ms + E_sm,
 * i (E_ms - E_sm) or E_ss). With P = D^-1(c_m c_s^T) (c_m c_s^T = C^T E_ms C, real and dense) the columns are
 * gain (P + P^H), gain i (P - P^H) and gain P = gain (P + P^H) / 2 (P Hermitian when m = s); reading them needs
 * column and row s' of Q = C P C^T for every special s': a = Q_m's', b = Q_s'm'.
 */
function capacitance(g: Correction): Float64Array {
  const { D, C, n, r, special, p, site, tIndex, kind, gain } = g;
  const len = n * n;
  const A = scratch.zeros('cap', p * p);
  const Mr = scratch.f64('Mr', len), Mi = scratch.zeros('Mi', len), Pr = scratch.f64('Pr', len), Pi = scratch.f64('Pi', len);
  const u = scratch.f64('cu', 2 * n), v = scratch.f64('cv', 2 * n);
  const colR = scratch.f64('colR', r * n), colI = scratch.f64('colI', r * n), rowR = scratch.f64('rowR', r * n), rowI = scratch.f64('rowI', r * n);
  for (let k = 0; k < p; k++) {
    if (kind[k] === 2) continue;
    const m = site[k], s = special[tIndex[k]];
    for (let a = 0; a < n; a++) { const cm = C[m * n + a]; for (let b = 0; b < n; b++) Mr[a * n + b] = cm * C[s * n + b]; }
    applyInverse(D, Mr, Mi, Pr, Pi);
    for (let t = 0; t < r; t++) {
      // u = P c_s', v = P^T c_s', then column s' of Q = C u and row s' = C v
      const cs = special[t] * n;
      v.fill(0, 0, 2 * n);
      for (let a = 0; a < n; a++) {
        const ra = a * n, ca = C[cs + a];
        let sr = 0, si = 0;
        for (let b = 0; b < n; b++) {
          const xr = Pr[ra + b], xi = Pi[ra + b];
          sr += xr * C[cs + b]; si += xi * C[cs + b];
          v[b] += xr * ca; v[n + b] += xi * ca;
        }
        u[a] = sr; u[n + a] = si;
      }
      for (let q = 0; q < n; q++) {
        const cq = q * n;
        let ar = 0, ai = 0, br = 0, bi = 0;
        for (let a = 0; a < n; a++) { const c = C[cq + a]; ar += c * u[a]; ai += c * u[n + a]; br += c * v[a]; bi += c * v[n + a]; }
        colR[t * n + q] = ar; colI[t * n + q] = ai; rowR[t * n + q] = br; rowI[t * n + q] = bi;
      }
    }
    const diagonal = kind[k] === 0, h = diagonal ? 0.5 * gain[k] : gain[k];
    for (let k2 = 0; k2 < p; k2++) {
      const o = tIndex[k2] * n + site[k2], ar = colR[o], ai = colI[o], br = rowR[o], bi = rowI[o], row = k2 * p;
      const imaginary = kind[k2] === 2;
      // parameter k2 of P + P^H: (a + conj b) at (m', s'); of i (P - P^H): i (a - conj b)
      A[row + k] += h * (imaginary ? ai - bi : ar + br);
      if (!diagonal) A[row + k + 1] += h * (imaginary ? ar - br : -(ai + bi));
    }
    A[k * p + k] += 1;
    if (!diagonal) A[(k + 1) * p + k + 1] += 1;
  }
  return A;
}

/** The parameters of a Hermitian X: rho_ms = (C X c_s)_m for every special s, into w. */
function readout(g: Correction, xr: Float64Array, xi: Float64Array, w: Float64Array): void {
  const { C, n, r, special, p, site, tIndex, kind } = g;
  const colR = scratch.f64('colR', r * n), colI = scratch.f64('colI', r * n), u = scratch.f64('cu', 2 * n);
  for (let t = 0; t < r; t++) {
    const cs = special[t] * n;
    for (let a = 0; a < n; a++) {
      const ra = a * n;
      let sr = 0, si = 0;
      for (let b = 0; b < n; b++) { sr += xr[ra + b] * C[cs + b]; si += xi[ra + b] * C[cs + b]; }
      u[a] = sr; u[n + a] = si;
    }
    for (let q = 0; q < n; q++) {
      let ar = 0, ai = 0;
      for (let a = 0; a < n; a++) { const c = C[q * n + a]; ar += c * u[a]; ai += c * u[n + a]; }
      colR[t * n + q] = ar; colI[t * n + q] = ai;
    }
  }
  for (let k = 0; k < p; k++) { const o = tIndex[k] * n + site[k]; w[k] = kind[k] === 2 ? colI[o] : colR[o]; }
}

/** U w = C^T (sum_k w_k gain_k B_k) C, into (xr, xi). */
function expand(g: Correction, w: Float64Array, xr: Float64Array, xi: Float64Array): void {
  const { C, n, special, p, site, tIndex, kind, gain } = g;
  const len = n * n;
  const Gr = scratch.zeros('Gr', len), Gi = scratch.zeros('Gi', len);
  for (let k = 0; k < p; k++) {
    const m = site[k], s = special[tIndex[k]], v = gain[k] * w[k];
    if (kind[k] === 0) Gr[s * n + s] += v;
    else if (kind[k] === 1) { Gr[m * n + s] += v; Gr[s * n + m] += v; }
    else { Gi[m * n + s] += v; Gi[s * n + m] -= v; }
  }
  const tmp = scratch.f64('expandTmp', len);
  toExcitonBasis(n, Gr, C, xr, tmp);
  toExcitonBasis(n, Gi, C, xi, tmp);
}

/** X = L^-1 B for a Hermitian B (split), into (xr, xi). */
function solve(g: Correction, br: Float64Array, bi: Float64Array, xr: Float64Array, xi: Float64Array): void {
  const { D, n, lu } = g;
  applyInverse(D, br, bi, xr, xi);
  if (lu === undefined) return;
  const len = n * n, w = scratch.f64('w', g.p);
  readout(g, xr, xi, w);
  luSolveInPlace(lu, w);
  const tr = scratch.f64('tr', len), ti = scratch.f64('ti', len), ur = scratch.f64('ur', len), ui = scratch.f64('ui', len);
  expand(g, w, tr, ti);
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
