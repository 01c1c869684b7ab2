/**
 * Eigendecomposition of a real symmetric matrix (stored row-major in a Float64Array) with ml-matrix
 * (Householder tridiagonalization and QL iteration, after JAMA). Returns the eigenvalues and the
 * eigenvectors as the columns of a row-major matrix, so that A V = V diag(values).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';

export interface SymmetricEigen {
  values: Float64Array;
  /** Row-major n x n; column j is the eigenvector of values[j]. */
  vectors: Float64Array;
}

export function eigenSymmetric(a: Float64Array, n: number): SymmetricEigen {
  const rows: number[][] = new Array(n);
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n);
    for (let j = 0; j < n; j++) row[j] = i <= j ? a[i * n + j] : a[j * n + i]; // read the upper triangle
    rows[i] = row;
  }
  const evd = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  const v = evd.eigenvectorMatrix;
  const vectors = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) vectors[i * n + j] = v.get(i, j);
  return { values: Float64Array.from(evd.realEigenvalues), vectors };
}
