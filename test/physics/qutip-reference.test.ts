import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { evaluateTransport, populationTraces } from '../../src/physics/transport.js';

/**
 * Cross-check against QuTiP 4.7 (Debian python3-qutip): numbers written by tools/reference/qutip_reference.py
 * into test/reference/qutip-reference.json (.ci/run re-runs the script in --check mode to prove they still
 * come out). hsr: QuTiP's liouvillian() of the same collapse operators solved with SciPy (some cases also
 * confirmed by mesolve); redfield: qutip.brmesolve, secular, same Drude-Lorentz spectrum.
 */
interface HsrCase {
  name: string; hamiltonian_cm: number[][]; trap_sites: number[]; trap_rate_ps: number; loss_rate_ps: number | number[];
  dephasing_ps: number; start_site: number; efficiency: number; loss_fraction: number; transfer_time_ps: number; mesolve_efficiency?: number;
}
interface RedfieldCase {
  name: string; hamiltonian_cm: number[][]; trap_sites: number[]; trap_rate_ps: number; loss_rate_ps: number | number[];
  temperature_k: number; reorganization_cm: number; cutoff_cm: number; start_site: number; secular: { sec_cutoff: number };
  times_ps: number[]; site_populations: number[][]; sink_population: number[];
}
const ref = JSON.parse(readFileSync(new URL('../reference/qutip-reference.json', import.meta.url), 'utf8')) as { hsr: HsrCase[]; redfield: RedfieldCase[] };

describe('hsr against QuTiP liouvillian() + SciPy solve', () => {
  it('covers the Adolphs-Renger 2006 Hamiltonian and random arrays of 3 to 12 sites', () => {
    const sizes = new Set(ref.hsr.map((c) => c.hamiltonian_cm.length));
    for (let n = 3; n <= 12; n++) expect(sizes.has(n), `a case with ${n} sites`).toBe(true);
    expect(ref.hsr.length).toBeGreaterThanOrEqual(20);
  });
  for (const c of ref.hsr) {
    it(`${c.name}: efficiency, loss and transfer time to 1e-6`, () => {
      const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps });
      const r = evaluateTransport(sys, { model: 'hsr', dephasing: c.dephasing_ps, trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site } });
      expect(Math.abs(r.efficiency - c.efficiency)).toBeLessThan(1e-6 * c.efficiency);
      expect(Math.abs(r.lossFraction - c.loss_fraction)).toBeLessThan(1e-6 * Math.max(c.loss_fraction, 1e-3));
      expect(Math.abs(r.transferTime - c.transfer_time_ps)).toBeLessThan(1e-6 * c.transfer_time_ps);
      if (c.mesolve_efficiency !== undefined) expect(Math.abs(r.efficiency - c.mesolve_efficiency)).toBeLessThan(1e-6);
    });
  }
});

describe('redfield traces against QuTiP brmesolve (secular)', () => {
  for (const c of ref.redfield) {
    it(`${c.name}: site and sink populations to 1e-4`, () => {
      const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps, reorganization: c.reorganization_cm });
      const tr = populationTraces(sys, c.times_ps, {
        model: 'redfield', temperature: c.temperature_k, cutoff: c.cutoff_cm, secularFraction: c.secular.sec_cutoff,
        trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site },
      });
      let worst = 0;
      c.times_ps.forEach((_, i) => {
        c.site_populations[i].forEach((p, m) => { worst = Math.max(worst, Math.abs(tr.sites[i][m] - p)); });
        if (c.trap_sites.length) worst = Math.max(worst, Math.abs(tr.sink[i] - c.sink_population[i]));
      });
      expect(worst).toBeLessThan(1e-4);
    });
  }
});
