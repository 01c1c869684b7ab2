import { describe, expect, it } from 'vitest';
import { KB_CM_PER_K } from '../../src/physics/constants.js';
import { excitons } from '../../src/physics/excitons.js';
import { systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { drudeSpectrum } from '../../src/physics/models/bath.js';
import { redfieldTensor } from '../../src/physics/models/redfield.js';
import { populationTraces } from '../../src/physics/transport.js';
import { ADOLPHS_RENGER_2006 } from '../helpers/fixtures.js';
import { randomHamiltonian, rng } from '../helpers/random.js';

describe('Drude-Lorentz bath spectrum (CONVENTIONS.md, QuTiP convention)', () => {
  it('obeys detailed balance S(-w) = exp(-w/kT) S(w) and S(0) = 4 lambda kT / gamma_c', () => {
    const T = 300, g = 100, kT = KB_CM_PER_K * T;
    for (const w of [1, 50, 200, 1000]) expect(drudeSpectrum(-w, g, T) / drudeSpectrum(w, g, T)).toBeCloseTo(Math.exp(-w / kT), 12);
    expect(drudeSpectrum(0, g, T)).toBeCloseTo((4 * kT) / g, 12);
    expect(drudeSpectrum(1e-9, g, T)).toBeCloseTo((4 * kT) / g, 9);
  });
});

describe('secular Redfield population transfer', () => {
  it('satisfies detailed balance k(b->a) / k(a->b) = exp(-(E_a - E_b)/kT) for every pair', () => {
    const sys = systemFromHamiltonian(ADOLPHS_RENGER_2006, { traps: [], reorganization: 35 });
    const ex = excitons(sys);
    const T = 77;
    const R = redfieldTensor(ex, sys.reorganization, { temperature: T, cutoff: 106, secularFraction: 0.1 });
    const n = ex.n;
    const rate = (from: number, to: number) => {
      const i = R.targets[from * n + from].indexOf(to * n + to);
      return R.values[from * n + from][i];
    };
    for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
      if (a === b) continue;
      expect(rate(b, a) / rate(a, b)).toBeCloseTo(Math.exp(-(ex.energies[a] - ex.energies[b]) / (KB_CM_PER_K * T)), 9);
    }
  });
  it('relaxes closed random arrays to exciton Boltzmann populations at T', () => {
    const r = rng(11);
    for (const n of [3, 5]) {
      const sys = systemFromHamiltonian(randomHamiltonian(r, n, 300, 60), { traps: [], lossRate: 0, reorganization: 50 });
      const T = 250;
      const tr = populationTraces(sys, [20000], { model: 'redfield', temperature: T, cutoff: 120, start: { kind: 'site', site: 0 } });
      const ex = excitons(sys);
      const w = Array.from(ex.energies, (e) => Math.exp(-(e - ex.energies[0]) / (KB_CM_PER_K * T)));
      const Z = w.reduce((s, x) => s + x, 0);
      for (let m = 0; m < n; m++) {
        let expected = 0;
        for (let a = 0; a < n; a++) expected += (w[a] / Z) * ex.coefficients[m * n + a] ** 2;
        expect(tr.sites[0][m]).toBeCloseTo(expected, 8);
      }
    }
  });
});
