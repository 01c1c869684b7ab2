import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildSystem } from '../../src/physics/hamiltonian.js';
import { KB_CM_PER_K } from '../../src/physics/constants.js';
import { excitons } from '../../src/physics/excitons.js';
import { redfieldTensor } from '../../src/physics/models/redfield.js';
import { buildModel, evaluateTransport, populationTraces, type ModelName } from '../../src/physics/transport.js';
import type { Site } from '../../src/physics/types.js';

/**
 * Defining invariants of the open-system models (common practice for Lindblad and Pauli master equations):
 * 0 <= eta <= 1, eta + loss = 1, traces keep trace (excitonic + sink + lost = 1) and Hermiticity (real
 * populations), no population below -1e-9, detailed balance of the redfield and forster rates, and results
 * unchanged by relabelling the sites or by rotating and translating the whole array. About 10 000 cases in all.
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
    }), { numRuns: 3000 });
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
    }), { numRuns: 1500 });
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
    }), { numRuns: 700 });
  });
  it('is unchanged by rotating and translating the whole array', () => {
    const quat = fc.tuple(fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }), fc.double({ min: -1, max: 1, noNaN: true }))
      .filter((q) => Math.hypot(...q) > 0.1);
    const shift = fc.tuple(fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }), fc.double({ min: -50, max: 50, noNaN: true }));
    fc.assert(fc.property(arrayArb, optsArb, quat, shift, (sites, o, q, t) => {
      const l = Math.hypot(...q);
      const [w, x, y, z] = q.map((c) => c / l);
      // rotation matrix of a unit quaternion (Hamilton convention)
      const R = [
        [1 - 2 * (y * y + z * z), 2 * (x * y - w * z), 2 * (x * z + w * y)],
        [2 * (x * y + w * z), 1 - 2 * (x * x + z * z), 2 * (y * z - w * x)],
        [2 * (x * z - w * y), 2 * (y * z + w * x), 1 - 2 * (x * x + y * y)],
      ];
      const rot = (v: readonly number[]) => R.map((row) => row[0] * v[0] + row[1] * v[1] + row[2] * v[2]) as [number, number, number];
      const moved = sites.map((s) => {
        const p = rot(s.position);
        return { ...s, position: [p[0] + t[0], p[1] + t[1], p[2] + t[2]] as [number, number, number], direction: rot(s.direction) };
      });
      const a = evaluateTransport(buildSystem(sites, { traps: [0] }), { ...o, start: { kind: 'donors' } });
      const b = evaluateTransport(buildSystem(moved, { traps: [0] }), { ...o, start: { kind: 'donors' } });
      expect(b.efficiency).toBeCloseTo(a.efficiency, 9);
      expect(b.transferTime / a.transferTime).toBeCloseTo(1, 8);
    }), { numRuns: 1800 });
  });
  it('redfield population rates obey detailed balance k(b->a)/k(a->b) = exp(-(E_a - E_b)/kT)', () => {
    fc.assert(fc.property(arrayArb, fc.double({ min: 30, max: 500, noNaN: true }), fc.double({ min: 20, max: 300, noNaN: true }), (sites, T, cutoff) => {
      const sys = buildSystem(sites, { traps: [] });
      const ex = excitons(sys);
      const R = redfieldTensor(ex, Float64Array.from(sites, () => 60), { temperature: T, cutoff, secularFraction: 0.1 });
      const n = ex.n;
      const rate = (from: number, to: number) => {
        const i = R.targets[from * n + from].indexOf(to * n + to);
        return i < 0 ? 0 : R.values[from * n + from][i];
      };
      for (let a = 0; a < n; a++) for (let b = a + 1; b < n; b++) {
        const down = rate(b, a), up = rate(a, b);
        if (down < 1e-300 || up < 1e-300) continue; // decoupled pair or an underflowed uphill rate
        expect(Math.log(down / up)).toBeCloseTo((ex.energies[b] - ex.energies[a]) / (KB_CM_PER_K * T), 6);
      }
    }), { numRuns: 1500 });
  });
  it('forster hopping rates obey detailed balance k(m->n)/k(n->m) = exp(-(E_n - E_m)/kT)', () => {
    fc.assert(fc.property(arrayArb, fc.double({ min: 30, max: 500, noNaN: true }), (sites, T) => {
      const sys = buildSystem(sites, { traps: [] });
      const G = buildModel(sys, { model: 'forster', temperature: T }).generator;
      const n = sys.n, H = sys.hamiltonian;
      for (let m = 0; m < n; m++) for (let k = m + 1; k < n; k++) {
        const fwd = G[k * n + m], back = G[m * n + k]; // m -> k and k -> m
        if (fwd < 1e-300 || back < 1e-300) continue;
        expect(Math.log(fwd / back)).toBeCloseTo(-(H[k * n + k] - H[m * n + m]) / (KB_CM_PER_K * T), 6);
      }
    }), { numRuns: 1500 });
  });
});
