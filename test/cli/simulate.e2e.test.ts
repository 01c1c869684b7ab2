import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCli } from '../helpers/cli.js';
import { ADOLPHS_RENGER_2006 } from '../helpers/fixtures.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-sim-'));
const hFile = join(dir, 'H.csv');
writeFileSync(hFile, ADOLPHS_RENGER_2006.map((r) => r.join(',')).join('\n') + '\n');

describe('lumenfold simulate (built binary)', () => {
  it('prints efficiency and transfer time as JSON, matching QuTiP (reference JSON, case fmo7 at 10 ps^-1)', async () => {
    const r = runCli(['simulate', '--hamiltonian', hFile, '--trap', '3', '--model', 'hsr', '--dephasing', '10', '--trap-rate', '1', '--loss-rate', '0.001', '--start', 'site:1', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    const { hsr } = (await import('../reference/qutip-reference.json', { with: { type: 'json' } })).default as { hsr: { name: string; efficiency: number; transfer_time_ps: number; dephasing_ps: number; start_site: number }[] };
    const ref = hsr.find((c) => c.name.startsWith('fmo7') && c.dephasing_ps === 10 && c.start_site === 0)!;
    expect(out.efficiency).toBeCloseTo(ref.efficiency, 9);
    expect(out.transfer_time_ps).toBeCloseTo(ref.transfer_time_ps, 6);
  });
  it('takes temperature, reorganization and cutoff for redfield and adds traces with --times', () => {
    const r = runCli(['simulate', '--hamiltonian', hFile, '--trap', '3', '--model', 'redfield', '--temperature', '77', '--reorganization', '35', '--cutoff', '106', '--times', '2:5', '--json']);
    expect(r.code).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(out.traces.times_ps).toEqual([0, 0.5, 1, 1.5, 2]);
    expect(out.traces.site_populations[0][0]).toBeCloseTo(1, 12);
    expect(out.efficiency).toBeGreaterThan(0.9);
  });
  it.each([
    [['--trap', '9'], /trap site 9 is out of range/],
    [['--trap', '3', '--dephasing', 'NaN'], /--dephasing: 'NaN' is not a finite number/],
    [['--trap', '3', '--trap-rate', '-1'], /--trap-rate: must not be negative/],
    [['--trap', '3', '--model', 'redfield', '--dephasing', '3'], /--dephasing belongs to --model hsr/],
    [['--trap', '3', '--start', 'site:0'], /not a site number/],
    [['--trap', '3', '--start', 'exciton:0'], /--start exciton: '0' is not an exciton number/],
    [['--trap', '3', '--times', '5:0'], /--times count: '0' is not a positive whole number/],
    [['--trap', '3', '--model', 'quantum'], /Allowed choices are hsr, redfield, forster/],
  ])('exits 2 with a one-line message for bad input %j', (extra, msg) => {
    const r = runCli(['simulate', '--hamiltonian', hFile, ...extra]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(msg);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stdout).toBe('');
  });
  it('exits 2 for a non-symmetric or non-numeric Hamiltonian file, naming the file and place', () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, '0,50\n40,100\n');
    expect(runCli(['simulate', '--hamiltonian', bad, '--trap', '2']).stderr).toMatch(/not symmetric/);
    writeFileSync(bad, '0,abc\n40,100\n');
    const r = runCli(['simulate', '--hamiltonian', bad, '--trap', '2']);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bad\.csv: line 1, column 2: 'abc' is not a finite number/);
  });
});
