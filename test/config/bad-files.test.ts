import { describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../src/config/load.js';
import { MAX_DEPTH, MAX_FILE_BYTES } from '../../src/config/limits.js';
import { configError, MINIMAL_CONSTRAINTS, MINIMAL_OBJECTIVE, scratch } from './helpers.js';

const write = scratch();

/** Loads a bad file and returns its issues; each must name the file, in the message too. */
function issuesOf(name: string, content: string | Uint8Array, kind: 'constraints' | 'objective' = 'constraints') {
  const file = write(name, content);
  const err = configError(() => loadConfigFile(file, kind));
  expect(err.message).toContain(file);
  for (const issue of err.issues) {
    expect(issue.file).toBe(file);
    expect(err.message).toContain(issue.path === '' ? '(top level)' : issue.path);
  }
  return err.issues;
}

describe('bad config files give an InputError naming the file, the JSON pointer and the problem', () => {
  it('an unknown key', () => {
    const issues = issuesOf('unknown.yaml', MINIMAL_CONSTRAINTS.replace('  kind: box', '  kind: box\n  colour: red'));
    expect(issues).toMatchObject([{ path: '/scaffold/colour', line: 10 }]);
    expect(issues[0].message).toMatch(/not a known key.*size/);
  });

  it('an unknown key in JSON', () => {
    const doc = { format: 'lumenfold.objective/1', score: { kind: 'pareto', metrics: [] }, model: { kind: 'hsr', dephasing: 1, extra: 1 } };
    const issues = issuesOf('unknown.json', JSON.stringify(doc, null, 1), 'objective');
    expect(issues.map((i) => i.path).sort()).toEqual(['/model/extra', '/score/metrics']);
  });

  it('a wrong type, deep in a list', () => {
    const text = MINIMAL_CONSTRAINTS.replace(/scaffold:[\s\S]*$/, 'scaffold:\n  kind: anchors\n  anchors:\n    - {x: 0, y: 0, z: 0}\n    - {x: 1, y: 0, z: 0}\n    - {x: 2, y: 0, z: 0}\n    - {x: [3], y: 0, z: 0}\n');
    const issues = issuesOf('type.yaml', text);
    expect(issues).toMatchObject([{ path: '/scaffold/anchors/3/x' }]);
    expect(issues[0].message).toMatch(/must be a number, not a list/);
  });

  it('a missing required field', () => {
    const issues = issuesOf('missing.yaml', MINIMAL_CONSTRAINTS.replace('  traps: [2]\n', ''));
    expect(issues).toMatchObject([{ path: '/dyes/traps', message: 'is required but missing.' }]);
  });

  it('NaN and Infinity, in YAML and in JSON', () => {
    const yaml = issuesOf('nan.yaml', MINIMAL_CONSTRAINTS.replace('energy: 18000', 'energy: .nan').replace('energy: 17000', 'energy: -.inf'));
    expect(yaml.map((i) => i.path)).toEqual(['/palette/0/energy', '/palette/1/energy']);
    expect(yaml[0].message).toMatch(/NaN and Infinity are not allowed/);
    const json = issuesOf('inf.json', '{"format": "lumenfold.objective/1", "model": {"kind": "hsr", "dephasing": 1e999}}', 'objective');
    expect(json).toMatchObject([{ path: '/model/dephasing' }]);
  });

  it('a number given as a string', () => {
    const issues = issuesOf('string.yaml', MINIMAL_CONSTRAINTS.replace('dipole: 12', 'dipole: "12"'));
    expect(issues).toMatchObject([{ path: '/palette/1/dipole' }]);
    expect(issues[0].message).toMatch(/not the string "12"; write numbers without quotes/);
  });

  it('a duplicate YAML key, and a duplicate JSON key', () => {
    const yaml = issuesOf('dup.yaml', MINIMAL_CONSTRAINTS.replace('  count: 3\n', '  count: 3\n  count: 4\n'));
    expect(yaml).toMatchObject([{ path: '/dyes/count', line: 7 }]);
    expect(yaml[0].message).toMatch(/repeats the key "count"/);
    const json = issuesOf('dup.json', '{"format": "lumenfold.objective/1", "format": "lumenfold.objective/1"}', 'objective');
    expect(json).toMatchObject([{ path: '/format' }]);
  });

  it('a YAML alias bomb fails at once without expanding anything', () => {
    let bomb = 'a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n';
    for (let i = 1; i < 10; i++) bomb += `a${i}: &a${i} [${Array(9).fill(`*a${i - 1}`).join(', ')}]\n`;
    // Expanding it would build 9^10 (3.5e9) strings and run out of memory; every alias is refused instead.
    const issues = issuesOf('bomb.yaml', bomb);
    expect(issues.length).toBe(81);
    expect(issues[0].message).toMatch(/alias/);
  });

  it('a __proto__, constructor or prototype key', () => {
    const issues = issuesOf('proto.yaml', `${MINIMAL_CONSTRAINTS}__proto__: {polluted: true}\nenergetics:\n  constructor: 1\n`);
    expect(issues.map((i) => i.path)).toEqual(['/__proto__', '/energetics/constructor']);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    const json = issuesOf('proto.json', '{"format": "lumenfold.objective/1", "prototype": {}}', 'objective');
    expect(json).toMatchObject([{ path: '/prototype' }]);
  });

  it('an empty file, a blank file and a file of comments only', () => {
    expect(issuesOf('empty.yaml', '')[0].message).toMatch(/empty/);
    expect(issuesOf('blank.json', '  \n\n')[0].message).toMatch(/empty/);
    expect(issuesOf('comments.yaml', '# nothing here\n')[0].message).toMatch(/no value/);
  });

  it('a binary file, and text that is not UTF-8', () => {
    expect(issuesOf('binary.yaml', new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0]))[0].message).toMatch(/binary/);
    expect(issuesOf('latin1.yaml', new Uint8Array([0x61, 0x3a, 0x20, 0xe9, 0x0a]))[0].message).toMatch(/UTF-8/);
  });

  it(`nesting deeper than ${MAX_DEPTH} levels, in flow and in block style`, () => {
    const flow = issuesOf('deep-flow.yaml', `format: lumenfold.constraints/1\nx: ${'['.repeat(100000)}${']'.repeat(100000)}\n`);
    expect(flow[0].message).toMatch(/nested more than 32 levels/);
    let block = 'format: lumenfold.constraints/1\n';
    for (let i = 0; i < MAX_DEPTH + 5; i++) block += `${' '.repeat(i)}k:\n`;
    const issues = issuesOf('deep-block.yaml', block);
    expect(issues[0].message).toMatch(/nested more than 32 levels/);
    expect(issues[0].path.split('/').length - 1).toBe(MAX_DEPTH);
  });

  it(`a file larger than ${MAX_FILE_BYTES} bytes`, () => {
    const big = `${MINIMAL_CONSTRAINTS}# ${'x'.repeat(MAX_FILE_BYTES)}\n`;
    expect(issuesOf('big.yaml', big)[0].message).toMatch(/limited to 1048576 bytes/);
  });

  it('YAML-only syntax in a .json file', () => {
    const issues = issuesOf('loose.json', '{"format": "lumenfold.objective/1", "score": {"kind": "pareto",},}', 'objective');
    expect(issues[0].message).toMatch(/not valid JSON/);
  });

  it('a YAML tag, a merge key and several documents', () => {
    expect(issuesOf('tag.yaml', MINIMAL_CONSTRAINTS.replace('dipole: 12', 'dipole: !!float 12'))[0].message).toMatch(/tag/);
    expect(issuesOf('merge.yaml', `${MINIMAL_CONSTRAINTS}spacing:\n  <<: {min: 2}\n`)).toMatchObject([{ path: '/spacing/<<' }]);
    expect(issuesOf('multi.yaml', `${MINIMAL_CONSTRAINTS}---\nformat: x\n`)[0].message).toMatch(/multiple documents/);
  });

  it('a file of another kind or another version', () => {
    expect(issuesOf('kind.yaml', MINIMAL_OBJECTIVE)[0].message).toMatch(/objective recipe .* but a constraint set/);
    const v2 = issuesOf('v2.yaml', MINIMAL_CONSTRAINTS.replace('constraints/1', 'constraints/2'));
    expect(v2).toMatchObject([{ path: '/format' }]);
    expect(v2[0].message).toMatch(/version 2 is not supported/);
    expect(issuesOf('list.yaml', '- 1\n- 2\n')[0].message).toMatch(/must be a mapping/);
  });

  it('an unknown kind in a union, and a value that fits no branch', () => {
    const kind = issuesOf('kind2.yaml', MINIMAL_CONSTRAINTS.replace('kind: box', 'kind: torus'));
    expect(kind).toMatchObject([{ path: '/scaffold/kind' }]);
    expect(kind[0].message).toMatch(/one of: box, cylinder, sphere, slab, anchors, helix_lattice/);
    const count = issuesOf('count.yaml', MINIMAL_CONSTRAINTS.replace('count: 3', 'count: three'));
    expect(count).toMatchObject([{ path: '/dyes/count' }]);
    expect(count[0].message).toMatch(/a whole number or a mapping/);
    const range = issuesOf('count2.yaml', MINIMAL_CONSTRAINTS.replace('count: 3', 'count: {min: 2, max: 1.5}'));
    expect(range.map((i) => i.path)).toEqual(['/dyes/count/max']);
  });

  it('reports every problem of a file, not only the first', () => {
    const text = MINIMAL_CONSTRAINTS.replace('dipole: 10', 'dipole: -1').replace('count: 3', 'count: 0').replace('size: {x: 4, y: 4, z: 4}', 'size: {x: 4, y: 4}');
    const issues = issuesOf('many.yaml', `${text}spacing: {min: 1, max: 2}\n`);
    expect(issues.map((i) => i.path).sort()).toEqual(['/dyes/count', '/palette/0/dipole', '/scaffold/size/z', '/spacing/max']);
  });

  it('an uphill metric with the hsr model, with the reason', () => {
    const text = MINIMAL_OBJECTIVE.replace('metric: efficiency', 'metric: uphill_efficiency').replace('kind: redfield', 'kind: hsr\n  dephasing: 10');
    const issues = issuesOf('hsr-uphill.yaml', text, 'objective');
    expect(issues).toMatchObject([{ path: '/model/kind' }]);
    expect(issues[0].message).toMatch(/infinite-temperature model: it treats uphill and downhill steps alike/);
  });

  it('what a schema cannot state: reversed ranges, zero vectors, repeated names and pins', () => {
    const text = MINIMAL_CONSTRAINTS.replace('name: DyeB', 'name: DyeA')
      .replace('count: 3', 'count: {min: 4, max: 2}')
      .replace('size: {x: 4, y: 4, z: 4}', 'size: {x: 4, y: 4, z: 4}\n  dipole: {kind: cone, axis: {x: 0, y: 0, z: 0}, half_angle: 20}');
    const extra = 'fixed:\n  - {site: 0, direction: {x: 0, y: 0, z: 0}}\n  - {site: 0, dye: DyeA}\nenergetics:\n  rules:\n    - {sites: all, range: {min: 19000, max: 18000, like: DyeA}}\n  trap_offset: {min: 5, max: -5}\n';
    const issues = issuesOf('semantic.yaml', `${text}${extra}`);
    expect(issues.map((i) => i.path)).toEqual([
      '/palette/1/name', '/dyes/count', '/scaffold/dipole/axis', '/fixed/0/direction', '/fixed/1/site', '/energetics/rules/0/range', '/energetics/trap_offset',
    ]);
  });

  it('a palette file that is missing or broken is reported under its own name', () => {
    const missing = write('no-palette.yaml', MINIMAL_CONSTRAINTS.replace(/palette:\n(  - .*\n)+/, 'palette_file: nowhere.yaml\n'));
    const err = configError(() => loadConfigFile(missing, 'constraints'));
    expect(err.issues).toMatchObject([{ file: expect.stringMatching(/nowhere\.yaml$/), message: expect.stringMatching(/cannot be read/) }]);
    write('bad-dyes.yaml', 'format: lumenfold.palette/1\ndyes:\n  - {name: A, energy: 1, dipole: 1, reorganization: 0, lifetime: 1, length: 0}\n  - {name: A, energy: 18000, dipole: 1, reorganization: 0, lifetime: 1, length: 0}\n');
    const broken = write('broken-palette.yaml', MINIMAL_CONSTRAINTS.replace(/palette:\n(  - .*\n)+/, 'palette_file: bad-dyes.yaml\n'));
    const issues = configError(() => loadConfigFile(broken, 'constraints')).issues;
    expect(issues.map((i) => [i.file.endsWith('bad-dyes.yaml'), i.path])).toEqual([[true, '/dyes/0/energy']]);
  });
});
