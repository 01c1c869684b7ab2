import { NumericalError } from '../../errors.js';
import { cabs, cdiv, csqrt } from './complex-scalar.js';
import { scratch, type Workspace } from './workspace.js';

const EPS = Number.EPSILON;
/** Eigenvalues closer than this fraction of ||T|| are treated as a cluster (LAPACK dstein's ORTOL). */
const CLUSTER = 1e-3;
const MAX_ITER = 5;
/** A vector whose residual stalls below ACCEPT m eps ||T|| is kept (its eigenvalue is that ill-conditioned). */
const ACCEPT = 1e4;

/**
 * Eigenvectors of a complex symmetric tridiagonal matrix T (diagonal d, off-diagonal e, e[k] coupling k and
 * k + 1) for given eigenvalues, by inverse iteration: LU with partial pivoting of T - lambda I (LAPACK's
 * zgttrf/zgtts2 layout), a fixed pseudo-random start vector, and, within a cluster of close eigenvalues,
 * orthogonalization against the earlier vectors in the bilinear form y^T x (the form in which eigenvectors
 * of a complex symmetric matrix are orthogonal: Horn and Johnson, Matrix Analysis, 2nd ed., sec. 4.4).
 * This is LAPACK's dstein (Anderson et al., LAPACK Users' Guide, 3rd ed.) with x^T y in place of x^H y.
 * Each vector is scaled to y^T y = 1. Returns Y row-major m x m, column j for eigenvalue j (in the workspace
 * when one is given).
 * Throws NumericalError when a vector is nearly isotropic (y^T y near 0: an eigenvalue near a defective one)
 * or its residual does not reach m eps ||T||.
 */
export function tridiagonalEigenvectors(
  dr: Float64Array, di: Float64Array, er: Float64Array, ei: Float64Array,
  lr: Float64Array, li: Float64Array, ws?: Workspace,
): { re: Float64Array; im: Float64Array } {
  const m = dr.length;
  const yr = scratch(ws, 'tei.yr', m * m), yi = scratch(ws, 'tei.yi', m * m);
  let norm = 0;
  for (let k = 0; k < m; k++) {
    const off = (k > 0 ? cabs(er[k - 1], ei[k - 1]) : 0) + (k + 1 < m ? cabs(er[k], ei[k]) : 0);
    norm = Math.max(norm, cabs(dr[k], di[k]) + off);
  }
  if (m === 1) { yr[0] = 1; return { re: yr, im: yi }; }
  const tiny = EPS * Math.max(norm, Number.MIN_VALUE);
  const w = workspace(m, ws);
  const xr = scratch(ws, 'tei.xr', m), xi = scratch(ws, 'tei.xi', m);
  for (let j = 0; j < m; j++) {
    let mr = lr[j], mi = li[j];
    for (let i = 0; i < j; i++) {
      // separate equal eigenvalues a little (dstein: 10 eps |lambda|), so the factorizations differ
      if (Math.abs(lr[i] - mr) + Math.abs(li[i] - mi) < 10 * tiny) mr += 10 * tiny;
    }
    factor(w, dr, di, er, ei, mr, mi, tiny);
    let seed = 0x9e3779b9 ^ (j * 2654435761);
    for (let k = 0; k < m; k++) {
      seed = (Math.imul(seed, 1664525) + 1013904223) >>> 0;
      xr[k] = seed / 4294967296 - 0.5; xi[k] = 0;
    }
    let converged = false;
    let best = Infinity;
    for (let it = 0; it < MAX_ITER && !converged; it++) {
      solve(w, xr, xi);
      for (let i = 0; i < j; i++) {
        if (Math.abs(lr[i] - lr[j]) + Math.abs(li[i] - li[j]) > CLUSTER * norm) continue;
        // x -= (y_i^T x) y_i, with y_i^T y_i = 1
        let pr = 0, pi = 0;
        for (let k = 0; k < m; k++) {
          const ar = yr[k * m + i], ai = yi[k * m + i];
          pr += ar * xr[k] - ai * xi[k]; pi += ar * xi[k] + ai * xr[k];
        }
        for (let k = 0; k < m; k++) {
          const ar = yr[k * m + i], ai = yi[k * m + i];
          xr[k] -= pr * ar - pi * ai; xi[k] -= pr * ai + pi * ar;
        }
      }
      let big = 0;
      for (let k = 0; k < m; k++) big = Math.max(big, Math.abs(xr[k]) + Math.abs(xi[k]));
      if (!(big > 0) || !Number.isFinite(big)) break;
      for (let k = 0; k < m; k++) { xr[k] /= big; xi[k] /= big; }
      // the complex Rayleigh quotient x^T T x / x^T x is stationary at eigenvectors of a symmetric T
      const [rr, ri] = rayleigh(dr, di, er, ei, xr, xi);
      const res = residual(dr, di, er, ei, rr, ri, xr, xi);
      if (res < best) { best = res; lr[j] = rr; li[j] = ri; }
      converged = res <= 4 * m * tiny;
    }
    if (!converged && best <= ACCEPT * m * tiny) converged = true;
    if (!converged) throw new NumericalError(`inverse iteration: eigenvector ${j + 1} of ${m} did not converge`, 'no-convergence');
    let qr = 0, qi = 0, qn = 0;
    for (let k = 0; k < m; k++) { qr += xr[k] * xr[k] - xi[k] * xi[k]; qi += 2 * xr[k] * xi[k]; qn += xr[k] * xr[k] + xi[k] * xi[k]; }
    if (cabs(qr, qi) < 1e-10 * qn) throw new NumericalError(`eigenvector ${j + 1} of ${m} is nearly isotropic (y^T y = 0): the matrix is close to a defective one`, 'isotropic-eigenvector');
    const [sr, si] = csqrt(qr, qi);
    const [ir, ii] = cdiv(1, 0, sr, si);
    for (let k = 0; k < m; k++) {
      yr[k * m + j] = xr[k] * ir - xi[k] * ii; yi[k * m + j] = xr[k] * ii + xi[k] * ir;
    }
  }
  return { re: yr, im: yi };
}

interface Work {
  /** reciprocal pivots 1 / U_ii */
  pr: Float64Array; pi: Float64Array;
  lr: Float64Array; li: Float64Array;
  ur: Float64Array; ui: Float64Array; u2r: Float64Array; u2i: Float64Array;
  /** 1 where rows i and i + 1 were interchanged */
  swap: Float64Array;
}

function workspace(m: number, ws?: Workspace): Work {
  const f = (name: string) => scratch(ws, `tei.${name}`, m);
  return { pr: f('pr'), pi: f('pi'), lr: f('lr'), li: f('li'), ur: f('ur'), ui: f('ui'), u2r: f('u2r'), u2i: f('u2i'), swap: f('swap') };
}

/** LU with partial pivoting of T - mu I (zgttrf): a zero pivot is replaced by `tiny`; pivots kept as reciprocals. */
function factor(w: Work, dr: Float64Array, di: Float64Array, er: Float64Array, ei: Float64Array, mr: number, mi: number, tiny: number): void {
  const m = dr.length;
  const { pr, pi, lr, li, ur, ui, u2r, u2i, swap } = w;
  // pr/pi hold the running diagonal until it is inverted
  for (let k = 0; k < m; k++) {
    pr[k] = dr[k] - mr; pi[k] = di[k] - mi;
    lr[k] = er[k]; li[k] = ei[k]; ur[k] = er[k]; ui[k] = ei[k];
    u2r[k] = 0; u2i[k] = 0; swap[k] = 0;
  }
  for (let i = 0; i < m; i++) {
    const last = i === m - 1;
    if (last || Math.abs(pr[i]) + Math.abs(pi[i]) >= Math.abs(lr[i]) + Math.abs(li[i])) {
      if (pr[i] === 0 && pi[i] === 0) pr[i] = tiny;
      const d = pr[i] * pr[i] + pi[i] * pi[i];
      const ir = pr[i] / d, ii = -pi[i] / d;
      pr[i] = ir; pi[i] = ii;
      if (last) break;
      const fr = lr[i] * ir - li[i] * ii, fi = lr[i] * ii + li[i] * ir;
      lr[i] = fr; li[i] = fi;
      pr[i + 1] -= fr * ur[i] - fi * ui[i]; pi[i + 1] -= fr * ui[i] + fi * ur[i];
    } else {
      // interchange rows i and i + 1: the pivot is the subdiagonal entry
      const d = lr[i] * lr[i] + li[i] * li[i];
      const ir = lr[i] / d, ii = -li[i] / d;
      const fr = pr[i] * ir - pi[i] * ii, fi = pr[i] * ii + pi[i] * ir;
      pr[i] = ir; pi[i] = ii;
      lr[i] = fr; li[i] = fi;
      const tr = ur[i], ti = ui[i], nr = pr[i + 1], ni = pi[i + 1];
      ur[i] = nr; ui[i] = ni;
      pr[i + 1] = tr - (fr * nr - fi * ni); pi[i + 1] = ti - (fr * ni + fi * nr);
      if (i < m - 2) {
        const br = ur[i + 1], bi = ui[i + 1];
        u2r[i] = br; u2i[i] = bi;
        ur[i + 1] = -(fr * br - fi * bi); ui[i + 1] = -(fr * bi + fi * br);
      }
      swap[i] = 1;
    }
  }
}

function solve(w: Work, br: Float64Array, bi: Float64Array): void {
  const m = br.length;
  const { pr, pi, lr, li, ur, ui, u2r, u2i, swap } = w;
  for (let i = 0; i < m - 1; i++) {
    if (swap[i]) {
      const tr = br[i] - (lr[i] * br[i + 1] - li[i] * bi[i + 1]);
      const ti = bi[i] - (lr[i] * bi[i + 1] + li[i] * br[i + 1]);
      br[i] = br[i + 1]; bi[i] = bi[i + 1];
      br[i + 1] = tr; bi[i + 1] = ti;
    } else {
      br[i + 1] -= lr[i] * br[i] - li[i] * bi[i];
      bi[i + 1] -= lr[i] * bi[i] + li[i] * br[i];
    }
  }
  for (let i = m - 1; i >= 0; i--) {
    let sr = br[i], si = bi[i];
    if (i + 1 < m) { sr -= ur[i] * br[i + 1] - ui[i] * bi[i + 1]; si -= ur[i] * bi[i + 1] + ui[i] * br[i + 1]; }
    if (i + 2 < m) { sr -= u2r[i] * br[i + 2] - u2i[i] * bi[i + 2]; si -= u2r[i] * bi[i + 2] + u2i[i] * br[i + 2]; }
    br[i] = sr * pr[i] - si * pi[i]; bi[i] = sr * pi[i] + si * pr[i];
  }
}

/** x^T T x / x^T x. */
function rayleigh(dr: Float64Array, di: Float64Array, er: Float64Array, ei: Float64Array, xr: Float64Array, xi: Float64Array): [number, number] {
  const m = dr.length;
  let nr = 0, ni = 0, qr = 0, qi = 0;
  for (let k = 0; k < m; k++) {
    // (T x)_k
    let sr = dr[k] * xr[k] - di[k] * xi[k], si = dr[k] * xi[k] + di[k] * xr[k];
    if (k > 0) { sr += er[k - 1] * xr[k - 1] - ei[k - 1] * xi[k - 1]; si += er[k - 1] * xi[k - 1] + ei[k - 1] * xr[k - 1]; }
    if (k + 1 < m) { sr += er[k] * xr[k + 1] - ei[k] * xi[k + 1]; si += er[k] * xi[k + 1] + ei[k] * xr[k + 1]; }
    nr += xr[k] * sr - xi[k] * si; ni += xr[k] * si + xi[k] * sr;
    qr += xr[k] * xr[k] - xi[k] * xi[k]; qi += 2 * xr[k] * xi[k];
  }
  return cdiv(nr, ni, qr, qi);
}

/** ||(T - lambda I) x||_inf. */
function residual(dr: Float64Array, di: Float64Array, er: Float64Array, ei: Float64Array, lr: number, li: number, xr: Float64Array, xi: Float64Array): number {
  const m = dr.length;
  let worst = 0;
  for (let k = 0; k < m; k++) {
    const ar = dr[k] - lr, ai = di[k] - li;
    let sr = ar * xr[k] - ai * xi[k], si = ar * xi[k] + ai * xr[k];
    if (k > 0) { sr += er[k - 1] * xr[k - 1] - ei[k - 1] * xi[k - 1]; si += er[k - 1] * xi[k - 1] + ei[k - 1] * xr[k - 1]; }
    if (k + 1 < m) { sr += er[k] * xr[k + 1] - ei[k] * xi[k + 1]; si += er[k] * xi[k + 1] + ei[k] * xr[k + 1]; }
    worst = Math.max(worst, Math.abs(sr) + Math.abs(si));
  }
  return worst;
}
