import { NumericalError } from '../../errors.js';
import { type ComplexMatrix, complexCopy, complexZeros } from './complex-dense.js';

/** LU factors with partial pivoting of a complex square matrix: P A = L U (L unit lower), packed in lu. */
export interface ComplexLu {
  readonly lu: ComplexMatrix;
  readonly pivots: Int32Array;
}

/**
 * Complex LU factorization with partial pivoting on |re| + |im| (Golub and Van Loan, Matrix Computations,
 * 4th ed., alg. 3.4.1, in complex arithmetic). Throws NumericalError on a zero pivot.
 */
export function complexLuFactor(a: ComplexMatrix): ComplexLu {
  const lu = complexCopy(a);
  const pivots = new Int32Array(lu.n);
  complexLuFactorInPlace(lu.n, lu.re, lu.im, pivots);
  return { lu, pivots };
}

/** complexLuFactor on the n x n matrix (re, im), overwritten by its factors; the pivots go to `pivots`. */
export function complexLuFactorInPlace(n: number, re: Float64Array, im: Float64Array, pivots: Int32Array): void {
  for (let k = 0; k < n; k++) {
    let p = k, best = -1;
    for (let i = k; i < n; i++) {
      const v = Math.abs(re[i * n + k]) + Math.abs(im[i * n + k]);
      if (v > best) { best = v; p = i; }
    }
    pivots[k] = p;
    if (!(best > 0)) throw new NumericalError(`complex matrix is singular (column ${k + 1} of ${n} has no pivot)`, 'singular');
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const a = k * n + j, b = p * n + j;
        let t = re[a]; re[a] = re[b]; re[b] = t;
        t = im[a]; im[a] = im[b]; im[b] = t;
      }
    }
    const rk = k * n;
    const pr = re[rk + k], pi = im[rk + k];
    const d = pr * pr + pi * pi;
    const ir = pr / d, ii = -pi / d;
    for (let i = k + 1; i < n; i++) {
      const ri = i * n;
      const ar = re[ri + k], ai = im[ri + k];
      if (ar === 0 && ai === 0) continue;
      const fr = ar * ir - ai * ii, fi = ar * ii + ai * ir;
      re[ri + k] = fr;
      im[ri + k] = fi;
      for (let j = k + 1; j < n; j++) {
        const br = re[rk + j], bi = im[rk + j];
        re[ri + j] -= fr * br - fi * bi;
        im[ri + j] -= fr * bi + fi * br;
      }
    }
  }
}

/**
 * Inverse from the LU factors: solves A X = I for all columns at once, row-oriented (forward substitution
 * with L, back substitution with U, then the column swaps of P).
 */
export function complexLuInverse(f: ComplexLu): ComplexMatrix {
  const x = complexZeros(f.lu.n);
  complexLuInverseInto(f.lu.n, f.lu.re, f.lu.im, f.pivots, x.re, x.im);
  return x;
}

/** complexLuInverse of the factors (re, im, pivots) of an n x n matrix into (xr, xi), n * n entries each. */
export function complexLuInverseInto(n: number, re: Float64Array, im: Float64Array, pivots: Int32Array, xr: Float64Array, xi: Float64Array): void {
  // X = U^-1 L^-1 P: start from P (the row swaps applied to I), apply L^-1 and U^-1 to whole rows.
  xr.fill(0, 0, n * n);
  xi.fill(0, 0, n * n);
  for (let i = 0; i < n; i++) xr[i * n + i] = 1;
  for (let k = 0; k < n; k++) {
    const p = pivots[k];
    if (p === k) continue;
    for (let j = 0; j < n; j++) { const t = xr[k * n + j]; xr[k * n + j] = xr[p * n + j]; xr[p * n + j] = t; }
  }
  for (let i = 1; i < n; i++) {
    const ri = i * n;
    for (let k = 0; k < i; k++) {
      const lr = re[ri + k], li = im[ri + k];
      if (lr === 0 && li === 0) continue;
      const rk = k * n;
      for (let j = 0; j < n; j++) {
        const br = xr[rk + j], bi = xi[rk + j];
        xr[ri + j] -= lr * br - li * bi;
        xi[ri + j] -= lr * bi + li * br;
      }
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    const ri = i * n;
    for (let k = i + 1; k < n; k++) {
      const ur = re[ri + k], ui = im[ri + k];
      if (ur === 0 && ui === 0) continue;
      const rk = k * n;
      for (let j = 0; j < n; j++) {
        const br = xr[rk + j], bi = xi[rk + j];
        xr[ri + j] -= ur * br - ui * bi;
        xi[ri + j] -= ur * bi + ui * br;
      }
    }
    const pr = re[ri + i], pi = im[ri + i];
    const d = pr * pr + pi * pi;
    const ir = pr / d, ii = -pi / d;
    for (let j = 0; j < n; j++) {
      const br = xr[ri + j], bi = xi[ri + j];
      xr[ri + j] = br * ir - bi * ii;
      xi[ri + j] = br * ii + bi * ir;
    }
  }
}

/** Solve A x = b in place (b split into re, im) with the LU factors of A. */
export function complexLuSolve(f: ComplexLu, br: Float64Array, bi: Float64Array): void {
  const { lu, pivots } = f;
  const { n, re, im } = lu;
  for (let k = 0; k < n; k++) {
    const p = pivots[k];
    if (p !== k) {
      let t = br[k]; br[k] = br[p]; br[p] = t;
      t = bi[k]; bi[k] = bi[p]; bi[p] = t;
    }
  }
  for (let i = 1; i < n; i++) {
    const ri = i * n;
    let sr = br[i], si = bi[i];
    for (let j = 0; j < i; j++) {
      const lr = re[ri + j], li = im[ri + j];
      sr -= lr * br[j] - li * bi[j];
      si -= lr * bi[j] + li * br[j];
    }
    br[i] = sr; bi[i] = si;
  }
  for (let i = n - 1; i >= 0; i--) {
    const ri = i * n;
    let sr = br[i], si = bi[i];
    for (let j = i + 1; j < n; j++) {
      const ur = re[ri + j], ui = im[ri + j];
      sr -= ur * br[j] - ui * bi[j];
      si -= ur * bi[j] + ui * br[j];
    }
    const pr = re[ri + i], pi = im[ri + i];
    const d = pr * pr + pi * pi;
    br[i] = (sr * pr + si * pi) / d;
    bi[i] = (si * pr - sr * pi) / d;
  }
}
