import { EigenvalueDecomposition, Matrix } from 'ml-matrix';

/** Eigen-decomposition of a real symmetric matrix, eigenvalues ascending. */
export interface SymmetricEigen {
  readonly n: number;
  /** Eigenvalues in ascending order. */
  readonly values: Float64Array;
  /** Eigenvectors as columns, row-major: vectors[m * n + a] = c_ma (component on basis m of state a). */
  readonly vectors: Float64Array;
}

/**
 * Eigenvalues and orthonormal eigenvectors of a symmetric row-major matrix (Householder tridiagonalization
 * and the implicit QL algorithm, as in ml-matrix / JAMA). Each eigenvector's sign is fixed so that its
 * largest-magnitude component is positive, which makes results independent of the solver's sign choice.
 */
export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) rows.push(Array.from(a.subarray(i * n, i * n + n)));
  const evd = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  const raw = evd.realEigenvalues;
  const V = evd.eigenvectorMatrix;
  const order = raw.map((v, i) => [v, i] as const).sort((p, q) => p[0] - q[0]);
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  order.forEach(([v, src], a) => {
    values[a] = v;
    let big = 0;
    for (let m = 0; m < n; m++) {
      const c = V.get(m, src);
      if (Math.abs(c) > Math.abs(big) + 1e-12) big = c;
    }
    const sign = big < 0 ? -1 : 1;
    for (let m = 0; m < n; m++) vectors[m * n + a] = sign * V.get(m, src);
  });
  return { n, values, vectors };
}
