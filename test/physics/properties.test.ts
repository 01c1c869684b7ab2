import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildSystem } from '../../src/physics/hamiltonian.js';
import { evaluateTransport, populationTraces, type ModelName } from '../../src/physics/transport.js';
import type { Site } from '../../src/physics/types.js';

/**
 * Defining invariants of the open-system models (common practice for Lindblad and Pauli master equations):
 * 0 <= eta <= 1, eta + loss = 1, traces keep trace (excitonic + sink + lost = 1) and Hermiticity (real
 * populations), no population below -1e-9, relabelling the sites changes nothing.
 */
const siteArb = fc.record({
  x: fc.double({ min: -0.3, max: 0.3, noNaN: true }),
  y: fc.double({ min: -2, max: 2, noNaN: true }),
  z: fc.double({ min: -2, max: 2, noNaN: true }),
  theta: fc.double({ min: 0, max: Math.PI, noNaN: true }),
  phi: fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }),
  dipole: fc.double({ min: 2, max: 15, noNaN: true }),
  energy: fc.double({ min: 15000, max: 16000, noNaN: true }),
});
const arrayArb = fc.array(siteArb, { minLength: 2, maxLength: 6 }).map((raw): Site[] =>
  raw.map((s, i) => ({
    // sites at least 0.6 nm apart along x: closer dyes quench or aggregate (common practice), and couplings of
    // 1e5 cm^-1 against 1 ns^-1 losses would be outside what double precision can balance to 1e-9
    position: [s.x + 1.2 * i, s.y, s.z],
    direction: [Math.sin(s.theta) * Math.cos(s.phi), Math.sin(s.theta) * Math.sin(s.phi), Math.cos(s.theta)],
    dipole: s.dipole, energy: s.energy, reorganization: 60, lifetime: 1000,
  })),
);
const modelArb = fc.constantFrom<ModelName>('hsr', 'redfield', 'forster');
const optsArb = fc.record({ model: modelArb, dephasing: fc.double({ min: 0, max: 200, noNaN: true }), temperature: fc.double({ min: 50, max: 400, noNaN: true }), trapRate: fc.double({ min: 0.1, max: 10, noNaN: true }) });

describe('transport invariants (fast-check)', () => {
  it('0 <= eta <= 1 and eta + loss = 1 for every model', () => {
    fc.assert(fc.property(arrayArb, optsArb, (sites, o) => {
      const sys = buildSystem(sites, { traps: [sites.length - 1] });
      const r = evaluateTransport(sys, { ...o, start: { kind: 'donors' } });
      expect(r.efficiency).toBeGreaterThanOrEqual(-1e-12);
      expect(r.efficiency).toBeLessThanOrEqual(1 + 1e-12);
      expect(Math.abs(r.efficiency + r.lossFraction - 1)).toBeLessThan(1e-9);
      expect(r.transferTime).toBeGreaterThan(0);
    }), { numRuns: 300 });
  });
  it('is unchanged by relabelling the sites', () => {
    fc.assert(fc.property(arrayArb, optsArb, fc.integer({ min: 1, max: 1000 }), (sites, o, seed) => {
      const perm = sites.map((_, i) => i).sort((a, b) => ((a * 7919 + seed) % 101) - ((b * 7919 + seed) % 101));
      const trap = sites.length - 1;
      const r1 = evaluateTransport(buildSystem(sites, { traps: [trap] }), { ...o, start: { kind: 'site', site: 0 } });
      const permuted = perm.map((i) => sites[i]);
      const r2 = evaluateTransport(buildSystem(permuted, { traps: [perm.indexOf(trap)] }), { ...o, start: { kind: 'site', site: perm.indexOf(0) } });
      expect(r2.efficiency).toBeCloseTo(r1.efficiency, 9);
      expect(r2.transferTime / r1.transferTime).toBeCloseTo(1, 8);
    }), { numRuns: 150 });
  });
  it('traces keep the trace, stay real and never go below -1e-9', () => {
    fc.assert(fc.property(arrayArb, optsArb, (sites, o) => {
      const sys = buildSystem(sites, { traps: [0] });
      const tr = populationTraces(sys, [0, 0.3, 1, 3, 10, 50], { ...o, start: { kind: 'site', site: sites.length - 1 } });
      tr.times.forEach((_, i) => {
        expect(Math.abs(tr.trace[i] + tr.sink[i] + tr.lost[i] - 1)).toBeLessThan(1e-9);
        for (const p of tr.sites[i]) expect(p).toBeGreaterThan(-1e-9);
        expect(tr.sink[i]).toBeGreaterThan(-1e-9);
      });
    }), { numRuns: 120 });
  });
});
