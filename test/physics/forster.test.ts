import { describe, expect, it } from 'vitest';
import { KB_CM_PER_K } from '../../src/physics/constants.js';
import { buildSystem, systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { forsterRate } from '../../src/physics/models/forster.js';
import { evaluateTransport, populationTraces } from '../../src/physics/transport.js';
import type { Site } from '../../src/physics/types.js';

describe('forster donor-acceptor pair', () => {
  // IUPAC Gold Book, "Foerster resonance energy transfer": efficiency 1 / (1 + (r/R0)^6) with R0 the distance
  // at which the transfer rate equals the donor's decay rate.
  const kD = 1 / 3000; // donor lifetime 3 ns
  const pair = (r: number): Site[] => [
    { position: [0, 0, 0], direction: [0, 0, 1], dipole: 6, energy: 16000, reorganization: 300, lifetime: 3000 },
    { position: [r, 0, 0], direction: [0, 0, 1], dipole: 6, energy: 16000 - 600, reorganization: 300, lifetime: 3000 },
  ];
  const opts = { model: 'forster' as const, temperature: 295, trapRate: 1e4, start: { kind: 'site' as const, site: 0 } };
  const kF = (r: number) => {
    const s = buildSystem(pair(r), { traps: [1], couplingMethod: 'point-dipole' });
    return forsterRate(s.hamiltonian[1], -600, 600, KB_CM_PER_K * 295);
  };
  const R0 = 5 * (kF(5) / kD) ** (1 / 6);
  it('R0 is where the rate equals the donor decay rate, and the rate falls as r^-6', () => {
    expect(kF(R0) / kD).toBeCloseTo(1, 10);
    expect(kF(2 * R0) / kF(R0)).toBeCloseTo(1 / 64, 10);
  });
  it('gives 1 / (1 + (r/R0)^6) when the acceptor traps fast, and the exact two-state kinetics always', () => {
    for (const f of [0.5, 0.8, 1, 1.2, 1.6]) {
      const r = f * R0;
      const sys = buildSystem(pair(r), { traps: [1], couplingMethod: 'point-dipole' });
      const eta = evaluateTransport(sys, opts).efficiency;
      // exact kinetics of D <-> A with A trapped: back-transfer by detailed balance at 295 K
      const kf = kF(r), kb = kf * Math.exp(-600 / (KB_CM_PER_K * 295)), kT = 1e4;
      const XD = 1 / (kf + kD - (kb * kf) / (kb + kT + kD));
      const exact = kT * ((kf * XD) / (kb + kT + kD));
      expect(eta).toBeCloseTo(exact, 12);
      expect(eta).toBeCloseTo(1 / (1 + f ** 6), 4);
    }
  });
});

describe('forster relaxes a closed array to site Boltzmann populations (detailed balance)', () => {
  it('reaches exp(-E_m / kT) / Z on a 4-site ring', () => {
    const E = [0, 80, 150, 260];
    const H = E.map((e, i) => E.map((_, j) => (i === j ? e : (j - i + 4) % 4 === 1 || (i - j + 4) % 4 === 1 ? 60 : 0)));
    const sys = systemFromHamiltonian(H, { traps: [], lossRate: 0, reorganization: 100 });
    const T = 200;
    const tr = populationTraces(sys, [5000], { model: 'forster', temperature: T, start: { kind: 'site', site: 3 } });
    const w = E.map((e) => Math.exp(-e / (KB_CM_PER_K * T)));
    const Z = w.reduce((s, x) => s + x, 0);
    tr.sites[0].forEach((p, m) => expect(p).toBeCloseTo(w[m] / Z, 9));
  });
});
