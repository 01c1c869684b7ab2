import { NumericalError } from '../../errors.js';
import { type ComplexMatrix, complexCopy, complexIdentity } from './complex-dense.js';
import { csqrt } from './complex-scalar.js';

/** S = Q T Q^T with T complex symmetric tridiagonal and Q complex orthogonal (Q^T Q = I, not unitary). */
export interface ComplexSymmetricTridiagonal {
  readonly n: number;
  /** Diagonal of T. */
  readonly diagRe: Float64Array;
  readonly diagIm: Float64Array;
  /** Off-diagonal of T: entry k couples k and k + 1 (length n, the last is zero). */
  readonly offRe: Float64Array;
  readonly offIm: Float64Array;
  readonly q: ComplexMatrix;
  /** True when every reflector was real (Q has no imaginary part). */
  readonly qReal: boolean;
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
 * run in real arithmetic. Throws NumericalError when a reflector is close to isotropic (v^T v near 0).
 */
export function complexSymmetricTridiagonal(s: ComplexMatrix): ComplexSymmetricTridiagonal {
  const { n } = s;
  const a = complexCopy(s);
  const { re, im } = a;
  const vr = new Float64Array(n), vi = new Float64Array(n);
  const pr = new Float64Array(n), pi = new Float64Array(n);
  const reflectors: { k: number; vr: Float64Array; vi: Float64Array; cr: number; ci: number }[] = [];
  let growth = 1;
  let real = false; // once the trailing block is real it stays real
  for (let k = 0; k < n - 2; k++) {
    const f = k + 1; // the reflector acts on rows and columns f..n-1
    let scale = 0;
    for (let i = f; i < n; i++) scale = Math.max(scale, Math.abs(re[i * n + k]) + Math.abs(im[i * n + k]));
    let tail = 0;
    for (let i = f + 1; i < n; i++) tail += Math.abs(re[i * n + k]) + Math.abs(im[i * n + k]);
    if (tail === 0) continue;
    if (!real) real = isRealBlock(im, n, k, f);
    // x = column k below the diagonal, scaled; alpha = sqrt(x^T x), v = x + alpha e_1 with the sign that keeps |v_1| large
    let sr = 0, si = 0;
    for (let i = f; i < n; i++) {
      const xr = re[i * n + k] / scale, xi = im[i * n + k] / scale;
      vr[i] = xr; vi[i] = xi;
      sr += xr * xr - xi * xi; si += 2 * xr * xi;
    }
    let [ar, ai] = csqrt(sr, si);
    if (vr[f] * ar + vi[f] * ai < 0) { ar = -ar; ai = -ai; }
    vr[f] += ar; vi[f] += ai;
    // v^T v = 2 alpha (alpha + x_1) and |v|^2
    let vvr = 0, vvi = 0, vn = 0;
    for (let i = f; i < n; i++) { vvr += vr[i] * vr[i] - vi[i] * vi[i]; vvi += 2 * vr[i] * vi[i]; vn += vr[i] * vr[i] + vi[i] * vi[i]; }
    const g = vn / Math.hypot(vvr, vvi);
    if (!(g <= MAX_REFLECTOR_GROWTH)) {
      throw new NumericalError(`complex symmetric tridiagonalization: reflector ${k + 1} is nearly isotropic (|v|^2 / |v^T v| = ${g.toExponential(2)})`, 'isotropic-reflector');
    }
    growth = Math.max(growth, g);
    // c = 2 / (v^T v)
    const den = vvr * vvr + vvi * vvi;
    const cr = (2 * vvr) / den, ci = (-2 * vvi) / den;
    if (real) rank2Real(re, n, f, vr, pr, cr);
    else rank2Complex(re, im, n, f, vr, vi, pr, pi, cr, ci);
    // column and row k: -alpha e_1 times the scale
    re[f * n + k] = re[k * n + f] = -ar * scale;
    im[f * n + k] = im[k * n + f] = -ai * scale;
    for (let i = f + 1; i < n; i++) { re[i * n + k] = re[k * n + i] = 0; im[i * n + k] = im[k * n + i] = 0; }
    reflectors.push({ k: f, vr: vr.slice(f), vi: vi.slice(f), cr, ci });
  }
  const q = complexIdentity(n);
  // Q = P_0 P_1 ... : accumulate backward, each P_k touching rows and columns f..n-1 only
  let qReal = true;
  for (let t = reflectors.length - 1; t >= 0; t--) {
    const r = reflectors[t];
    const realReflector = r.ci === 0 && r.vi.every((x) => x === 0);
    if (qReal && realReflector) applyLeftReal(q.re, n, r.k, r.vr, r.cr);
    else { qReal = false; applyLeft(q, r); }
  }
  const diagRe = new Float64Array(n), diagIm = new Float64Array(n), offRe = new Float64Array(n), offIm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    diagRe[i] = re[i * n + i]; diagIm[i] = im[i * n + i];
    if (i + 1 < n) { offRe[i] = re[(i + 1) * n + i]; offIm[i] = im[(i + 1) * n + i]; }
  }
  return { n, diagRe, diagIm, offRe, offIm, q, qReal, growth };
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

/** Real case of applyLeft. */
function applyLeftReal(q: Float64Array, n: number, f: number, v: Float64Array, c: number): void {
  const m = n - f;
  const w = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const a = v[i], ri = (f + i) * n + f;
    if (a === 0) continue;
    for (let j = 0; j < m; j++) w[j] += a * q[ri + j];
  }
  for (let i = 0; i < m; i++) {
    const a = c * v[i], ri = (f + i) * n + f;
    if (a === 0) continue;
    for (let j = 0; j < m; j++) q[ri + j] -= a * w[j];
  }
}

/** Q[f.., f..] <- P Q[f.., f..] with P = I - c v v^T. */
function applyLeft(q: ComplexMatrix, r: { k: number; vr: Float64Array; vi: Float64Array; cr: number; ci: number }): void {
  const { n, re, im } = q;
  const f = r.k, m = n - f;
  const wr = new Float64Array(m), wi = new Float64Array(m);
  // w = v^T Q (row vector over columns f..n-1)
  for (let i = 0; i < m; i++) {
    const ri = (f + i) * n + f, ar = r.vr[i], ai = r.vi[i];
    if (ar === 0 && ai === 0) continue;
    for (let j = 0; j < m; j++) {
      const br = re[ri + j], bi = im[ri + j];
      wr[j] += ar * br - ai * bi;
      wi[j] += ar * bi + ai * br;
    }
  }
  for (let i = 0; i < m; i++) {
    // row factor c v_i
    const ar = r.cr * r.vr[i] - r.ci * r.vi[i], ai = r.cr * r.vi[i] + r.ci * r.vr[i];
    if (ar === 0 && ai === 0) continue;
    const ri = (f + i) * n + f;
    for (let j = 0; j < m; j++) {
      re[ri + j] -= ar * wr[j] - ai * wi[j];
      im[ri + j] -= ar * wi[j] + ai * wr[j];
    }
  }
}
