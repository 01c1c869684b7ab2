import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { canonicalJson, contentHash } from '../../src/config/canonical-json.js';
import { loadConfigFile, parseConfigText } from '../../src/config/load.js';
import { expandSweep, expandSweepChecked, loadSweepJobs } from '../../src/config/sweep.js';
import { axisValues } from '../../src/config/sweep/axis-values.js';
import { configError, MINIMAL_CONSTRAINTS, MINIMAL_OBJECTIVE, repoFile, scratch } from './helpers.js';

const base = () => ({ constraints: parseConfigText(MINIMAL_CONSTRAINTS, 'constraints'), objective: parseConfigText(MINIMAL_OBJECTIVE, 'objective') });
const sweepOf = (vary: object[], combine?: string) =>
  parseConfigText(JSON.stringify({ format: 'lumenfold.sweep/1', constraints: 'c.yaml', objective: 'o.yaml', vary, ...(combine ? { combine } : {}) }), 'sweep');

describe('sweep expansion', () => {
  it('expands the demo sweep into one self-contained job per temperature', () => {
    const jobs = loadSweepJobs(repoFile('sweeps/demo-temperature.yaml'));
    expect(jobs.map((j) => j.objective.model.kind === 'redfield' && j.objective.model.temperature)).toEqual([77, 150, 220, 295]);
    expect(jobs.map((j) => j.label)).toEqual(['objective.model.temperature=77', 'objective.model.temperature=150', 'objective.model.temperature=220', 'objective.model.temperature=295']);
    // Self-contained: the palette is inline, and a job survives a round trip through JSON unchanged.
    expect(jobs[0].constraints.palette).toHaveLength(4);
    expect(JSON.parse(JSON.stringify(jobs))).toEqual(jobs);
    expect(new Set(jobs.map((j) => j.id)).size).toBe(4);
  });

  it('gives ids that are the SHA-256 of the canonical configs: stable across runs and key order', () => {
    const jobs = loadSweepJobs(repoFile('sweeps/demo-temperature.yaml'));
    const again = loadSweepJobs(repoFile('sweeps/demo-temperature.yaml'));
    expect(again.map((j) => j.id)).toEqual(jobs.map((j) => j.id));
    for (const job of jobs) expect(job.id).toBe(contentHash({ constraints: job.constraints, objective: job.objective }).slice(0, 16));
    expect(canonicalJson({ b: 1, a: [2, { d: 3, c: 4 }] })).toBe('{"a":[2,{"c":4,"d":3}],"b":1}');
    expect(contentHash({ b: [true, null], a: 1 })).toBe(contentHash({ a: 1, b: [true, null] }));
    // Digests from coreutils: printf '{"a":1,"b":[true,null]}' | sha256sum, and printf '[]' | sha256sum.
    expect(contentHash({ b: [true, null], a: 1 })).toBe('1cc69c7fa23616ca2ec3ee70d24390a6225c8832db8a4c814c7e0e7f942f8668');
    expect(contentHash([])).toBe('4f53cda18c2baa0c0354bb5f9a3ecbe5ed12ab4d8e11ba873c2f11161202b945');
  });

  it('makes a grid of every combination, first field slowest, or zips fields together', () => {
    const vary = [
      { path: 'objective.model.temperature', values: [200, 300] },
      { path: 'constraints.spacing.min', range: { start: 0.8, stop: 1.2, steps: 3 } },
    ];
    const grid = expandSweep(sweepOf(vary), base());
    expect(grid).toHaveLength(6);
    expect(grid.map((j) => [j.point['objective.model.temperature'], j.point['constraints.spacing.min']])).toEqual([
      [200, 0.8], [200, 1], [200, 1.2], [300, 0.8], [300, 1], [300, 1.2],
    ]);
    expect(grid[4].constraints.spacing.min).toBe(1);
    const zip = expandSweep(sweepOf([vary[0], { path: 'constraints.spacing.min', values: [0.9, 1.1] }], 'zip'), base());
    expect(zip.map((j) => j.label)).toEqual(['objective.model.temperature=200, constraints.spacing.min=0.9', 'objective.model.temperature=300, constraints.spacing.min=1.1']);
  });

  it('spaces a range evenly with both ends included', () => {
    expect(axisValues({ path: 'x.y', range: { start: 0, stop: 1, steps: 11 } })).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
    expect(axisValues({ path: 'x.y', range: { start: 5, stop: 9, steps: 1 } })).toEqual([5]);
  });

  it('leaves the base configs untouched and re-applies defaults and checks at each point', () => {
    const b = base();
    const before = JSON.stringify(b);
    const jobs = expandSweep(sweepOf([{ path: 'constraints.dyes.count', values: [3, 4] }]), b);
    expect(JSON.stringify(b)).toBe(before);
    expect(jobs[1].constraints.dyes.count).toEqual({ min: 4, max: 4 });
  });

  it('reports points whose values break the configs, naming the varied field', () => {
    const bad = expandSweepChecked(sweepOf([{ path: 'objective.model.temperature', values: [300, -5] }]), base(), 'temps.yaml');
    expect(bad.jobs).toEqual([]);
    expect(bad.issues).toMatchObject([{ file: 'temps.yaml', path: '/vary/0', message: expect.stringMatching(/at objective\.model\.temperature=-5: the objective \/model\/temperature must be > 0/) }]);
    const hsr = expandSweepChecked(sweepOf([{ path: 'objective.model.kind', values: ['hsr'] }]), base(), 'k.yaml');
    expect(hsr.issues.map((i) => i.message).join('\n')).toMatch(/dephasing is required|temperature is not a known key/);
    const missing = expandSweepChecked(sweepOf([{ path: 'objective.nowhere.deep', values: [1] }]), base(), 'm.yaml');
    expect(missing.issues).toMatchObject([{ path: '/vary/0/path', message: expect.stringMatching(/nowhere does not exist/) }]);
    const proto = expandSweepChecked(sweepOf([{ path: 'objective.__proto__.x', values: [1] }]), base(), 'p.yaml');
    expect(proto.issues[0].message).toMatch(/reserved name/);
    const twice = expandSweepChecked(sweepOf([{ path: 'objective.model.temperature', values: [300, 300] }]), base(), 't.yaml');
    expect(twice.issues[0].message).toMatch(/points 0 and 1 .* give the same configs/);
    const zip = expandSweepChecked(sweepOf([{ path: 'objective.model.temperature', values: [1, 2] }, { path: 'constraints.spacing.min', values: [1] }], 'zip'), base(), 'z.yaml');
    expect(zip.issues[0].message).toMatch(/zip needs the same number/);
  });

  it('reads its base files relative to the sweep file and reports their problems under their names', () => {
    const write = scratch();
    write('c.yaml', MINIMAL_CONSTRAINTS);
    write('o.yaml', MINIMAL_OBJECTIVE.replace('kind: redfield', 'kind: redfield\n  colour: blue'));
    const sweepFile = write('s.yaml', 'format: lumenfold.sweep/1\nconstraints: c.yaml\nobjective: o.yaml\nvary:\n  - {path: objective.model.temperature, values: [1, 2]}\n');
    const err = configError(() => loadSweepJobs(sweepFile));
    expect(err.issues).toMatchObject([{ file: expect.stringMatching(/o\.yaml$/), path: '/model/colour' }]);
    write('o.yaml', MINIMAL_OBJECTIVE);
    const sweep = loadConfigFile(sweepFile, 'sweep');
    expect(expandSweep(sweep, sweepFile)).toHaveLength(2);
    expect(parse(MINIMAL_OBJECTIVE).model.kind).toBe('redfield');
  });
});
