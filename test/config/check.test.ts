import { describe, expect, it } from 'vitest';
import { checkConfigFiles } from '../../src/config/check.js';
import { MINIMAL_CONSTRAINTS, MINIMAL_OBJECTIVE, repoFile, scratch } from './helpers.js';

describe('checkConfigFiles', () => {
  it('finds no issue in the demo files, and tells their kinds from the format key', () => {
    const files = ['constraints/demo-helix.yaml', 'constraints/palettes/demo-dyes.yaml', 'objectives/demo-robust.yaml', 'objectives/demo-uphill.yaml', 'sweeps/demo-temperature.yaml'].map(repoFile);
    const result = checkConfigFiles(files);
    expect(result.issues).toEqual([]);
    expect(result.files.map((f) => [f.kind, f.valid])).toEqual([['constraints', true], ['palette', true], ['objective', true], ['objective', true], ['sweep', true]]);
  });

  it('reports every issue of every file, each with its file, pointer and message', () => {
    const write = scratch();
    const a = write('a.yaml', MINIMAL_CONSTRAINTS.replace('dipole: 10', 'dipole: "10"').replace('  kind: box', '  kind: box\n  color: red'));
    const b = write('b.json', '{"format": "lumenfold.objective/1", "model": {"kind": "hsr"}}');
    const c = write('c.yaml', 'format: lumenfold.thing/1\n');
    const { issues, files } = checkConfigFiles([a, b, c]);
    expect(issues.map((i) => [i.file, i.path])).toEqual([
      [a, '/palette/0/dipole'],
      [a, '/scaffold/color'],
      [b, '/model/dephasing'],
      [b, '/score'],
      [c, '/format'],
    ]);
    expect(issues.every((i) => i.message.length > 10)).toBe(true);
    expect(files.map((f) => f.valid)).toEqual([false, false, false]);
  });

  it('adds the reasons no design can satisfy the configs, under the file they concern', () => {
    const write = scratch();
    const c = write('c.yaml', MINIMAL_CONSTRAINTS.replace('traps: [2]', 'traps: [2, 5]'));
    const o = write('o.yaml', `${MINIMAL_OBJECTIVE}excitation: {kind: site, site: 9}\n`);
    const { issues } = checkConfigFiles([c, o]);
    expect(issues.map((i) => [i.file, i.path])).toEqual([
      [c, '/dyes/traps/1'],
      [o, '/excitation/site'],
    ]);
    expect(issues[1].message).toMatch(/with the constraint set .*c\.yaml/);
    expect(issues[0].line).toBe(7);
    expect(checkConfigFiles([c, o], { precheck: false }).issues).toEqual([]);
  });

  it('prechecks every point of a sweep', () => {
    const write = scratch();
    write('c.yaml', MINIMAL_CONSTRAINTS);
    write('o.yaml', MINIMAL_OBJECTIVE);
    const s = write('s.yaml', 'format: lumenfold.sweep/1\nconstraints: c.yaml\nobjective: o.yaml\nvary:\n  - {path: constraints.dyes.count, values: [3, 200]}\n');
    const { issues } = checkConfigFiles([s]);
    expect(issues).toMatchObject([{ file: s, path: '/vary', message: expect.stringMatching(/^at constraints\.dyes\.count=200, the constraint set: dyes\.count asks for 200 dyes/) }]);
  });
});
