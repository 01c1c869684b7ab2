/**
 * Real vectorization of an N x N Hermitian density matrix into N^2 real numbers:
 *   [0, N)            populations rho_mm
 *   [N, N + P)        Re rho_mn for m < n (P = N(N-1)/2 pairs, row-major order of the upper triangle)
 *   [N + P, N + 2P)   Im rho_mn for m < n
 * Every superoperator used here maps Hermitian matrices to Hermitian matrices, so it is a real N^2 x N^2
 * matrix in this basis; a linear solve with it is a real solve of half the size of the complex one.
 */
export interface Layout {
  readonly n: number;
  readonly pairs: number;
  readonly dim: number;
  /** Row and column of each pair k (m < n). */
  readonly pairRow: Int32Array;
  readonly pairCol: Int32Array;
}

export function layout(n: number): Layout {
  const pairs = (n * (n - 1)) / 2;
  const pairRow = new Int32Array(pairs);
  const pairCol = new Int32Array(pairs);
  let k = 0;
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) { pairRow[k] = i; pairCol[k] = j; k++; }
  return { n, pairs, dim: n * n, pairRow, pairCol };
}

/** Index of pair (i, j), i < j, in the upper triangle enumeration. */
export function pairIndex(n: number, i: number, j: number): number {
  return i * n - (i * (i + 1)) / 2 + (j - i - 1);
}

/** Vectorize a real symmetric N x N matrix (row-major) into the layout (imaginary parts zero). */
export function vectorizeSymmetric(L: Layout, rho: Float64Array): Float64Array {
  const { n, pairs, pairRow, pairCol } = L;
  const v = new Float64Array(L.dim);
  for (let m = 0; m < n; m++) v[m] = rho[m * n + m];
  for (let k = 0; k < pairs; k++) v[n + k] = rho[pairRow[k] * n + pairCol[k]];
  return v;
}

/** Unvectorize into real and imaginary parts of the full N x N matrix (row-major). */
export function unvectorize(L: Layout, v: Float64Array): { re: Float64Array; im: Float64Array } {
  const { n, pairs, pairRow, pairCol } = L;
  const re = new Float64Array(n * n);
  const im = new Float64Array(n * n);
  for (let m = 0; m < n; m++) re[m * n + m] = v[m];
  for (let k = 0; k < pairs; k++) {
    const i = pairRow[k], j = pairCol[k];
    re[i * n + j] = re[j * n + i] = v[n + k];
    im[i * n + j] = v[n + pairs + k];
    im[j * n + i] = -v[n + pairs + k];
  }
  return { re, im };
}

/**
 * Readout vector w such that w . v = sum_ij A_ij rho_ji = tr(A rho) for a real symmetric operator A
 * (row-major N x N) given in the same basis as rho.
 */
export function traceReadout(L: Layout, A: Float64Array): Float64Array {
  const { n, pairs, pairRow, pairCol } = L;
  const w = new Float64Array(L.dim);
  for (let m = 0; m < n; m++) w[m] = A[m * n + m];
  for (let k = 0; k < pairs; k++) w[n + k] = 2 * A[pairRow[k] * n + pairCol[k]];
  return w;
}
