import { readFileSync } from 'node:fs';
import { describe, expect, it, vi } from 'vitest';
import { parse } from 'yaml';
import { compileValidator, precompiledValidators, schemaHash, validatorFor, type ConfigKind, type ConfigValidator } from '../../src/config/schemas.js';
import * as generated from '../../src/config/validators.generated.js';
import { merged } from './helpers.js';

// The precompiled validators (ajv's standalone code, tools/build-validators.mjs) are checked against the
// reference they stand in for: ajv 8's own run-time compiler given the same schemas and options
// (compileValidator). Both must give the same verdict, the same error objects (with the schema, parent
// schema and data that `verbose` adds) and the same defaults filled into the document.

type Doc = Record<string, unknown>;
const shipped = (path: string): Doc => parse(readFileSync(new URL(`../../${path}`, import.meta.url), 'utf8')) as Doc;

const helix = shipped('constraints/demo-helix.yaml');
const dyes = shipped('constraints/palettes/demo-dyes.yaml');
const robust = shipped('objectives/demo-robust.yaml');
const uphill = shipped('objectives/demo-uphill.yaml');
const temperature = shipped('sweeps/demo-temperature.yaml');
const firstDye = (dyes.dyes as Doc[])[0];
const PRECOMPILED = generated as unknown as Record<ConfigKind, ConfigValidator>;

const CASES: [string, ConfigKind, Doc][] = [
  ['demo-helix as shipped', 'constraints', helix],
  ['demo-helix with an inline palette (defaults in the dyes)', 'constraints', merged(helix, { palette_file: undefined, palette: dyes.dyes })],
  ['demo-helix with an unknown key in the scaffold', 'constraints', merged(helix, { scaffold: { colour: 'red' } })],
  ['demo-helix with an unknown scaffold kind', 'constraints', merged(helix, { scaffold: { kind: 'torus' } })],
  ['demo-helix without a scaffold kind', 'constraints', merged(helix, { scaffold: { kind: undefined } })],
  ['demo-helix with a palette and a palette file', 'constraints', merged(helix, { palette: dyes.dyes })],
  ['demo-helix with neither palette nor palette file', 'constraints', merged(helix, { palette_file: undefined })],
  ['demo-helix with a count given as a string', 'constraints', merged(helix, { dyes: { count: '7' } })],
  ['demo-helix with a negative spacing and no traps', 'constraints', merged(helix, { spacing: { min: -1 }, dyes: { traps: undefined } })],
  ['demo-dyes as shipped', 'palette', dyes],
  ['demo-dyes with a bad name and an energy as a string', 'palette', merged(dyes, { dyes: [{ ...firstDye, name: 'a b/c', energy: '19230' }] })],
  ['demo-robust as shipped', 'objective', robust],
  ['demo-uphill as shipped', 'objective', uphill],
  ['demo-robust with an unknown metric and model kind', 'objective', merged(robust, { score: { terms: [{ metric: 'speed', sense: 'maximize' }] }, model: { kind: 'lindblad' } })],
  ['demo-robust with a wrong sense and a disorder list', 'objective', merged(robust, { score: { terms: [{ metric: 'efficiency', sense: 'up' }] }, disorder: [1] })],
  ['demo-temperature as shipped', 'sweep', temperature],
  ['demo-temperature with an empty vary list and an extra key', 'sweep', merged(temperature, { vary: [], extra: 1 })],
];

/** Runs a validator on a copy of the document: its verdict, errors and the copy as it left it. */
function run(validate: ConfigValidator, doc: Doc) {
  const data = structuredClone(doc);
  const valid = validate(data);
  return { valid, errors: validate.errors ?? null, data };
}

describe('precompiled config validators', () => {
  it('were generated from the shipped schema files (else: node tools/build-validators.mjs), and are the ones used', () => {
    expect(generated.SCHEMA_HASH).toBe(schemaHash());
    expect(precompiledValidators()).toBe(generated);
    for (const kind of ['constraints', 'objective', 'sweep', 'palette'] as const) expect(validatorFor(kind)).toBe(PRECOMPILED[kind]);
  });

  it.each(CASES)('%s: same verdict, errors and filled-in defaults as ajv compiling at run time', (_, kind, doc) => {
    const precompiled = run(PRECOMPILED[kind], doc);
    const runtime = run(compileValidator(kind), doc);
    expect(precompiled).toEqual(runtime);
    if (runtime.valid) {
      expect(runtime.errors).toBeNull();
    } else {
      expect(runtime.errors!.length).toBeGreaterThan(0);
      for (const error of precompiled.errors!) expect(error).toHaveProperty('parentSchema');
      for (const error of precompiled.errors!) expect(error).toHaveProperty('data');
    }
  });

  it('the cases cover valid and invalid documents of every kind, and defaults being filled in', () => {
    const outcomes = CASES.map(([, kind, doc]) => ({ kind, ...run(PRECOMPILED[kind], doc), before: doc }));
    for (const kind of ['constraints', 'objective', 'sweep', 'palette'] as const) {
      expect(outcomes.some((o) => o.kind === kind && o.valid)).toBe(true);
      expect(outcomes.some((o) => o.kind === kind && !o.valid)).toBe(true);
    }
    expect(outcomes.some((o) => o.valid && JSON.stringify(o.data) !== JSON.stringify(o.before))).toBe(true);
  });

  it('are not used when their hash is not that of the shipped schemas: the schemas are compiled instead', async () => {
    vi.resetModules();
    vi.doMock('../../src/config/validators.generated.js', async (original) => ({ ...(await original<object>()), SCHEMA_HASH: 'stale' }));
    try {
      const schemas = await import('../../src/config/schemas.js');
      expect(schemas.precompiledValidators()).toBeUndefined();
      const validate = schemas.validatorFor('objective');
      // a function compiled by ajv at run time carries its schema environment; the standalone code does not
      expect(validate).toHaveProperty('schemaEnv');
      expect(PRECOMPILED.objective).not.toHaveProperty('schemaEnv');
      expect(run(validate, robust)).toEqual(run(compileValidator('objective'), robust));
    } finally {
      vi.doUnmock('../../src/config/validators.generated.js');
      vi.resetModules();
    }
  });
});
