import { NumericalError } from '../../errors.js';
import type { ComplexEigen } from './complex-eigen.js';
import { normalizeColumnBilinear } from './complex-dense.js';
import { cabs } from './complex-scalar.js';
import { symmetricEigenRows } from './symmetric-eigen.js';
import { frameOf, type Workspace } from './workspace.js';

const EPS = Number.EPSILON;
const MAX_NEWTON = 30;

/**
 * Eigenvalues and complex orthogonal eigenvectors (V^T V = I) of S = B + rho e_t e_t^T, B real symmetric
 * (row-major n x n) and rho complex: the shape of H - i K / 2 with one trap once the loss common to every
 * site is shifted out. B = U D U^T first (symmetric-eigen.ts, U kept as rows W = U^T); in that basis S is D + rho w w^T with
 * w = U^T e_t, whose eigenvalues solve the secular equation 1 + rho sum_j w_j^2 / (d_j - lambda) = 0 and
 * whose eigenvectors are (D - lambda)^-1 w (Golub, SIAM Rev. 15, 318 (1973); Bunch, Nielsen and Sorensen,
 * Numer. Math. 31, 31 (1978), for the real case). As in LAPACK's dlaed2, components with |rho w_j| below
 * 8 eps ||S|| and pairs of (nearly) equal d_j are deflated first. Each remaining root is found by Newton's
 * method as lambda = d_k + tau_k from the second-order start tau = rho w_k^2 / (1 + rho sum_j w_j^2 / (d_j - d_k)),
 * with the differences d_j - lambda formed as (d_j - d_k) - tau (dlaed4's device, which keeps the components
 * of the vector near its own pole accurate). Real arithmetic does the O(n^3) work; the roots cost O(n^2).
 * Throws NumericalError (the caller falls back to a general method) when a root does not converge, two
 * roots meet (Newton found one root twice, or S is close to an exceptional point), the roots miss the trace
 * identity sum tau_k = rho sum w_k^2, or a vector is nearly isotropic.
 * With a workspace the returned arrays live in it.
 */
export function rankOneSymmetricEigen(b: Float64Array, n: number, t: number, rhoRe: number, rhoIm: number, ws?: Workspace): ComplexEigen {
  // W = U^T: row j is eigenvector j of B
  // symmetricEigenRows writes every entry of W, d and w
  const buf = frameOf(ws, 'r1', n, rankOneArrays);
  const { W, d, w } = buf;
  symmetricEigenRows(b, n, W, d, w);
  for (let j = 0; j < n; j++) w[j] = W[j * n + t];
  let big = 0;
  for (let j = 0; j < n; j++) big = Math.max(big, Math.abs(d[j]));
  const rho = cabs(rhoRe, rhoIm);
  const tol = 8 * EPS * (big + rho);
  const active = deflate(d, w, W, n, rho, tol);
  const m = active.length;
  // roots: tau_k, lambda_k = d_k + tau_k, for every active k
  const { tr, ti } = buf;
  for (let j = 0; j < n; j++) { tr[j] = 0; ti[j] = 0; }
  for (let a = 0; a < m; a++) newtonRoot(d, w, active, a, rhoRe, rhoIm, tr, ti);
  checkRoots(d, w, active, tr, ti, rhoRe, rhoIm, big + rho);
  // eigenvectors in U's basis: deflated columns are unit vectors, active ones (D - lambda)^-1 w scaled to y^T y = 1
  const { yr, yi, valuesRe, valuesIm } = buf;
  for (let j = 0; j < n * n; j++) { yr[j] = 0; yi[j] = 0; }
  for (let j = 0; j < n; j++) { valuesRe[j] = d[j]; valuesIm[j] = 0; yr[j * n + j] = 1; }
  for (let a = 0; a < m; a++) {
    const k = active[a];
    yr[k * n + k] = 0;
    valuesRe[k] = d[k] + tr[k];
    valuesIm[k] = ti[k];
    for (let c = 0; c < m; c++) {
      const j = active[c];
      // w_j / ((d_j - d_k) - tau_k)
      const xr = d[j] - d[k] - tr[k], xi = -ti[k];
      const q = w[j] / (xr * xr + xi * xi);
      const vr = q * xr, vi = -q * xi;
      yr[j * n + k] = vr; yi[j * n + k] = vi;
    }
    if (!normalizeColumnBilinear(yr, yi, n, k, 1e-10)) throw new NumericalError(`rank-one eigen-solver: eigenvector ${k + 1} of ${n} is nearly isotropic (y^T y = 0): the matrix is close to a defective one`, 'isotropic-eigenvector');
  }
  // V = U Y = W^T Y, as dot products over j (two columns at a time, sums kept in registers: no stores in the loop)
  const { Vr, Vi } = buf;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    let c = 0;
    for (; c + 1 < n; c += 2) {
      let r0 = 0, i0 = 0, r1 = 0, i1 = 0;
      for (let j = 0, rj = 0; j < n; j++, rj += n) {
        const u = W[rj + i];
        r0 += u * yr[rj + c]; i0 += u * yi[rj + c];
        r1 += u * yr[rj + c + 1]; i1 += u * yi[rj + c + 1];
      }
      Vr[ri + c] = r0; Vi[ri + c] = i0; Vr[ri + c + 1] = r1; Vi[ri + c + 1] = i1;
    }
    if (c < n) {
      let r0 = 0, i0 = 0;
      for (let j = 0, rj = 0; j < n; j++, rj += n) { const u = W[rj + i]; r0 += u * yr[rj + c]; i0 += u * yi[rj + c]; }
      Vr[ri + c] = r0; Vi[ri + c] = i0;
    }
  }
  return { n, valuesRe, valuesIm, vectors: { n, re: Vr, im: Vi } };
}

/** The arrays of one solve of size n (kept in the workspace between calls of the same size when there is one). */
function rankOneArrays(n: number) {
  const v = (): Float64Array => new Float64Array(n), m = (): Float64Array => new Float64Array(n * n);
  return { n, W: m(), d: v(), w: v(), tr: v(), ti: v(), yr: m(), yi: m(), valuesRe: v(), valuesIm: v(), Vr: m(), Vi: m() };
}

/**
 * dlaed2's deflation: w_j with |rho w_j| <= tol is dropped (d_j, u_j is then an eigenpair), and of two
 * active d_i <= d_j with |c s (d_j - d_i)| <= tol after the rotation that moves w_i into w_j, w_i is
 * dropped (the rotation is applied to the eigenvectors, rows i and j of W, and to d). Returns the active
 * indices in ascending d.
 */
function deflate(d: Float64Array, w: Float64Array, W: Float64Array, n: number, rho: number, tol: number): number[] {
  // d is ascending (symmetricEigenRows sorts it), so neighbours in index order are neighbours in value
  const active: number[] = [];
  for (let j = 0; j < n; j++) {
    if (rho * Math.abs(w[j]) <= tol) { w[j] = 0; continue; }
    const i = active.length ? active[active.length - 1] : -1;
    if (i >= 0) {
      const r = cabs(w[i], w[j]), c = w[j] / r, s = w[i] / r;
      if (Math.abs(c * s * (d[j] - d[i])) <= tol) {
        // new u_i = c u_i - s u_j (w_i -> 0), new u_j = s u_i + c u_j (w_j -> r)
        for (let k = 0; k < n; k++) {
          const a = W[i * n + k], b = W[j * n + k];
          W[i * n + k] = c * a - s * b;
          W[j * n + k] = s * a + c * b;
        }
        const di = d[i], dj = d[j];
        d[i] = c * c * di + s * s * dj;
        d[j] = s * s * di + c * c * dj;
        w[i] = 0; w[j] = r;
        active[active.length - 1] = j;
        continue;
      }
    }
    active.push(j);
  }
  return active;
}

/** Newton's method for root a: g(tau) = -tau + rho w_k^2 - rho tau sum_j w_j^2 / (delta_j - tau), delta_j = d_j - d_k. */
function newtonRoot(d: Float64Array, w: Float64Array, active: number[], a: number, rhoRe: number, rhoIm: number, tr: Float64Array, ti: Float64Array): void {
  const k = active[a], m = active.length;
  const w2 = w[k] * w[k];
  // second-order start
  let s0 = 0;
  for (let c = 0; c < m; c++) if (c !== a) { const j = active[c]; s0 += (w[j] * w[j]) / (d[j] - d[k]); }
  const nr = rhoRe * w2, ni = rhoIm * w2, er = 1 + rhoRe * s0, ei = rhoIm * s0;
  const den0 = er * er + ei * ei;
  let xr = (nr * er + ni * ei) / den0, xi = (ni * er - nr * ei) / den0;
  const size = cabs(nr, ni);
  let last = Infinity;
  for (let it = 0; ; it++) {
    if (it === MAX_NEWTON) throw new NumericalError(`rank-one eigen-solver: root ${k + 1} did not converge in ${MAX_NEWTON} Newton steps`, 'no-convergence');
    // S = sum w_j^2 / (delta_j - tau), P = sum w_j^2 delta_j / (delta_j - tau)^2
    let sr = 0, si = 0, pr = 0, pi = 0;
    for (let c = 0; c < m; c++) {
      if (c === a) continue;
      const j = active[c], delta = d[j] - d[k], q = w[j] * w[j];
      const ar = delta - xr, ai = -xi, inv = 1 / (ar * ar + ai * ai);
      const ir = ar * inv, ii = -ai * inv;
      const fr = q * ir, fi = q * ii;
      sr += fr; si += fi;
      // q delta inv^2
      pr += delta * (fr * ir - fi * ii); pi += delta * (fr * ii + fi * ir);
    }
    // g = -tau + rho w_k^2 - rho tau S ; g' = -1 - rho P
    const tsr = xr * sr - xi * si, tsi = xr * si + xi * sr;
    const gr = -xr + nr - (rhoRe * tsr - rhoIm * tsi), gi = -xi + ni - (rhoRe * tsi + rhoIm * tsr);
    const hr = -1 - (rhoRe * pr - rhoIm * pi), hi = -(rhoRe * pi + rhoIm * pr);
    const hd = hr * hr + hi * hi;
    const dr = (gr * hr + gi * hi) / hd, di = (gi * hr - gr * hi) / hd;
    xr -= dr; xi -= di;
    // converged to rounding, or stalled there (the step no longer shrinks once it is at the noise of g)
    const step = cabs(dr, di), ref = cabs(xr, xi) + size;
    if (step <= 8 * EPS * ref || (step <= 1e-10 * ref && step >= 0.5 * last)) break;
    last = step;
  }
  tr[k] = xr; ti[k] = xi;
}

/** Distinct roots that add up to the trace: sum tau_k = rho sum w_k^2 (the trace of rho w w^T). */
function checkRoots(d: Float64Array, w: Float64Array, active: number[], tr: Float64Array, ti: Float64Array, rhoRe: number, rhoIm: number, scale: number): void {
  const m = active.length;
  let sumR = 0, sumI = 0, w2 = 0;
  for (let a = 0; a < m; a++) {
    const k = active[a];
    sumR += tr[k]; sumI += ti[k]; w2 += w[k] * w[k];
    for (let c = 0; c < a; c++) {
      const j = active[c];
      const gap = cabs(d[k] - d[j] + tr[k] - tr[j], ti[k] - ti[j]);
      if (!(gap > 1e-7 * scale)) throw new NumericalError(`rank-one eigen-solver: roots ${j + 1} and ${k + 1} meet (gap ${gap.toExponential(2)}): Newton found one root twice or the matrix is near an exceptional point`, 'no-convergence');
    }
  }
  const miss = cabs(sumR - rhoRe * w2, sumI - rhoIm * w2);
  if (!(miss <= 1e-11 * scale)) throw new NumericalError(`rank-one eigen-solver: the roots miss the trace by ${miss.toExponential(2)}`, 'no-convergence');
}
