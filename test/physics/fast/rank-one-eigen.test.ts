import { describe, expect, it } from 'vitest';
import { NumericalError } from '../../../src/errors.js';
import { type ComplexMatrix, complexMatMul, complexNormF, complexZeros } from '../../../src/physics/linalg/complex-dense.js';
import { complexEigen } from '../../../src/physics/linalg/complex-eigen.js';
import { rankOneSymmetricEigen } from '../../../src/physics/linalg/rank-one-eigen.js';
import { rng } from '../../helpers/random.js';

function randomSymmetric(r: () => number, n: number, diag = 75, off = 19): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    a[i * n + i] = diag * r();
    for (let j = i + 1; j < n; j++) a[i * n + j] = a[j * n + i] = off * (2 * r() - 1);
  }
  return a;
}

/** S = B + rho e_t e_t^T as a complex matrix. */
function updated(b: Float64Array, n: number, t: number, rhoRe: number, rhoIm: number): ComplexMatrix {
  const s = complexZeros(n);
  s.re.set(b);
  s.re[t * n + t] += rhoRe;
  s.im[t * n + t] += rhoIm;
  return s;
}

/** max |S V - V Lambda|, max |V^T V - I| and the largest distance of an eigenvalue to the unitary QR solver's. */
function complexIdentities(s: ComplexMatrix, e: { valuesRe: Float64Array; valuesIm: Float64Array; vectors: ComplexMatrix }) {
  const { n } = s;
  const sv = complexMatMul(s, e.vectors);
  let residual = 0, orthogonality = 0, spectrum = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const k = i * n + j, vr = e.vectors.re[k], vi = e.vectors.im[k];
    residual = Math.max(residual, Math.hypot(sv.re[k] - (vr * e.valuesRe[j] - vi * e.valuesIm[j]), sv.im[k] - (vr * e.valuesIm[j] + vi * e.valuesRe[j])));
    let qr = 0, qi = 0;
    for (let m = 0; m < n; m++) {
      const ar = e.vectors.re[m * n + i], ai = e.vectors.im[m * n + i], br = e.vectors.re[m * n + j], bi = e.vectors.im[m * n + j];
      qr += ar * br - ai * bi; qi += ar * bi + ai * br;
    }
    orthogonality = Math.max(orthogonality, Math.hypot(qr - (i === j ? 1 : 0), qi));
  }
  const ref = complexEigen(s);
  for (let a = 0; a < n; a++) {
    let best = Infinity;
    for (let b = 0; b < n; b++) best = Math.min(best, Math.hypot(ref.valuesRe[b] - e.valuesRe[a], ref.valuesIm[b] - e.valuesIm[a]));
    spectrum = Math.max(spectrum, best);
  }
  return { residual, orthogonality, spectrum };
}

describe('eigen-decomposition of a real symmetric matrix plus a complex rank-one diagonal term', () => {
  it('agrees with the unitary QR solver and satisfies S V = V Lambda, V^T V = I for trap terms up to the size of the couplings', () => {
    const r = rng(33);
    for (let n = 2; n <= 40; n += n < 10 ? 1 : 6) {
      for (const kappa of [1e-6, 1e-3, 0.5, 4, 40]) {
        const b = randomSymmetric(r, n);
        const t = Math.floor(r() * n);
        const e = rankOneSymmetricEigen(b, n, t, 0, -kappa / 2);
        const s = updated(b, n, t, 0, -kappa / 2);
        const id = complexIdentities(s, e);
        const scale = complexNormF(s);
        expect(id.residual).toBeLessThan(1e-12 * scale);
        expect(id.orthogonality).toBeLessThan(1e-10);
        expect(id.spectrum).toBeLessThan(1e-11 * scale);
      }
    }
  });

  it('for a trap term far beyond the couplings either gives an accurate basis or refuses (NumericalError), never a wrong one', () => {
    // Newton from the poles may find one root twice once the trap dominates (the Zeno regime); the caller then
    // uses the complex symmetric QL solver
    const r = rng(36);
    let refused = 0, solved = 0;
    for (let rep = 0; rep < 12; rep++) {
      for (const n of [4, 7, 16, 32]) {
        for (const kappa of [200, 2000]) {
          const b = randomSymmetric(r, n);
          const t = Math.floor(r() * n);
          let e;
          try {
            e = rankOneSymmetricEigen(b, n, t, 0, -kappa / 2);
          } catch (err) {
            expect(err).toBeInstanceOf(NumericalError);
            refused++;
            continue;
          }
          solved++;
          const s = updated(b, n, t, 0, -kappa / 2);
          const id = complexIdentities(s, e);
          expect(id.residual).toBeLessThan(1e-11 * complexNormF(s));
          expect(id.spectrum).toBeLessThan(1e-10 * complexNormF(s));
        }
      }
    }
    expect(refused + solved).toBe(96);
  });

  it('accepts a complex rho with a real part (a shifted trap energy) as well', () => {
    const r = rng(34);
    const b = randomSymmetric(r, 9);
    const e = rankOneSymmetricEigen(b, 9, 4, 13, -2);
    const id = complexIdentities(updated(b, 9, 4, 13, -2), e);
    expect(id.residual).toBeLessThan(1e-11);
    expect(id.orthogonality).toBeLessThan(1e-10);
  });

  it('deflates exciton states that do not touch the trap (a block the trap cannot see, a ring with degenerate pairs)', () => {
    const r = rng(35);
    // two decoupled blocks, the trap in the first: the second block's states have w_j = 0 exactly
    const n = 8;
    const b = new Float64Array(n * n);
    const b1 = randomSymmetric(r, 4), b2 = randomSymmetric(r, 4);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) { b[i * n + j] = b1[i * 4 + j]; b[(i + 4) * n + j + 4] = b2[i * 4 + j]; }
    // a ring of 6 identical sites with nearest-neighbour coupling: the eigenvalues 2 J cos(2 pi k / 6) come in
    // degenerate pairs (circulant matrix spectrum: common practice), one state of each pair is dark to site 0
    const ring = new Float64Array(36);
    for (let i = 0; i < 6; i++) { ring[i * 6 + ((i + 1) % 6)] = ring[((i + 1) % 6) * 6 + i] = 18; ring[i * 6 + i] = 40; }
    for (const [m, size] of [[b, n], [ring, 6]] as const) {
      const e = rankOneSymmetricEigen(m, size, 0, 0, -0.7);
      const id = complexIdentities(updated(m, size, 0, 0, -0.7), e);
      expect(id.residual).toBeLessThan(1e-12 * 100);
      expect(id.orthogonality).toBeLessThan(1e-10);
      expect(id.spectrum).toBeLessThan(1e-11 * 100);
      // the dark states keep real eigenvalues
      const real = Array.from(e.valuesIm).filter((x) => x === 0).length;
      expect(real).toBe(size === n ? 4 : 2);
    }
  });

  it('refuses with a NumericalError at an exceptional point instead of returning a defective basis', () => {
    // dimer [[0, J], [J, 0]] with -i k/2 on site 2 is defective at k = 4 J (eigenvalues -k/4 +- sqrt(k^2/16 - J^2),
    // worked by hand from the 2 x 2 characteristic polynomial)
    const J = 1.9;
    const b = Float64Array.from([0, J, J, 0]);
    expect(() => rankOneSymmetricEigen(b, 2, 1, 0, -2 * J)).toThrow(NumericalError);
  });
});
