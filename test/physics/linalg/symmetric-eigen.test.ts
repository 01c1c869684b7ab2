import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { symmetricEigen } from '../../../src/physics/linalg/symmetric-eigen.js';
import { rng } from '../../helpers/random.js';

function randomSymmetric(r: () => number, n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = i; j < n; j++) a[i * n + j] = a[j * n + i] = 2 * r() - 1;
  return a;
}

/** max |A V - V D| and max |V^T V - I| over the entries, relative to max |A|. */
function identities(a: Float64Array, n: number): { av: number; orth: number } {
  const { values, vectors: V } = symmetricEigen(a, n);
  let scale = 0;
  for (const x of a) scale = Math.max(scale, Math.abs(x));
  if (scale === 0) scale = 1;
  let av = 0, orth = 0;
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) {
    let s = 0, t = 0;
    for (let j = 0; j < n; j++) { s += a[i * n + j] * V[j * n + k]; t += V[j * n + i] * V[j * n + k]; }
    av = Math.max(av, Math.abs(s - V[i * n + k] * values[k]) / scale);
    orth = Math.max(orth, Math.abs(t - (i === k ? 1 : 0)));
  }
  return { av, orth };
}

describe('symmetric eigen-solver (Householder tridiagonalization + implicit QL)', () => {
  it('gives the closed-form spectrum of the tridiagonal Toeplitz matrix tridiag(b, a, b)', () => {
    // eigenvalues a + 2 b cos(k pi / (n + 1)), eigenvectors sin(j k pi / (n + 1)) (Noschese, Pasquini and
    // Reichel, Numer. Linear Algebra Appl. 20, 302 (2013), eq. 2)
    for (const n of [1, 2, 3, 7, 20, 64]) {
      const a = 1.5, b = -0.7;
      const T = new Float64Array(n * n);
      for (let i = 0; i < n; i++) { T[i * n + i] = a; if (i + 1 < n) T[i * n + i + 1] = T[(i + 1) * n + i] = b; }
      const { values, vectors } = symmetricEigen(T, n);
      const expected = Array.from({ length: n }, (_, k) => a + 2 * b * Math.cos(((k + 1) * Math.PI) / (n + 1))).sort((x, y) => x - y);
      for (let k = 0; k < n; k++) expect(Math.abs(values[k] - expected[k])).toBeLessThan(1e-13 * n);
      // b < 0: the k-th lowest eigenvalue belongs to mode k; its normalized sine vector, sign fixed as the solver's
      for (let k = 0; k < n; k++) {
        const v = Array.from({ length: n }, (_, j) => Math.sin(((j + 1) * (k + 1) * Math.PI) / (n + 1)));
        const norm = Math.hypot(...v);
        let big = 0;
        for (const x of v) if (Math.abs(x) > Math.abs(big) + 1e-12) big = x;
        const sign = big < 0 ? -1 : 1;
        for (let j = 0; j < n; j++) expect(Math.abs(vectors[j * n + k] - (sign * v[j]) / norm)).toBeLessThan(1e-12);
      }
    }
  });
  it('satisfies A V = V D and V^T V = I on seeded random matrices of 1 to 40 rows, eigenvalues ascending', () => {
    const r = rng(811);
    for (let n = 1; n <= 40; n++) {
      const a = randomSymmetric(r, n);
      const { av, orth } = identities(a, n);
      expect(av).toBeLessThan(1e-13 * n);
      expect(orth).toBeLessThan(1e-13 * n);
      const { values } = symmetricEigen(a, n);
      for (let k = 1; k < n; k++) expect(values[k]).toBeGreaterThanOrEqual(values[k - 1]);
    }
  });
  it('handles repeated eigenvalues and zero rows (a diagonal block, a zero matrix, a projector)', () => {
    const n = 6;
    const cases: Float64Array[] = [new Float64Array(n * n), Float64Array.from({ length: n * n }, () => 1)];
    const d = new Float64Array(n * n);
    [3, 1, 3, 0, -2, 1].forEach((x, i) => { d[i * n + i] = x; });
    cases.push(d);
    for (const a of cases) {
      const { av, orth } = identities(a, n);
      expect(av).toBeLessThan(1e-14);
      expect(orth).toBeLessThan(1e-14);
    }
    // all-ones: eigenvalues 0 (n - 1 times) and n (common practice: rank-one projector n P)
    const { values } = symmetricEigen(cases[1], n);
    for (let k = 0; k < n - 1; k++) expect(Math.abs(values[k])).toBeLessThan(1e-14);
    expect(values[n - 1]).toBeCloseTo(n, 13);
  });
  it('makes the largest-magnitude component of every eigenvector positive', () => {
    const r = rng(812);
    for (const n of [3, 9, 25]) {
      const { vectors } = symmetricEigen(randomSymmetric(r, n), n);
      for (let k = 0; k < n; k++) {
        let big = 0;
        for (let m = 0; m < n; m++) if (Math.abs(vectors[m * n + k]) > Math.abs(big)) big = vectors[m * n + k];
        expect(big).toBeGreaterThan(0);
      }
    }
  });
  it('agrees with ml-matrix EigenvalueDecomposition (an independent implementation) to 1e-12', () => {
    const r = rng(813);
    for (const n of [2, 5, 7, 16, 33]) {
      const a = randomSymmetric(r, n);
      const { values, vectors } = symmetricEigen(a, n);
      const rows = Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, i * n + n)));
      const ref = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
      const refValues = [...ref.realEigenvalues].sort((x, y) => x - y);
      for (let k = 0; k < n; k++) {
        expect(Math.abs(values[k] - refValues[k])).toBeLessThan(1e-12);
        // same eigenvector up to sign (the spectrum of a random matrix is simple)
        let dot = 0;
        for (let m = 0; m < n; m++) dot += vectors[m * n + k] * ref.eigenvectorMatrix.get(m, ref.realEigenvalues.indexOf(refValues[k]));
        expect(Math.abs(Math.abs(dot) - 1)).toBeLessThan(1e-12);
      }
    }
  });
  it('returns fresh arrays: a second call leaves the first result as it was', () => {
    const r = rng(814);
    const a = randomSymmetric(r, 7), b = randomSymmetric(r, 7);
    const first = symmetricEigen(a, 7);
    const copy = Float64Array.from(first.vectors);
    symmetricEigen(b, 7);
    expect(first.vectors).toEqual(copy);
  });
});
