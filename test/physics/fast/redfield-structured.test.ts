import { describe, expect, it } from 'vitest';
import { NumericalError } from '../../../src/errors.js';
import { systemFromHamiltonian } from '../../../src/physics/hamiltonian.js';
import { STRUCTURED_NOT_APPLICABLE } from '../../../src/physics/fast/structured-errors.js';
import { MAX_SPECIAL_SITES } from '../../../src/physics/fast/redfield-structured.js';
import { evaluateTransport, type TransportOptions } from '../../../src/physics/transport.js';
import { randomHamiltonian, rng } from '../../helpers/random.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

/**
 * The structured secular Redfield solver against the dense Liouvillian solve of the same model (models/redfield.ts,
 * itself checked against QuTiP's brmesolve in test/physics/qutip-reference.test.ts), to 1e-9 relative.
 */
function compare(sys: ReturnType<typeof systemFromHamiltonian>, o: Partial<TransportOptions>): void {
  const s = evaluateTransport(sys, { ...o, model: 'redfield', solver: 'structured' });
  const d = evaluateTransport(sys, { ...o, model: 'redfield', solver: 'dense' });
  expect(s.solver).toBe('structured');
  expect(rel(s.efficiency, d.efficiency)).toBeLessThan(1e-9);
  expect(rel(s.transferTime, d.transferTime)).toBeLessThan(1e-9);
  expect(Math.abs(s.lossFraction - d.lossFraction)).toBeLessThan(1e-9 * Math.max(d.lossFraction, 1e-3));
}

describe('structured secular Redfield solver against the dense solve (1e-9 relative)', () => {
  it('agrees on seeded random arrays of 2 to 16 sites over temperature, cutoff, secular rule and one to four traps', () => {
    const r = rng(701);
    for (let n = 2; n <= 16; n++) {
      for (const [T, cutoff, sec] of [[77, 50, 0.1], [300, 100, 0.1], [300, 200, 0], [150, 100, 2]] as const) {
        const traps = [n - 1];
        for (const t of [0, 3, 5]) if (traps.length < Math.min(MAX_SPECIAL_SITES, n) && t < n - 1 && r() < 0.4) traps.push(t);
        const sys = systemFromHamiltonian(randomHamiltonian(r, n, 400, 100), { traps, lossRate: 0.001 + 0.01 * r(), reorganization: 20 + 60 * r() });
        compare(sys, { temperature: T, cutoff, secularFraction: sec, trapRate: traps.map(() => 0.3 + 4 * r()), start: { kind: 'site', site: traps.includes(1) ? 2 % n : 1 } });
      }
    }
  });
  it('agrees on a ring of identical dyes (degenerate excitons: coherences join the population block)', () => {
    // a ring's exciton energies 2 J cos(2 pi k / N) come in degenerate pairs (textbook tight binding; e.g. May and Kuehn, ch. 9)
    const n = 9;
    const H = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => ((i - j + n) % n === 1 || (j - i + n) % n === 1 ? -80 : 0)));
    const sys = systemFromHamiltonian(H, { traps: [0], lossRate: 0.002, reorganization: 40 });
    for (const start of [{ kind: 'site' as const, site: 4 }, { kind: 'donors' as const }]) compare(sys, { temperature: 300, cutoff: 100, trapRate: 1, start });
  });
  it('agrees when several sites share a loss that differs from the rest (up to the limit of special sites)', () => {
    const r = rng(702);
    const n = 10;
    const loss = Array.from({ length: n }, (_, m) => (m === 2 || m === 6 ? 0.004 : 0.001));
    const sys = systemFromHamiltonian(randomHamiltonian(r, n, 300, 90), { traps: [9, 4], lossRate: loss, reorganization: 35 });
    compare(sys, { temperature: 300, cutoff: 100, trapRate: [1, 2], start: { kind: 'donors' } });
  });
});

describe('structured redfield falls back where it does not apply', () => {
  const r = rng(703);
  const n = 8;
  const H = randomHamiltonian(r, n, 300, 90);
  it('per-site lifetimes on more than four sites: auto runs dense and says why', () => {
    const sys = systemFromHamiltonian(H, { traps: [n - 1], lossRate: Array.from({ length: n }, (_, m) => 0.001 * (1 + m)), reorganization: 35 });
    const a = evaluateTransport(sys, { model: 'redfield', trapRate: 1 });
    expect(a.solver).toBe('dense');
    expect(a.fallbackReason).toMatch(/differs from the common one at 7 sites/);
    expect(() => evaluateTransport(sys, { model: 'redfield', trapRate: 1, solver: 'structured' })).toThrow(NumericalError);
  });
  it('no loss at all: the population block conserves population, so auto runs dense', () => {
    const sys = systemFromHamiltonian(H, { traps: [n - 1], lossRate: 0, reorganization: 35 });
    const a = evaluateTransport(sys, { model: 'redfield', trapRate: 1 });
    expect(a.solver).toBe('dense');
    expect(a.fallbackReason).toMatch(/no loss common to the sites/);
    expect(() => evaluateTransport(sys, { model: 'redfield', trapRate: 1, solver: 'structured' })).toThrow(/structured redfield solver: there is no loss/);
    try { evaluateTransport(sys, { model: 'redfield', trapRate: 1, solver: 'structured' }); } catch (e) { expect((e as NumericalError).code).toBe(STRUCTURED_NOT_APPLICABLE); }
  });
});

describe('structured redfield reuses its scratch arrays between calls', () => {
  it('gives bit-identical results for an array solved again after a larger and a smaller one', () => {
    const r = rng(704);
    const systems = [6, 11, 3].map((n) => systemFromHamiltonian(randomHamiltonian(r, n, 400, 100), { traps: [n - 1, 0], lossRate: Array.from({ length: n }, (_, m) => (m === 1 ? 0.003 : 0.001)), reorganization: 35 }));
    const o = { model: 'redfield', solver: 'structured', temperature: 295, cutoff: 106, trapRate: 1 } as const;
    const first = evaluateTransport(systems[0], o);
    evaluateTransport(systems[1], o);
    evaluateTransport(systems[2], o);
    const again = evaluateTransport(systems[0], o);
    expect(again).toEqual(first);
  });
  it('solves a problem without special sites (uniform sink, no trap rate): no correction, eta = 0, loss = 1 as the dense solve', () => {
    const r = rng(705);
    const sys = systemFromHamiltonian(randomHamiltonian(r, 5, 300, 80), { traps: [4], lossRate: 0.002, reorganization: 35 });
    const o = { model: 'redfield', temperature: 300, cutoff: 100, trapRate: 0, start: { kind: 'site', site: 0 } } as const;
    const s = evaluateTransport(sys, { ...o, solver: 'structured' }), d = evaluateTransport(sys, { ...o, solver: 'dense' });
    expect(s.efficiency).toBe(0);
    expect(s.transferTime).toBe(Infinity);
    expect(Math.abs(s.lossFraction - 1)).toBeLessThan(1e-12);
    expect(Math.abs(s.lossFraction - d.lossFraction)).toBeLessThan(1e-9);
  });
});
