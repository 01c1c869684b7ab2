import { cabs, csqrt } from './complex-scalar.js';

/**
 * Square complex matrices stored as split real and imaginary parts (row-major Float64Arrays):
 * entry (i, j) is re[i * n + j] + i im[i * n + j]. Small helpers shared by the complex routines.
 */
export interface ComplexMatrix {
  readonly n: number;
  readonly re: Float64Array;
  readonly im: Float64Array;
}

/**
 * Scale column c of a complex matrix (row-major n x n, split parts) so that v^T v = 1, the normalization of
 * eigenvectors of a complex symmetric matrix (Horn and Johnson, Matrix Analysis, 2nd ed., sec. 4.4). Returns
 * false, leaving the column as it was, when it is nearly isotropic: |v^T v| < minRatio |v|^2.
 */
export function normalizeColumnBilinear(re: Float64Array, im: Float64Array, n: number, c: number, minRatio: number): boolean {
  let qr = 0, qi = 0, qn = 0;
  for (let k = c; k < n * n; k += n) {
    const a = re[k], b = im[k];
    qr += a * a - b * b; qi += 2 * a * b; qn += a * a + b * b;
  }
  if (!(cabs(qr, qi) >= minRatio * qn)) return false;
  const [sr, si] = csqrt(qr, qi);
  const d = sr * sr + si * si, ir = sr / d, ii = -si / d;
  for (let k = c; k < n * n; k += n) {
    const a = re[k], b = im[k];
    re[k] = a * ir - b * ii; im[k] = a * ii + b * ir;
  }
  return true;
}

/** Zero n x n complex matrix. */
export function complexZeros(n: number): ComplexMatrix {
  return { n, re: new Float64Array(n * n), im: new Float64Array(n * n) };
}

/** Identity of order n. */
export function complexIdentity(n: number): ComplexMatrix {
  const m = complexZeros(n);
  for (let i = 0; i < n; i++) m.re[i * n + i] = 1;
  return m;
}

/** Independent copy. */
export function complexCopy(a: ComplexMatrix): ComplexMatrix {
  return { n: a.n, re: Float64Array.from(a.re), im: Float64Array.from(a.im) };
}

/** C = A B (plain triple loop, row-major, i-k-j order so that the inner loop runs along rows). */
export function complexMatMul(a: ComplexMatrix, b: ComplexMatrix): ComplexMatrix {
  const { n } = a;
  const c = complexZeros(n);
  const { re: ar, im: ai } = a, { re: br, im: bi } = b, { re: cr, im: ci } = c;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    for (let k = 0; k < n; k++) {
      const xr = ar[ri + k], xi = ai[ri + k];
      if (xr === 0 && xi === 0) continue;
      const rk = k * n;
      for (let j = 0; j < n; j++) {
        const yr = br[rk + j], yi = bi[rk + j];
        cr[ri + j] += xr * yr - xi * yi;
        ci[ri + j] += xr * yi + xi * yr;
      }
    }
  }
  return c;
}

/** Maximum absolute column sum, |z| = sqrt(re^2 + im^2) (the matrix 1-norm). */
export function complexNorm1(a: ComplexMatrix): number {
  const { n, re, im } = a;
  const col = new Float64Array(n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) col[j] += Math.hypot(re[i * n + j], im[i * n + j]);
  let best = 0;
  for (let j = 0; j < n; j++) best = Math.max(best, col[j]);
  return best;
}

/** Frobenius norm. */
export function complexNormF(a: ComplexMatrix): number {
  let s = 0;
  for (let k = 0; k < a.re.length; k++) s += a.re[k] * a.re[k] + a.im[k] * a.im[k];
  return Math.sqrt(s);
}
