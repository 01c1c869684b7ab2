import { describe, expect, it } from 'vitest';
import { type ComplexMatrix, complexMatMul, complexNormF, complexZeros } from '../../../src/physics/linalg/complex-dense.js';
import { complexEigen } from '../../../src/physics/linalg/complex-eigen.js';
import { complexHessenberg } from '../../../src/physics/linalg/complex-hessenberg.js';
import { complexLuFactor, complexLuInverse } from '../../../src/physics/linalg/complex-lu.js';
import { rng } from '../../helpers/random.js';

function randomComplex(r: () => number, n: number): ComplexMatrix {
  const a = complexZeros(n);
  for (let k = 0; k < n * n; k++) { a.re[k] = 2 * r() - 1; a.im[k] = 2 * r() - 1; }
  return a;
}

/** The transport form A = -i H - K/2 (H real symmetric, K diagonal >= 0): complex symmetric, not Hermitian. */
function transportLike(r: () => number, n: number): ComplexMatrix {
  const a = complexZeros(n);
  for (let i = 0; i < n; i++) {
    a.im[i * n + i] = -75 * r();
    a.re[i * n + i] = -(0.5 + (i % 3 === 0 ? 3 * r() : 0));
    for (let j = i + 1; j < n; j++) a.im[i * n + j] = a.im[j * n + i] = -19 * (2 * r() - 1);
  }
  return a;
}

/** ||A V - V diag(lambda)||_F / (||A||_F ||V||_F). */
function eigenResidual(a: ComplexMatrix, e: ReturnType<typeof complexEigen>): number {
  const { n } = a;
  const av = complexMatMul(a, e.vectors);
  let s = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const k = i * n + j;
    const vr = e.vectors.re[k], vi = e.vectors.im[k];
    const dr = av.re[k] - (vr * e.valuesRe[j] - vi * e.valuesIm[j]);
    const di = av.im[k] - (vr * e.valuesIm[j] + vi * e.valuesRe[j]);
    s += dr * dr + di * di;
  }
  return Math.sqrt(s) / (complexNormF(a) * complexNormF(e.vectors));
}

describe('complex eigen-decomposition (Hessenberg + shifted QR + back substitution)', () => {
  it('satisfies A V = V Lambda and trace A = sum lambda on seeded random matrices of order 1 to 40 (defining identities)', () => {
    const r = rng(7);
    for (let n = 1; n <= 40; n++) {
      for (const a of [randomComplex(r, n), transportLike(r, n)]) {
        const e = complexEigen(a);
        expect(eigenResidual(a, e)).toBeLessThan(1e-13);
        let tr = 0, ti = 0, sr = 0, si = 0;
        for (let i = 0; i < n; i++) { tr += a.re[i * n + i]; ti += a.im[i * n + i]; sr += e.valuesRe[i]; si += e.valuesIm[i]; }
        expect(Math.hypot(tr - sr, ti - si)).toBeLessThan(1e-12 * Math.max(1, complexNormF(a)));
        for (let c = 0; c < n; c++) {
          let s = 0;
          for (let i = 0; i < n; i++) s += e.vectors.re[i * n + c] ** 2 + e.vectors.im[i * n + c] ** 2;
          expect(Math.abs(s - 1)).toBeLessThan(1e-13);
        }
      }
    }
  });

  it('finds the eigenvalues a + 2 sqrt(b c) cos(k pi / (n + 1)) of a complex tridiagonal Toeplitz matrix (Noschese, Pasquini and Reichel, Numer. Linear Algebra Appl. 20, 302 (2013), sec. 2)', () => {
    const n = 12;
    const [ar, ai, br, bi, cr, ci] = [0.3, -1.1, 0.8, 0.4, 0.5, -0.2];
    const t = complexZeros(n);
    for (let i = 0; i < n; i++) {
      t.re[i * n + i] = ar; t.im[i * n + i] = ai;
      if (i + 1 < n) { t.re[i * n + i + 1] = br; t.im[i * n + i + 1] = bi; t.re[(i + 1) * n + i] = cr; t.im[(i + 1) * n + i] = ci; }
    }
    const e = complexEigen(t);
    // sqrt(b c) for b c = (0.8 + 0.4i)(0.5 - 0.2i) = 0.48 + 0.04i
    const m = Math.hypot(0.48, 0.04), ph = Math.atan2(0.04, 0.48) / 2;
    const sr = Math.sqrt(m) * Math.cos(ph), si = Math.sqrt(m) * Math.sin(ph);
    for (let k = 1; k <= n; k++) {
      const c = 2 * Math.cos((k * Math.PI) / (n + 1));
      const er = ar + c * sr, ei = ai + c * si;
      let best = Infinity;
      for (let j = 0; j < n; j++) best = Math.min(best, Math.hypot(e.valuesRe[j] - er, e.valuesIm[j] - ei));
      expect(best).toBeLessThan(1e-12);
    }
  });

  it('keeps independent eigenvectors for a repeated eigenvalue of a normal matrix (U diag U^H with a triple value)', () => {
    const r = rng(3);
    const n = 9;
    const u = randomComplex(r, n); // made unitary by Gram-Schmidt
    for (let c = 0; c < n; c++) {
      for (let p = 0; p < c; p++) {
        let dr = 0, di = 0; // <u_p, u_c>
        for (let i = 0; i < n; i++) {
          const k = i * n;
          dr += u.re[k + p] * u.re[k + c] + u.im[k + p] * u.im[k + c];
          di += u.re[k + p] * u.im[k + c] - u.im[k + p] * u.re[k + c];
        }
        for (let i = 0; i < n; i++) {
          const k = i * n;
          u.re[k + c] -= dr * u.re[k + p] - di * u.im[k + p];
          u.im[k + c] -= dr * u.im[k + p] + di * u.re[k + p];
        }
      }
      let s = 0;
      for (let i = 0; i < n; i++) s += u.re[i * n + c] ** 2 + u.im[i * n + c] ** 2;
      s = 1 / Math.sqrt(s);
      for (let i = 0; i < n; i++) { u.re[i * n + c] *= s; u.im[i * n + c] *= s; }
    }
    const lam = [1, 1, 1, -2, 0.5, 3, 3, -1, 2];
    const d = complexZeros(n);
    for (let i = 0; i < n; i++) { d.re[i * n + i] = lam[i]; d.im[i * n + i] = 0.25 * lam[i]; }
    const uh = complexZeros(n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { uh.re[i * n + j] = u.re[j * n + i]; uh.im[i * n + j] = -u.im[j * n + i]; }
    const a = complexMatMul(complexMatMul(u, d), uh);
    const e = complexEigen(a);
    expect(eigenResidual(a, e)).toBeLessThan(1e-13);
    const w = complexLuInverse(complexLuFactor(e.vectors));
    expect(complexNormF(w)).toBeLessThan(100);
  });
});

describe('complex Hessenberg reduction and LU inverse', () => {
  it('A = Q H Q^H with Q unitary and H zero below the subdiagonal; A A^-1 = I (defining identities)', () => {
    const r = rng(5);
    for (const n of [1, 2, 3, 8, 21]) {
      const a = randomComplex(r, n);
      const { h, q } = complexHessenberg(a);
      for (let i = 0; i < n; i++) for (let j = 0; j < i - 1; j++) { expect(h.re[i * n + j]).toBe(0); expect(h.im[i * n + j]).toBe(0); }
      const qh = complexZeros(n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { qh.re[i * n + j] = q.re[j * n + i]; qh.im[i * n + j] = -q.im[j * n + i]; }
      const back = complexMatMul(complexMatMul(q, h), qh);
      const qq = complexMatMul(qh, q);
      const inv = complexMatMul(a, complexLuInverse(complexLuFactor(a)));
      for (let k = 0; k < n * n; k++) {
        const id = k % (n + 1) === 0 ? 1 : 0;
        expect(Math.hypot(back.re[k] - a.re[k], back.im[k] - a.im[k])).toBeLessThan(1e-13 * n);
        expect(Math.hypot(qq.re[k] - id, qq.im[k])).toBeLessThan(1e-13 * n);
        expect(Math.hypot(inv.re[k] - id, inv.im[k])).toBeLessThan(1e-11);
      }
    }
  });
});
