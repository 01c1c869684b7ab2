import { NumericalError } from '../../errors.js';
import { scratch, type Workspace } from './workspace.js';

const EPS = Number.EPSILON;
const MAX_SWEEPS = 30;

/** Eigenpairs of a real symmetric matrix on flat arrays: A = V diag(values) V^T, V orthogonal. */
export interface RealSymmetricEigen {
  readonly n: number;
  /** Eigenvalues, unordered. */
  readonly values: Float64Array;
  /** Row-major n x n, column j the eigenvector of values[j]. */
  readonly vectors: Float64Array;
}

/**
 * Eigenvalues and orthonormal eigenvectors of a real symmetric row-major matrix by Householder
 * tridiagonalization with the transformations accumulated and the implicit QL algorithm with them applied
 * (EISPACK's tred2 and tql2: Bowdler, Martin, Reinsch and Wilkinson, Numer. Math. 11, 293 (1968), and Martin,
 * Reinsch and Wilkinson, Numer. Math. 11, 181 (1968), in the arrangement of the public-domain JAMA library),
 * on flat arrays so that a small matrix costs no allocation: with a workspace the returned arrays live in it.
 * About 9 n^3 operations. Eigenvalues are left unordered. Throws NumericalError when an eigenvalue takes more
 * than 30 sweeps.
 */
export function realSymmetricEigen(a: Float64Array, n: number, ws?: Workspace): RealSymmetricEigen {
  const v = scratch(ws, 'rse.v', n * n), d = scratch(ws, 'rse.d', n), e = scratch(ws, 'rse.e', n);
  v.set(a.subarray(0, n * n));
  tridiagonalize(v, d, e, n);
  diagonalize(v, d, e, n);
  return { n, values: d, vectors: v };
}

/** tred2: V <- the orthogonal Q of A = Q T Q^T (A on entry), d <- diag T, e[1..] <- its subdiagonal. */
function tridiagonalize(V: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
  for (let j = 0; j < n; j++) d[j] = V[(n - 1) * n + j];
  for (let i = n - 1; i > 0; i--) {
    let scale = 0, h = 0;
    for (let k = 0; k < i; k++) scale += Math.abs(d[k]);
    if (scale === 0) {
      e[i] = d[i - 1];
      for (let j = 0; j < i; j++) { d[j] = V[(i - 1) * n + j]; V[i * n + j] = 0; V[j * n + i] = 0; }
    } else {
      for (let k = 0; k < i; k++) { d[k] /= scale; h += d[k] * d[k]; }
      let f = d[i - 1];
      let g = Math.sqrt(h);
      if (f > 0) g = -g;
      e[i] = scale * g;
      h -= f * g;
      d[i - 1] = f - g;
      for (let j = 0; j < i; j++) e[j] = 0;
      for (let j = 0; j < i; j++) {
        f = d[j];
        V[j * n + i] = f;
        g = e[j] + V[j * n + j] * f;
        for (let k = j + 1; k < i; k++) { g += V[k * n + j] * d[k]; e[k] += V[k * n + j] * f; }
        e[j] = g;
      }
      f = 0;
      for (let j = 0; j < i; j++) { e[j] /= h; f += e[j] * d[j]; }
      const hh = f / (h + h);
      for (let j = 0; j < i; j++) e[j] -= hh * d[j];
      for (let j = 0; j < i; j++) {
        f = d[j]; g = e[j];
        for (let k = j; k < i; k++) V[k * n + j] -= f * e[k] + g * d[k];
        d[j] = V[(i - 1) * n + j];
        V[i * n + j] = 0;
      }
    }
    d[i] = h;
  }
  // accumulate the transformations
  for (let i = 0; i < n - 1; i++) {
    V[(n - 1) * n + i] = V[i * n + i];
    V[i * n + i] = 1;
    const h = d[i + 1];
    if (h !== 0) {
      for (let k = 0; k <= i; k++) d[k] = V[k * n + i + 1] / h;
      for (let j = 0; j <= i; j++) {
        let g = 0;
        for (let k = 0; k <= i; k++) g += V[k * n + i + 1] * V[k * n + j];
        for (let k = 0; k <= i; k++) V[k * n + j] -= g * d[k];
      }
    }
    for (let k = 0; k <= i; k++) V[k * n + i + 1] = 0;
  }
  for (let j = 0; j < n; j++) { d[j] = V[(n - 1) * n + j]; V[(n - 1) * n + j] = 0; }
  V[n * n - 1] = 1;
  e[0] = 0;
}

/** tql2: diagonalize the tridiagonal (d, e) by implicit QL, applying the rotations to the columns of V. */
function diagonalize(V: Float64Array, d: Float64Array, e: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  e[n - 1] = 0;
  let f = 0, tst1 = 0;
  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
    let m = l;
    while (m < n - 1 && Math.abs(e[m]) > EPS * tst1) m++;
    if (m > l) {
      let sweeps = 0;
      do {
        if (++sweeps > MAX_SWEEPS) throw new NumericalError(`symmetric QL: eigenvalue ${l + 1} of ${n} did not converge in ${MAX_SWEEPS} sweeps`, 'no-convergence');
        let g = d[l];
        let p = (d[l + 1] - g) / (2 * e[l]);
        let r = Math.sqrt(p * p + 1);
        if (p < 0) r = -r;
        d[l] = e[l] / (p + r);
        d[l + 1] = e[l] * (p + r);
        const dl1 = d[l + 1];
        let h = g - d[l];
        for (let i = l + 2; i < n; i++) d[i] -= h;
        f += h;
        p = d[m];
        let c = 1, c2 = 1, c3 = 1, s = 0, s2 = 0;
        const el1 = e[l + 1];
        for (let i = m - 1; i >= l; i--) {
          c3 = c2; c2 = c; s2 = s;
          g = c * e[i];
          h = c * p;
          r = Math.sqrt(p * p + e[i] * e[i]);
          e[i + 1] = s * r;
          s = e[i] / r;
          c = p / r;
          p = c * d[i] - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]);
          for (let k = 0; k < n; k++) {
            const o = k * n + i, x = V[o + 1];
            V[o + 1] = s * V[o] + c * x;
            V[o] = c * V[o] - s * x;
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]) > EPS * tst1);
    }
    d[l] += f;
    e[l] = 0;
  }
}
