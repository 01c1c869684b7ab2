import { NumericalError } from '../../errors.js';
import { type ComplexMatrix, complexZeros } from './complex-dense.js';
import { complexHessenberg } from './complex-hessenberg.js';
import { complexSchur } from './complex-schur.js';
import { triangularEigenvectors } from './complex-triangular-eigenvectors.js';

/** Eigenvalues and right eigenvectors of a general complex matrix: A V = V diag(values). */
export interface ComplexEigen {
  readonly n: number;
  readonly valuesRe: Float64Array;
  readonly valuesIm: Float64Array;
  /** Eigenvectors as columns (row-major n x n), each of unit 2-norm. */
  readonly vectors: ComplexMatrix;
}

/**
 * Eigen-decomposition of a dense complex matrix, in the order of the classical algorithm (EISPACK comqr2;
 * LAPACK zgeev without balancing): Householder reduction to Hessenberg form, shifted QR to the complex Schur
 * form A = Z T Z^H, eigenvectors of T by back substitution, V = Z X, columns normalized.
 * Golub and Van Loan, Matrix Computations, 4th ed., sec. 7.4-7.6. Eigenvalues come in the order of T's
 * diagonal. No balancing: intended for matrices whose entries are of comparable size.
 */
export function complexEigen(a: ComplexMatrix): ComplexEigen {
  const { n } = a;
  for (let k = 0; k < n * n; k++) {
    if (!Number.isFinite(a.re[k]) || !Number.isFinite(a.im[k])) throw new NumericalError('eigenvalue problem: the matrix has non-finite entries');
  }
  const { h, q } = complexHessenberg(a);
  complexSchur(h, q);
  const x = triangularEigenvectors(h);
  const valuesRe = new Float64Array(n), valuesIm = new Float64Array(n);
  for (let k = 0; k < n; k++) { valuesRe[k] = h.re[k * n + k]; valuesIm[k] = h.im[k * n + k]; }
  // V = Z X with X upper triangular: V_rc = sum_{m <= c} Z_rm X_mc
  const v = complexZeros(n);
  const { re: vr, im: vi } = v, { re: zr, im: zi } = q, { re: xr, im: xi } = x;
  for (let r = 0; r < n; r++) {
    const rr = r * n;
    for (let m = 0; m < n; m++) {
      const ar = zr[rr + m], ai = zi[rr + m];
      if (ar === 0 && ai === 0) continue;
      const rm = m * n;
      for (let c = m; c < n; c++) {
        const br = xr[rm + c], bi = xi[rm + c];
        vr[rr + c] += ar * br - ai * bi;
        vi[rr + c] += ar * bi + ai * br;
      }
    }
  }
  const norm = new Float64Array(n);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) norm[c] += vr[r * n + c] ** 2 + vi[r * n + c] ** 2;
  for (let c = 0; c < n; c++) norm[c] = 1 / Math.sqrt(norm[c]);
  for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) { vr[r * n + c] *= norm[c]; vi[r * n + c] *= norm[c]; }
  return { n, valuesRe, valuesIm, vectors: v };
}
