import { describe, expect, it } from 'vitest';
import { type ComplexMatrix, complexMatMul, complexNormF, complexZeros } from '../../../src/physics/linalg/complex-dense.js';
import { complexEigen } from '../../../src/physics/linalg/complex-eigen.js';
import { complexSymmetricEigen } from '../../../src/physics/linalg/complex-symmetric-eigen.js';
import { complexSymmetricTridiagonal, formQ } from '../../../src/physics/linalg/complex-symmetric-tridiagonal.js';
import { rng } from '../../helpers/random.js';

/** S = H - i K / 2: H real symmetric (rad/ps scale), K >= 0 diagonal with `special` sites differing. */
function transportSymmetric(r: () => number, n: number, special: number): ComplexMatrix {
  const s = complexZeros(n);
  for (let i = 0; i < n; i++) {
    s.re[i * n + i] = 75 * r();
    s.im[i * n + i] = -0.5 * (0.2 + (i < special ? 4 * r() : 0));
    for (let j = i + 1; j < n; j++) s.re[i * n + j] = s.re[j * n + i] = 19 * (2 * r() - 1);
  }
  return s;
}

function transpose(a: ComplexMatrix): ComplexMatrix {
  const { n } = a;
  const t = complexZeros(n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { t.re[i * n + j] = a.re[j * n + i]; t.im[i * n + j] = a.im[j * n + i]; }
  return t;
}

function distanceToIdentity(a: ComplexMatrix): number {
  let worst = 0;
  for (let i = 0; i < a.n; i++) for (let j = 0; j < a.n; j++) worst = Math.max(worst, Math.hypot(a.re[i * a.n + j] - (i === j ? 1 : 0), a.im[i * a.n + j]));
  return worst;
}

describe('complex symmetric eigen-decomposition (complex orthogonal tridiagonalization, QL, inverse iteration)', () => {
  it('tridiagonalizes S = Q T Q^T with Q^T Q = I (defining identities)', () => {
    const r = rng(21);
    for (const [n, special] of [[2, 1], [5, 0], [9, 1], [14, 3], [25, 25]]) {
      const s = transportSymmetric(r, n, special);
      const t = complexSymmetricTridiagonal(s);
      const T = complexZeros(n);
      for (let i = 0; i < n; i++) {
        T.re[i * n + i] = t.diagRe[i]; T.im[i * n + i] = t.diagIm[i];
        if (i + 1 < n) { T.re[i * n + i + 1] = T.re[(i + 1) * n + i] = t.offRe[i]; T.im[i * n + i + 1] = T.im[(i + 1) * n + i] = t.offIm[i]; }
      }
      const q = formQ(t);
      const back = complexMatMul(complexMatMul(q, T), transpose(q));
      let err = 0;
      for (let k = 0; k < n * n; k++) err = Math.max(err, Math.hypot(back.re[k] - s.re[k], back.im[k] - s.im[k]));
      expect(err).toBeLessThan(1e-12 * complexNormF(s));
      expect(distanceToIdentity(complexMatMul(transpose(q), q))).toBeLessThan(1e-12 * t.growth);
      // the first row and column are left in place: Q e_1 = e_1
      expect(Math.hypot(q.re[0] - 1, q.im[0])).toBeLessThan(1e-15);
    }
  });

  it.each(['accumulate', 'inverse-iteration'] as const)('gives S V = V Lambda, V^T V = I and the eigenvalues of the unitary QR solver on seeded random arrays of 1 to 40 sites (eigenvectors by %s)', (method) => {
    const r = rng(22);
    for (let n = 1; n <= 40; n++) {
      for (const special of [0, 1, 2, n]) {
        const s = transportSymmetric(r, n, special);
        const e = complexSymmetricEigen(s, undefined, method);
        const sv = complexMatMul(s, e.vectors);
        let res = 0;
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
          const k = i * n + j, vr = e.vectors.re[k], vi = e.vectors.im[k];
          res = Math.max(res, Math.hypot(sv.re[k] - (vr * e.valuesRe[j] - vi * e.valuesIm[j]), sv.im[k] - (vr * e.valuesIm[j] + vi * e.valuesRe[j])));
        }
        expect(res).toBeLessThan(1e-12 * complexNormF(s));
        expect(distanceToIdentity(complexMatMul(transpose(e.vectors), e.vectors))).toBeLessThan(1e-11);
        const ref = complexEigen(s);
        for (let a = 0; a < n; a++) {
          let best = Infinity;
          for (let b = 0; b < n; b++) best = Math.min(best, Math.hypot(ref.valuesRe[b] - e.valuesRe[a], ref.valuesIm[b] - e.valuesIm[a]));
          expect(best).toBeLessThan(1e-11 * complexNormF(s));
        }
      }
    }
  });

  it.each(['accumulate', 'inverse-iteration'] as const)('handles a block-diagonal matrix with the same block twice (exactly repeated eigenvalues, the tridiagonal form splits; eigenvectors by %s)', (method) => {
    const r = rng(23);
    const b = transportSymmetric(r, 4, 1);
    const n = 8;
    const s = complexZeros(n);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
      s.re[i * n + j] = s.re[(i + 4) * n + j + 4] = b.re[i * 4 + j];
      s.im[i * n + j] = s.im[(i + 4) * n + j + 4] = b.im[i * 4 + j];
    }
    const e = complexSymmetricEigen(s, undefined, method);
    expect(distanceToIdentity(complexMatMul(transpose(e.vectors), e.vectors))).toBeLessThan(1e-11);
    const sv = complexMatMul(s, e.vectors);
    for (let k = 0; k < n * n; k++) {
      const j = k % n;
      expect(Math.hypot(sv.re[k] - (e.vectors.re[k] * e.valuesRe[j] - e.vectors.im[k] * e.valuesIm[j]), sv.im[k] - (e.vectors.re[k] * e.valuesIm[j] + e.vectors.im[k] * e.valuesRe[j]))).toBeLessThan(1e-11);
    }
  });
});
