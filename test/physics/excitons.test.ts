import { describe, expect, it } from 'vitest';
import { absorptionSpectrum, excitons } from '../../src/physics/excitons.js';
import { systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { ADOLPHS_RENGER_2006, ADOLPHS_RENGER_2006_EIGENVALUES } from '../helpers/fixtures.js';

/** Open chain, nearest-neighbour coupling J, parallel unit dipoles along x (head-to-tail: J < 0). */
function chain(n: number, E0: number, J: number) {
  const H = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? E0 : Math.abs(i - j) === 1 ? J : 0)));
  const sys = systemFromHamiltonian(H, { traps: [] });
  const dipoles = new Float64Array(n * 3);
  for (let m = 0; m < n; m++) dipoles[m * 3] = 1;
  return { ...sys, dipoles };
}

describe('textbook exciton chain (e.g. Knapp, Chem. Phys. 85, 73 (1984); May and Kuehn, ch. 9)', () => {
  const N = 10, E0 = 15000, J = -300;
  const ex = excitons(chain(N, E0, J));
  it('has energies E_k = E0 + 2J cos(pi k/(N+1))', () => {
    for (let k = 1; k <= N; k++) expect(ex.energies[k - 1]).toBeCloseTo(E0 + 2 * J * Math.cos((Math.PI * k) / (N + 1)), 9);
  });
  it('puts f_1 = (2/(N+1)) cot^2(pi/(2(N+1))) = 0.8795 N of the strength in the band-edge state, dark even-k states, sum N', () => {
    const f = ex.relativeStrengths!;
    const f1 = (2 / (N + 1)) / Math.tan(Math.PI / (2 * (N + 1))) ** 2;
    expect(f[0]).toBeCloseTo(f1, 9);
    expect(f[0] / N).toBeCloseTo(0.8795, 4);
    for (let k = 2; k <= N; k += 2) expect(f[k - 1]).toBeLessThan(1e-20);
    expect(f.reduce((s, x) => s + x, 0)).toBeCloseTo(N, 10);
  });
  it('tends to 8N/pi^2 of the strength for long chains', () => {
    const n = 400;
    const f = excitons(chain(n, 0, -100)).relativeStrengths!;
    expect(f[0] / n).toBeCloseTo(8 / Math.PI ** 2, 2);
  });
  it('broadened absorption integrates to the dipole-strength sum rule', () => {
    const spec = absorptionSpectrum(ex, { shape: 'gaussian', fwhm: 100, from: 13000, to: 17000, points: 4001 });
    let area = 0;
    for (let i = 1; i < spec.energy.length; i++) area += 0.5 * (spec.absorbance[i] + spec.absorbance[i - 1]) * (spec.energy[i] - spec.energy[i - 1]);
    expect(area).toBeCloseTo(N, 6);
  });
});

describe('Adolphs-Renger 2006 fixture', () => {
  it('has the tabulated eigenvalues', () => {
    const ex = excitons(systemFromHamiltonian(ADOLPHS_RENGER_2006, { traps: [2] }));
    ADOLPHS_RENGER_2006_EIGENVALUES.forEach((e, a) => expect(ex.energies[a]).toBeCloseTo(e, 1));
  });
  it('diagonalizes: H C = C diag(E) and C^T C = 1', () => {
    const sys = systemFromHamiltonian(ADOLPHS_RENGER_2006, { traps: [2] });
    const { energies: E, coefficients: C, n } = excitons(sys);
    for (let i = 0; i < n; i++) for (let a = 0; a < n; a++) {
      let hc = 0, cc = 0;
      for (let k = 0; k < n; k++) { hc += sys.hamiltonian[i * n + k] * C[k * n + a]; cc += C[k * n + i] * C[k * n + a]; }
      expect(hc).toBeCloseTo(C[i * n + a] * E[a], 9);
      expect(cc).toBeCloseTo(i === a ? 1 : 0, 12);
    }
  });
});
