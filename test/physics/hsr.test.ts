import { describe, expect, it } from 'vitest';
import { CM_TO_RAD_PER_PS } from '../../src/physics/constants.js';
import { systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { evaluateTransport, populationTraces } from '../../src/physics/transport.js';
import { ADOLPHS_RENGER_2006 } from '../helpers/fixtures.js';

describe('hsr dimer in the strong-dephasing limit', () => {
  it('hops at k = 2 J^2 Gamma / (hbar^2 (Gamma^2 + Delta^2)) (incoherent limit of the Haken-Strobl-Reineker model; e.g. Cao and Silbey, J. Phys. Chem. A 113, 13825 (2009))', () => {
    const Jcm = 10, Dcm = 50, Gamma = 200; // cm^-1, cm^-1, ps^-1
    const sys = systemFromHamiltonian([[0, Jcm], [Jcm, Dcm]], { traps: [], lossRate: 0 });
    const J = Jcm * CM_TO_RAD_PER_PS, D = Dcm * CM_TO_RAD_PER_PS;
    const k = (2 * J * J * Gamma) / (Gamma * Gamma + D * D);
    const times = [5, 10, 20, 40];
    const tr = populationTraces(sys, times, { model: 'hsr', dephasing: Gamma, start: { kind: 'site', site: 0 } });
    // the infinite-temperature model relaxes both populations to 1/2: P1 - 1/2 ~ exp(-2 k t) after a transient
    // of order 1/Gamma, so the rate is read from the ratio at two times
    const excess = tr.sites.map((p) => p[0] - 0.5);
    for (let i = 1; i < times.length; i++) {
      const kEff = Math.log(excess[i - 1] / excess[i]) / (2 * (times[i] - times[i - 1]));
      // the limit formula holds to first order in k / Gamma
      expect(Math.abs(kEff / k - 1)).toBeLessThan((5 * k) / Gamma);
      // and the exact slow root of the dimer's Bloch equations, s = -4 J^2 (s + Gamma) / ((s + Gamma)^2 + Delta^2)
      // (Laplace transform of the three population/coherence equations; worked by hand), to 1e-7
      let s = -2 * k;
      for (let it = 0; it < 50; it++) s = (-4 * J * J * (s + Gamma)) / ((s + Gamma) ** 2 + D * D);
      expect(Math.abs(-2 * kEff / s - 1)).toBeLessThan(1e-7);
    }
  });
});

describe('dephasing-assisted transport on the Adolphs-Renger 2006 Hamiltonian (trap at site 3)', () => {
  // Rebentrost et al., New J. Phys. 11, 033003 (2009); Mohseni et al., J. Chem. Phys. 129, 174106 (2008):
  // efficiency rises from the coherent limit to an optimum and falls under very strong dephasing (Zeno).
  const sys = systemFromHamiltonian(ADOLPHS_RENGER_2006, { traps: [2], lossRate: 0.001 });
  const eta = (g: number) => evaluateTransport(sys, { model: 'hsr', dephasing: g, trapRate: 1, start: { kind: 'site', site: 0 } }).efficiency;
  it('rises from zero dephasing to an optimum and falls again', () => {
    const scan = [0, 1, 3, 10, 30, 100, 300, 1000, 10000, 100000].map((g) => [g, eta(g)] as const);
    const best = scan.reduce((a, b) => (b[1] > a[1] ? b : a));
    expect(best[0]).toBeGreaterThan(0);
    expect(best[0]).toBeLessThan(10000);
    expect(best[1] - scan[0][1]).toBeGreaterThan(0.05);
    expect(best[1] - scan[scan.length - 1][1]).toBeGreaterThan(0.2);
    expect(best[1]).toBeGreaterThan(0.9);
  });
});
