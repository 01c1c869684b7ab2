import { describe, expect, it } from 'vitest';
import { stringify } from 'yaml';
import { loadConfigFile, parseConfigText } from '../../src/config/load.js';
import { readSchema } from '../../src/config/schemas.js';
import { MINIMAL_CONSTRAINTS, MINIMAL_OBJECTIVE, repoFile, scratch } from './helpers.js';

type Json = Record<string, any>;
const schemaDefault = (schema: Json, ...keys: string[]) => keys.reduce((node, key) => node[key], schema).default;

describe('loading good files', () => {
  it('loads the demo constraint set with its palette file read and defaults filled in', () => {
    const c = loadConfigFile(repoFile('constraints/demo-helix.yaml'), 'constraints');
    expect(c.palette.map((d) => d.name)).toEqual(['Aurelin-520', 'Tessin-555', 'Tessin-590', 'Morvane-630']);
    expect(c.dyes.count).toEqual({ min: 7, max: 7 });
    expect(c.scaffold.kind).toBe('helix_lattice');
    const scaffold = readSchema('scaffold.schema.json') as Json;
    if (c.scaffold.kind !== 'helix_lattice') throw new Error('unreachable');
    expect(c.scaffold.phase).toBe(schemaDefault(scaffold, '$defs', 'helix_lattice', 'properties', 'phase'));
    expect(c.scaffold.helix_phase).toBe(schemaDefault(scaffold, '$defs', 'helix_lattice', 'properties', 'helix_phase'));
    expect('palette_file' in c).toBe(false);
  });

  it('fills in the defaults the constraints schema declares', () => {
    const c = parseConfigText(MINIMAL_CONSTRAINTS, 'constraints');
    const schema = readSchema('constraints.schema.json') as Json;
    expect(c.spacing.min).toBe(schemaDefault(schema, 'properties', 'spacing', 'properties', 'min'));
    // 1.0 nm: dyes closer than this quench or aggregate (common practice).
    expect(c.spacing.min).toBe(1.0);
    expect(c.fixed).toEqual(schemaDefault(schema, 'properties', 'fixed'));
    expect(c.energetics.rules).toEqual([]);
    expect(c.scaffold.dipole).toEqual(schemaDefault(readSchema('scaffold.schema.json') as Json, '$defs', 'box', 'properties', 'dipole'));
    expect(c.dyes.count).toEqual({ min: 3, max: 3 });
  });

  it('fills in the defaults the objective schema declares, down to nested objects', () => {
    const o = parseConfigText(MINIMAL_OBJECTIVE, 'objective');
    const schema = readSchema('objective.schema.json') as Json;
    const props = schema.properties;
    expect(o.excitation).toEqual(props.excitation.default);
    expect(o.coupling.refractive_index).toBe(props.coupling.properties.refractive_index.default);
    expect(o.disorder.samples).toBe(props.disorder.properties.samples.default);
    expect(o.uphill.step).toBe(props.uphill.properties.step.default);
    if (o.model.kind !== 'redfield') throw new Error('unreachable');
    expect(o.model.temperature).toBe(schema.$defs.redfield.properties.temperature.default);
    expect(o.model.bath.cutoff).toBe(schema.$defs.redfield.properties.bath.properties.cutoff.default);
    expect(o.model.loss).toEqual(schema.$defs.redfield.properties.loss.default);
    expect(o.score.kind === 'weighted_sum' && o.score.terms[0].weight).toBe(1);
  });

  it('loads the demo objectives and the demo sweep', () => {
    expect(loadConfigFile(repoFile('objectives/demo-robust.yaml'), 'objective').model.kind).toBe('redfield');
    expect(loadConfigFile(repoFile('objectives/demo-uphill.yaml'), 'objective').uphill.limit).toBe(1500);
    expect(loadConfigFile(repoFile('sweeps/demo-temperature.yaml'), 'sweep').combine).toBe('grid');
  });

  it('reads JSON and YAML of the same document to the same object, with or without an extension', () => {
    const yaml = loadConfigFile(repoFile('objectives/demo-robust.yaml'), 'objective');
    const write = scratch();
    const fromJson = loadConfigFile(write('robust.json', JSON.stringify(yaml, null, 2)), 'objective');
    const fromBareJson = loadConfigFile(write('robust', JSON.stringify(yaml)), 'objective');
    const fromBareYaml = loadConfigFile(write('robust-yaml', stringify(yaml)), 'objective');
    expect(fromJson).toEqual(yaml);
    expect(fromBareJson).toEqual(yaml);
    expect(fromBareYaml).toEqual(yaml);
  });

  it('accepts a palette given inline or in a file beside the constraint set', () => {
    const write = scratch();
    write('dyes.json', JSON.stringify({ format: 'lumenfold.palette/1', dyes: parseConfigText(MINIMAL_CONSTRAINTS, 'constraints').palette }));
    const withFile = MINIMAL_CONSTRAINTS.replace(/palette:\n(  - .*\n)+/, 'palette_file: dyes.json\n');
    const c = loadConfigFile(write('set.yaml', withFile), 'constraints');
    expect(c).toEqual(parseConfigText(MINIMAL_CONSTRAINTS, 'constraints'));
  });

  it('applies defaults in a valid document without changing what the user wrote', () => {
    const o = parseConfigText(`${MINIMAL_OBJECTIVE}disorder: {samples: 5}\n`, 'objective');
    expect(o.disorder.samples).toBe(5);
    expect(o.disorder.energy_sigma).toBe(100);
  });
});
