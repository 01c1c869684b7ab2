import { describe, expect, it } from 'vitest';
import { diagonalInEigenbasis, eigenbasis, multiplyByG, siteDiagonal, symmetricInEigenbasis } from '../../../src/physics/fast/eigenbasis.js';
import { populationCoupling } from '../../../src/physics/fast/population-coupling.js';
import { makeProbe, probeImage, probeResidual } from '../../../src/physics/fast/residual-probe.js';
import { type ComplexMatrix, complexMatMul, complexZeros } from '../../../src/physics/linalg/complex-dense.js';
import { complexLuFactor, complexLuSolve } from '../../../src/physics/linalg/complex-lu.js';
import { complexSymmetricEigen } from '../../../src/physics/linalg/complex-symmetric-eigen.js';
import { rng } from '../../helpers/random.js';

/** A random hsr problem: H (rad/ps scale, real symmetric), K >= 0 per site, gamma. */
function problem(seed: number, n: number) {
  const r = rng(seed);
  const h = new Float64Array(n * n), k = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    h[i * n + i] = 60 * r();
    k[i] = 0.002 + (i === n - 1 ? 2 : 0.01 * r());
    for (let j = i + 1; j < n; j++) h[i * n + j] = h[j * n + i] = 15 * (2 * r() - 1);
  }
  const gamma = 3 + 10 * r();
  // S0 = H - i K/2 = i A0, lambda0 = -i mu
  const s = complexZeros(n);
  s.re.set(h);
  for (let i = 0; i < n; i++) s.im[i * n + i] = -0.5 * k[i];
  const eig = complexSymmetricEigen(s);
  const e = eigenbasis(Float64Array.from(eig.valuesIm), eig.valuesRe.map((x) => -x), eig.vectors, gamma);
  return { n, h, k, gamma, e };
}

/** Full Hermitian matrix from the packed layout. */
function unpack(n: number, y: Float64Array): ComplexMatrix {
  const m = complexZeros(n);
  for (let i = 0; i < n; i++) m.re[i * n + i] = y[i];
  let p = n;
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++, p += 2) {
    m.re[i * n + j] = y[p]; m.im[i * n + j] = y[p + 1];
    m.re[j * n + i] = y[p]; m.im[j * n + i] = -y[p + 1];
  }
  return m;
}

/** V Y V^H */
function toSite(e: ReturnType<typeof problem>['e'], y: Float64Array): ComplexMatrix {
  const { n, vectors: v } = e;
  const vh = complexZeros(n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) { vh.re[i * n + j] = v.re[j * n + i]; vh.im[i * n + j] = -v.im[j * n + i]; }
  return complexMatMul(complexMatMul(v, unpack(n, y)), vh);
}

/** A X + X A^H with A = -i H - (K + gamma)/2. */
function lyapunov(p: ReturnType<typeof problem>, x: ComplexMatrix): ComplexMatrix {
  const { n, h, k, gamma } = p;
  const a = complexZeros(n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) a.im[i * n + j] = -h[i * n + j];
  for (let i = 0; i < n; i++) a.re[i * n + i] = -0.5 * (k[i] + gamma);
  const ax = complexMatMul(a, x);
  const out = complexZeros(n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    // (X A^H)_ij = conj((A X)_ji) for Hermitian X
    out.re[i * n + j] = ax.re[i * n + j] + ax.re[j * n + i];
    out.im[i * n + j] = ax.im[i * n + j] - ax.im[j * n + i];
  }
  return out;
}

describe('eigenbasis tables of the structured hsr solver (defining identities)', () => {
  it('L0^-1 by the eigenbasis solves A X + X A^H = B for random real symmetric B (Bartels-Stewart with a diagonal A)', () => {
    for (const n of [2, 5, 9]) {
      const p = problem(800 + n, n);
      const r = rng(n);
      const B = new Float64Array(n * n);
      for (let i = 0; i < n; i++) for (let j = i; j < n; j++) B[i * n + j] = B[j * n + i] = 2 * r() - 1;
      const y = multiplyByG(p.e, symmetricInEigenbasis(p.e, B, new Float64Array(n * n)));
      const lx = lyapunov(p, toSite(p.e, y));
      let worst = 0;
      for (let q = 0; q < n * n; q++) worst = Math.max(worst, Math.hypot(lx.re[q] - B[q], lx.im[q]));
      expect(worst).toBeLessThan(1e-12);
      // u . y is the site diagonal of V Y V^H
      const d = siteDiagonal(p.e, y, new Float64Array(n));
      const x = toSite(p.e, y);
      for (let i = 0; i < n; i++) expect(Math.abs(d[i] - x.re[i * n + i])).toBeLessThan(1e-12 * Math.max(1, Math.abs(d[i])));
      // and W diag(w) W^H packs diag(w)
      const w = Float64Array.from({ length: n }, () => r());
      const back = toSite(p.e, diagonalInEigenbasis(p.e, w, new Float64Array(n * n)));
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(Math.hypot(back.re[i * n + j] - (i === j ? w[i] : 0), back.im[i * n + j])).toBeLessThan(1e-12);
    }
  });

  // n = 5..8: every shape of the last rows of populationCoupling's register blocks (n mod 4 = 1, 2, 3, 0)
  it.each([5, 6, 7, 8])('I + gamma M matches M_km = [L0^-1(E_mm)]_kk from a dense Kronecker solve (I (x) A + conj(A) (x) I) vec X = vec E_mm, n = %i', (n) => {
    const p = problem(900 + n, n);
    const F = populationCoupling(p.e);
    const N2 = n * n;
    const big = { n: N2, re: new Float64Array(N2 * N2), im: new Float64Array(N2 * N2) };
    // column-stacked vec: index of X_ij is i + n j; (A X)_ij = sum_c A_ic X_cj, (X A^H)_ij = sum_c X_ic conj(A_jc)
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) for (let c = 0; c < n; c++) {
      const row = i + n * j;
      const aic = { re: i === c ? -0.5 * (p.k[i] + p.gamma) : 0, im: -p.h[i * n + c] };
      big.re[row * N2 + (c + n * j)] += aic.re; big.im[row * N2 + (c + n * j)] += aic.im;
      const ajc = { re: j === c ? -0.5 * (p.k[j] + p.gamma) : 0, im: -p.h[j * n + c] };
      big.re[row * N2 + (i + n * c)] += ajc.re; big.im[row * N2 + (i + n * c)] -= ajc.im;
    }
    const lu = complexLuFactor(big);
    for (let m = 0; m < n; m++) {
      const br = new Float64Array(N2), bi = new Float64Array(N2);
      br[m + n * m] = 1;
      complexLuSolve(lu, br, bi);
      for (let k = 0; k < n; k++) {
        const expected = (k === m ? 1 : 0) + p.gamma * br[k + n * k];
        expect(Math.abs(F[k * n + m] - expected)).toBeLessThan(1e-12);
      }
    }
  });

  it('the residual probe sees 1e-15 for a true solution and flags one perturbed by 1e-6', () => {
    const n = 7;
    const p = problem(901, n);
    const rho0 = new Float64Array(n * n);
    rho0[0] = 1;
    // X = L0^-1(-rho0) solves L0(X) = -rho0; as a check of L = L0 + gamma diag it is wrong by gamma diag(X),
    // so the probe is given gamma = 0 here (the operator it checks is then L0 itself)
    const b = symmetricInEigenbasis(p.e, rho0, new Float64Array(n * n)).map((x) => -x);
    const x = multiplyByG(p.e, b);
    const op = { n, h: p.h, decay: p.k.map((k) => k + p.gamma), gamma: 0 };
    const z = makeProbe(p.e, op, 0);
    const zrz = -(z.zr[0] ** 2 + z.zi[0] ** 2);
    const diag = siteDiagonal(p.e, x, new Float64Array(n));
    expect(probeResidual(z, probeImage(p.e, z, x), diag, zrz)).toBeLessThan(1e-13);
    const bad = Float64Array.from(x);
    bad[n + 3] += 1e-6 * Math.max(...x.map(Math.abs));
    expect(probeResidual(z, probeImage(p.e, z, bad), siteDiagonal(p.e, bad, new Float64Array(n)), zrz)).toBeGreaterThan(1e-9);
  });
});
