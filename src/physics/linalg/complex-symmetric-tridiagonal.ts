import { NumericalError } from '../../errors.js';
import { type ComplexMatrix, complexIdentity } from './complex-dense.js';
import { cabs, csqrt } from './complex-scalar.js';
import { scratch, type Workspace } from './workspace.js';

/** S = Q T Q^T with T complex symmetric tridiagonal and Q complex orthogonal (Q^T Q = I, not unitary). */
export interface ComplexSymmetricTridiagonal {
  readonly n: number;
  /** Diagonal of T. */
  readonly diagRe: Float64Array;
  readonly diagIm: Float64Array;
  /** Off-diagonal of T: entry k couples k and k + 1 (length n, the last is zero). */
  readonly offRe: Float64Array;
  readonly offIm: Float64Array;
  /**
   * Q = P_0 P_1 ... P_{n-3}, P_t = I - c_t v_t v_t^T acting on rows and columns t+1..n-1: v_t is row t of
   * (reflRe, reflIm), entries t+1..n-1; c_t = 2 / (v_t^T v_t) is (cRe[t], cIm[t]), zero for a skipped step.
   */
  readonly reflRe: Float64Array;
  readonly reflIm: Float64Array;
  readonly cRe: Float64Array;
  readonly cIm: Float64Array;
  /** True when every reflector is real (Q is real). */
  readonly realReflectors: boolean;
  /** Largest |v|^2 / |v^T v| over the reflectors (1 for real input): how far Q is from unitary. */
  readonly growth: number;
}

/** Reflectors whose |v|^2 / |v^T v| passes this are refused (Q would amplify rounding errors too much). */
export const MAX_REFLECTOR_GROWTH = 1e4;

/**
 * Reduction of a complex symmetric matrix (S^T = S) to complex symmetric tridiagonal form by complex
 * orthogonal Householder reflectors P = I - 2 v v^T / (v^T v): Householder tridiagonalization (Golub and Van
 * Loan, Matrix Computations, 4th ed., alg. 8.3.1) with transposes in place of conjugate transposes, as for
 * complex symmetric eigenproblems in Cullum and Willoughby, SIAM J. Matrix Anal. Appl. 17, 83 (1996). The
 * reflectors leave e_1 fixed, so the first row and column of S keep their meaning. Steps whose data are real
 * run in real arithmetic. Q is kept as its reflectors (applyQ, formQ). With `inPlace` S is overwritten.
 * Throws NumericalError when a reflector is close to isotropic (v^T v near 0).
 */
export function complexSymmetricTridiagonal(s: ComplexMatrix, ws?: Workspace, inPlace = false): ComplexSymmetricTridiagonal {
  const { n } = s;
  const re = inPlace ? s.re : Float64Array.from(s.re), im = inPlace ? s.im : Float64Array.from(s.im);
  const reflRe = scratch(ws, 'cst.vr', n * n), reflIm = scratch(ws, 'cst.vi', n * n);
  const cRe = scratch(ws, 'cst.cr', n), cIm = scratch(ws, 'cst.ci', n);
  const pr = scratch(ws, 'cst.pr', n), pi = scratch(ws, 'cst.pi', n);
  let growth = 1;
  let real = false; // once the trailing block is real it stays real
  let realReflectors = true;
  for (let k = 0; k < n - 2; k++) {
    const f = k + 1; // the reflector acts on rows and columns f..n-1
    let scale = 0;
    for (let i = f; i < n; i++) scale = Math.max(scale, Math.abs(re[i * n + k]) + Math.abs(im[i * n + k]));
    let tail = 0;
    for (let i = f + 1; i < n; i++) tail += Math.abs(re[i * n + k]) + Math.abs(im[i * n + k]);
    if (tail === 0) continue;
    if (!real) real = isRealBlock(im, n, k, f);
    // x = column k below the diagonal, scaled; alpha = sqrt(x^T x), v = x + alpha e_1 with the sign that keeps |v_1| large
    const o = k * n;
    let sr = 0, si = 0;
    for (let i = f; i < n; i++) {
      const xr = re[i * n + k] / scale, xi = im[i * n + k] / scale;
      reflRe[o + i] = xr; reflIm[o + i] = xi;
      sr += xr * xr - xi * xi; si += 2 * xr * xi;
    }
    let [ar, ai] = csqrt(sr, si);
    if (reflRe[o + f] * ar + reflIm[o + f] * ai < 0) { ar = -ar; ai = -ai; }
    reflRe[o + f] += ar; reflIm[o + f] += ai;
    // v^T v = 2 alpha (alpha + x_1) and |v|^2
    let vvr = 0, vvi = 0, vn = 0;
    for (let i = f; i < n; i++) {
      const a = reflRe[o + i], b = reflIm[o + i];
      vvr += a * a - b * b; vvi += 2 * a * b; vn += a * a + b * b;
    }
    const g = vn / cabs(vvr, vvi);
    if (!(g <= MAX_REFLECTOR_GROWTH)) {
      throw new NumericalError(`complex symmetric tridiagonalization: reflector ${k + 1} is nearly isotropic (|v|^2 / |v^T v| = ${g.toExponential(2)})`, 'isotropic-reflector');
    }
    growth = Math.max(growth, g);
    // c = 2 / (v^T v)
    const den = vvr * vvr + vvi * vvi;
    const cr = (2 * vvr) / den, ci = (-2 * vvi) / den;
    cRe[k] = cr; cIm[k] = ci;
    if (!real) realReflectors = false;
    const v = reflRe.subarray(o, o + n), vi = reflIm.subarray(o, o + n);
    if (real) rank2Real(re, n, f, v, pr, cr);
    else rank2Complex(re, im, n, f, v, vi, pr, pi, cr, ci);
    // column and row k: -alpha e_1 times the scale
    re[f * n + k] = re[k * n + f] = -ar * scale;
    im[f * n + k] = im[k * n + f] = -ai * scale;
    for (let i = f + 1; i < n; i++) { re[i * n + k] = re[k * n + i] = 0; im[i * n + k] = im[k * n + i] = 0; }
  }
  const diagRe = scratch(ws, 'cst.dr', n), diagIm = scratch(ws, 'cst.di', n), offRe = scratch(ws, 'cst.er', n), offIm = scratch(ws, 'cst.ei', n);
  for (let i = 0; i < n; i++) {
    diagRe[i] = re[i * n + i]; diagIm[i] = im[i * n + i];
    if (i + 1 < n) { offRe[i] = re[(i + 1) * n + i]; offIm[i] = im[(i + 1) * n + i]; }
  }
  return { n, diagRe, diagIm, offRe, offIm, reflRe, reflIm, cRe, cIm, realReflectors, growth };
}

/** True when column k below the diagonal and the trailing block from f on have no imaginary part. */
function isRealBlock(im: Float64Array, n: number, k: number, f: number): boolean {
  for (let i = f; i < n; i++) if (im[i * n + k] !== 0) return false;
  for (let i = f; i < n; i++) for (let j = f; j < n; j++) if (im[i * n + j] !== 0) return false;
  return true;
}

/** S22 <- P S22 P for real data: p = c S v, w = p - (c/2)(p^T v) v, S22 -= v w^T + w v^T. */
function rank2Real(re: Float64Array, n: number, f: number, v: Float64Array, p: Float64Array, c: number): void {
  for (let i = f; i < n; i++) {
    const ri = i * n;
    let s = 0;
    for (let j = f; j < n; j++) s += re[ri + j] * v[j];
    p[i] = c * s;
  }
  let pv = 0;
  for (let i = f; i < n; i++) pv += p[i] * v[i];
  const h = 0.5 * c * pv;
  for (let i = f; i < n; i++) p[i] -= h * v[i];
  for (let i = f; i < n; i++) {
    const ri = i * n, vi = v[i], wi = p[i];
    for (let j = f; j < n; j++) re[ri + j] -= vi * p[j] + wi * v[j];
  }
}

function rank2Complex(re: Float64Array, im: Float64Array, n: number, f: number, vr: Float64Array, vi: Float64Array, pr: Float64Array, pi: Float64Array, cr: number, ci: number): void {
  for (let i = f; i < n; i++) {
    const ri = i * n;
    let sr = 0, si = 0;
    for (let j = f; j < n; j++) {
      const ar = re[ri + j], ai = im[ri + j];
      sr += ar * vr[j] - ai * vi[j];
      si += ar * vi[j] + ai * vr[j];
    }
    pr[i] = cr * sr - ci * si;
    pi[i] = cr * si + ci * sr;
  }
  let tr = 0, ti = 0;
  for (let i = f; i < n; i++) { tr += pr[i] * vr[i] - pi[i] * vi[i]; ti += pr[i] * vi[i] + pi[i] * vr[i]; }
  const hr = 0.5 * (cr * tr - ci * ti), hi = 0.5 * (cr * ti + ci * tr);
  for (let i = f; i < n; i++) {
    const a = vr[i], b = vi[i];
    pr[i] -= hr * a - hi * b;
    pi[i] -= hr * b + hi * a;
  }
  for (let i = f; i < n; i++) {
    const ri = i * n, ar = vr[i], ai = vi[i], br = pr[i], bi = pi[i];
    for (let j = f; j < n; j++) {
      re[ri + j] -= ar * pr[j] - ai * pi[j] + br * vr[j] - bi * vi[j];
      im[ri + j] -= ar * pi[j] + ai * pr[j] + br * vi[j] + bi * vr[j];
    }
  }
}

/**
 * Y <- Q Y for an n x n complex Y (row-major), applying the reflectors last to first:
 * rows t+1.. of Y lose c_t v_t (v_t^T Y). `wr`, `wi` are scratch rows of length n.
 */
export function applyQ(t: ComplexSymmetricTridiagonal, y: ComplexMatrix, ws?: Workspace): void {
  const { n, reflRe, reflIm, cRe, cIm } = t;
  const { re: yr, im: yi } = y;
  const wr = scratch(ws, 'cst.wr', n), wi = scratch(ws, 'cst.wi', n);
  for (let k = n - 3; k >= 0; k--) {
    const cr = cRe[k], ci = cIm[k];
    if (cr === 0 && ci === 0) continue;
    const f = k + 1, o = k * n;
    wr.fill(0);
    wi.fill(0);
    if (t.realReflectors) {
      // two rows per pass (they share the loads and stores of w)
      let i = f;
      for (; i + 1 < n; i += 2) {
        const a = reflRe[o + i], b = reflRe[o + i + 1], ri = i * n, rj = ri + n;
        for (let j = 0; j < n; j++) { wr[j] += a * yr[ri + j] + b * yr[rj + j]; wi[j] += a * yi[ri + j] + b * yi[rj + j]; }
      }
      if (i < n) {
        const a = reflRe[o + i], ri = i * n;
        for (let j = 0; j < n; j++) { wr[j] += a * yr[ri + j]; wi[j] += a * yi[ri + j]; }
      }
      for (let r = f; r < n; r++) {
        const a = cr * reflRe[o + r], ri = r * n;
        for (let j = 0; j < n; j++) { yr[ri + j] -= a * wr[j]; yi[ri + j] -= a * wi[j]; }
      }
      continue;
    }
    for (let i = f; i < n; i++) {
      const ar = reflRe[o + i], ai = reflIm[o + i], ri = i * n;
      for (let j = 0; j < n; j++) {
        const br = yr[ri + j], bi = yi[ri + j];
        wr[j] += ar * br - ai * bi; wi[j] += ar * bi + ai * br;
      }
    }
    for (let i = f; i < n; i++) {
      const vr = reflRe[o + i], vi = reflIm[o + i];
      const ar = cr * vr - ci * vi, ai = cr * vi + ci * vr, ri = i * n;
      for (let j = 0; j < n; j++) {
        yr[ri + j] -= ar * wr[j] - ai * wi[j];
        yi[ri + j] -= ar * wi[j] + ai * wr[j];
      }
    }
  }
}

/** Q as a matrix (for checks; the eigen-solver applies the reflectors directly). */
export function formQ(t: ComplexSymmetricTridiagonal): ComplexMatrix {
  const q = complexIdentity(t.n);
  applyQ(t, q);
  return q;
}
