import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { InputError, NumericalError } from '../../../src/errors.js';
import { CM_TO_RAD_PER_PS } from '../../../src/physics/constants.js';
import { STRUCTURED_UNAVAILABLE } from '../../../src/physics/fast/structured-errors.js';
import { buildSystem, systemFromHamiltonian } from '../../../src/physics/hamiltonian.js';
import type { Start } from '../../../src/physics/models/common.js';
import { evaluateTransport, MAX_DENSE_FALLBACK_SITES, type TransportOptions } from '../../../src/physics/transport.js';
import type { Site } from '../../../src/physics/types.js';
import { randomHamiltonian, randomUnit, rng } from '../../helpers/random.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.max(Math.abs(b), 1e-300);

/** The structured and dense solvers on the same problem; the structured one must have run (no fallback). */
function compare(sys: ReturnType<typeof systemFromHamiltonian>, o: Partial<TransportOptions>, tol = 1e-9): number {
  const s = evaluateTransport(sys, { ...o, solver: 'structured' });
  const d = evaluateTransport(sys, { ...o, solver: 'dense' });
  expect(s.solver).toBe('structured');
  expect(d.solver).toBe('dense');
  const worst = Math.max(rel(s.efficiency, d.efficiency), rel(s.transferTime, d.transferTime), Math.abs(s.lossFraction - d.lossFraction) / Math.max(d.lossFraction, 1e-3));
  expect(worst).toBeLessThan(tol);
  return worst;
}

describe('structured hsr solver against the dense Liouvillian solve (1e-9 relative)', () => {
  // regimes: no dephasing, weak, moderate, strong, Zeno-like; one to three traps; uniform loss or per-site lifetimes
  const gammas = [0, 0.1, 10, 300, 1e4];
  it('agrees on seeded random arrays of 2 to 20 sites over dephasing, trap and loss regimes', () => {
    const r = rng(606);
    let cases = 0;
    for (let n = 2; n <= 20; n++) {
      for (const gamma of gammas) {
        const traps = [n - 1];
        if (n >= 4 && r() < 0.5) traps.push(0);
        if (n >= 8 && r() < 0.3) traps.push(3);
        const perSite = r() < 0.5;
        const loss = perSite ? Array.from({ length: n }, () => 1 / (200 + 5000 * r())) : 0.001;
        const sys = systemFromHamiltonian(randomHamiltonian(r, n, 400, 100), { traps, lossRate: loss });
        const trapRate = traps.map(() => 0.2 + 5 * r());
        compare(sys, { model: 'hsr', dephasing: gamma, trapRate, start: { kind: 'site', site: traps.includes(1) ? 2 % n : 1 } });
        cases++;
      }
    }
    expect(cases).toBe(19 * gammas.length);
  });

  it('agrees for every kind of initial state (site, donors, exciton, illumination) on dye arrays with dipoles', () => {
    const r = rng(607);
    for (const n of [3, 6, 11]) {
      const sites: Site[] = Array.from({ length: n }, (_, i) => ({
        position: [1.1 * i, 0.4 * r(), 0.4 * r()], direction: randomUnit(r), dipole: 5 + 5 * r(), energy: 15000 + 600 * r(), lifetime: 500 + 3000 * r(),
      }));
      const sys = buildSystem(sites, { traps: [n - 1] });
      const starts: Start[] = [{ kind: 'site', site: 0 }, { kind: 'donors' }, { kind: 'exciton', state: n - 1 }, { kind: 'light' }];
      for (const start of starts) for (const gamma of [0, 5, 200]) compare(sys, { model: 'hsr', dephasing: gamma, trapRate: 2, start });
    }
  });

  it('agrees on a strongly coupled homogeneous chain (degenerate site energies, trap at one end)', () => {
    const n = 16;
    const H = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (Math.abs(i - j) === 1 ? -120 : 0)));
    const sys = systemFromHamiltonian(H, { traps: [n - 1], lossRate: 0.001 });
    for (const gamma of gammas) compare(sys, { model: 'hsr', dephasing: gamma, trapRate: 1, start: { kind: 'site', site: 0 } });
  });
});

describe('scratch arrays reused between calls (linalg/workspace.ts)', () => {
  it('give bit-identical results when sizes and starts are interleaved (nothing stale is read)', () => {
    const r = rng(608);
    const systems = [5, 12, 5, 9, 12].map((n) => systemFromHamiltonian(randomHamiltonian(r, n, 300, 80), { traps: [n - 1], lossRate: 0.002 }));
    const run = (i: number, start: Start) => evaluateTransport(systems[i], { model: 'hsr', solver: 'structured', dephasing: 7, trapRate: 1.5, start });
    const first = systems.map((_, i) => run(i, { kind: 'donors' }));
    const mixed = systems.map((_, i) => run(i, { kind: 'site', site: 1 }));
    const again = systems.map((_, i) => run(systems.length - 1 - i, { kind: 'donors' })).reverse();
    again.forEach((a, i) => {
      expect(a.efficiency).toBe(first[i].efficiency);
      expect(a.transferTime).toBe(first[i].transferTime);
    });
    // and a different start does give a different answer (the check above can fail)
    expect(mixed[1].efficiency).not.toBe(first[1].efficiency);
  });
});

describe('structured hsr solver against a 40-digit mpmath solve (test/physics/fast/mpmath_chain_reference.py)', () => {
  // 16-site homogeneous chain, J = -120 cm^-1, trap 1 ps^-1 on the last site, loss 0.001 ps^-1, start on the first;
  // values printed by the script with Debian's python3-mpmath 1.2.1 (dense Liouvillian LU at 40 digits)
  const reference = [
    { gamma: 10, efficiency: 0.98310250838784491581, transferTime: 16.90364864608853985 },
    { gamma: 1e4, efficiency: 0.4091839097731919242, transferTime: 702.65148078095282539 },
    { gamma: 1e5, efficiency: 0.016118119149652635219, transferTime: 2385.1844304122209713 },
  ];
  const n = 16;
  const H = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (Math.abs(i - j) === 1 ? -120 : 0)));
  const sys = systemFromHamiltonian(H, { traps: [n - 1], lossRate: 0.001 });
  for (const ref of reference) {
    it(`gamma_phi = ${ref.gamma} ps^-1 (up to the Zeno regime): efficiency and transfer time to 1e-11`, () => {
      const r = evaluateTransport(sys, { model: 'hsr', solver: 'structured', dephasing: ref.gamma, trapRate: 1, start: { kind: 'site', site: 0 } });
      expect(rel(r.efficiency, ref.efficiency)).toBeLessThan(1e-11);
      expect(rel(r.transferTime, ref.transferTime)).toBeLessThan(1e-11);
    });
  }
});

describe('structured hsr solver against QuTiP (test/reference/qutip-reference.json, liouvillian() + SciPy)', () => {
  interface HsrCase { name: string; hamiltonian_cm: number[][]; trap_sites: number[]; trap_rate_ps: number; loss_rate_ps: number | number[]; dephasing_ps: number; start_site: number; efficiency: number; loss_fraction: number; transfer_time_ps: number }
  const ref = JSON.parse(readFileSync(new URL('../../reference/qutip-reference.json', import.meta.url), 'utf8')) as { hsr: HsrCase[] };
  for (const c of ref.hsr) {
    it(`${c.name}: efficiency, loss and transfer time to 1e-6 with solver 'structured'`, () => {
      const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps });
      const res = evaluateTransport(sys, { model: 'hsr', solver: 'structured', dephasing: c.dephasing_ps, trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site } });
      expect(res.solver).toBe('structured');
      expect(rel(res.efficiency, c.efficiency)).toBeLessThan(1e-6);
      expect(Math.abs(res.lossFraction - c.loss_fraction)).toBeLessThan(1e-6 * Math.max(c.loss_fraction, 1e-3));
      expect(rel(res.transferTime, c.transfer_time_ps)).toBeLessThan(1e-6);
    });
  }
});

describe('fallback to the dense solver where the structured one cannot vouch for its answer', () => {
  // A dimer with equal site energies, coupling J and a trap of rate k on one site (no loss, no dephasing) has
  // A = -i J sigma_x - (k/2)|2><2|, with eigenvalues -k/4 +- sqrt(k^2/16 - J^2): an exceptional point at
  // k = 4 J, where A is defective (worked by hand from the 2 x 2 characteristic polynomial).
  const J = 10;
  const kEp = 4 * J * CM_TO_RAD_PER_PS;
  const dimer = systemFromHamiltonian([[0, J], [J, 0]], { traps: [1], lossRate: 0 });
  const at = { model: 'hsr' as const, dephasing: 0, trapRate: kEp, start: { kind: 'site' as const, site: 0 } };
  it('auto falls back at the exceptional point, says why, and matches the dense answer', () => {
    const a = evaluateTransport(dimer, at);
    const d = evaluateTransport(dimer, { ...at, solver: 'dense' });
    expect(a.solver).toBe('dense');
    expect(a.fallbackReason).toMatch(/isotropic|ill-conditioned|residual/);
    expect(a.efficiency).toBe(d.efficiency);
    expect(a.transferTime).toBe(d.transferTime);
    // the dimer's exact answer without loss: everything is trapped
    expect(a.efficiency).toBeCloseTo(1, 12);
  });
  it("solver 'structured' refuses with a NumericalError instead", () => {
    expect(() => evaluateTransport(dimer, { ...at, solver: 'structured' })).toThrow(NumericalError);
    try { evaluateTransport(dimer, { ...at, solver: 'structured' }); } catch (e) { expect((e as NumericalError).code).toBe(STRUCTURED_UNAVAILABLE); }
  });
  it('near (not at) the exceptional point auto still agrees with dense to 1e-9, whichever solver it used', () => {
    for (const f of [1 + 1e-12, 1 + 1e-8, 1 + 1e-6, 1 + 1e-4, 1.01, 0.99]) {
      const o = { ...at, trapRate: kEp * f };
      const a = evaluateTransport(dimer, o), d = evaluateTransport(dimer, { ...o, solver: 'dense' });
      expect(rel(a.efficiency, d.efficiency)).toBeLessThan(1e-9);
      expect(rel(a.transferTime, d.transferTime)).toBeLessThan(1e-9);
    }
  });
  it(`refuses a dense fallback above ${MAX_DENSE_FALLBACK_SITES} sites and names the way out`, () => {
    // the defective dimer as one block of a larger array (a chain with its own trap as the other block)
    const n = MAX_DENSE_FALLBACK_SITES + 1;
    const H = Array.from({ length: n }, () => new Array<number>(n).fill(0));
    H[0][1] = H[1][0] = J;
    for (let i = 2; i + 1 < n; i++) H[i][i + 1] = H[i + 1][i] = 50;
    const sys = systemFromHamiltonian(H, { traps: [1, n - 1], lossRate: 0 });
    expect(() => evaluateTransport(sys, { ...at, trapRate: [kEp, 1] })).toThrow(/limited to 40 sites; pass solver 'dense'/);
  });
});

describe('solver option', () => {
  const sys = systemFromHamiltonian([[0, 50], [50, 100]], { traps: [1], reorganization: 30 });
  it('reports the structured solver for hsr and redfield and the dense one for forster under auto', () => {
    expect(evaluateTransport(sys, { model: 'hsr' }).solver).toBe('structured');
    expect(evaluateTransport(sys, { model: 'redfield' }).solver).toBe('structured');
    expect(evaluateTransport(sys, { model: 'forster' }).solver).toBe('dense');
  });
  it('rejects unknown solvers and a structured request for a model without one', () => {
    expect(() => evaluateTransport(sys, { solver: 'fast' as never })).toThrow(/unknown transport solver 'fast' \(available: auto, dense, structured\)/);
    expect(() => evaluateTransport(sys, { model: 'forster', solver: 'structured' })).toThrow(InputError);
  });
});
