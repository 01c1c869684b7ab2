import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { compileDesignSchema, designSchemaHash, designValidator, precompiledDesignValidator, schemaIssues, type DesignValidator } from '../../src/output/design-schema.js';
import * as generated from '../../src/output/design-validator.generated.js';
import { ROOT, runCli } from '../helpers/cli.js';

// The precompiled design validator (ajv's standalone code, tools/build-validators.mjs) is checked against the
// reference it stands in for: ajv 8's own run-time compiler given the same schema and options
// (compileDesignSchema). Both must give the same verdict and the same error objects (with the schema, parent
// schema and data that `verbose` adds), hence the same messages. The valid documents are design files the
// built binary writes, and the two shipped examples.

type Doc = Record<string, any>;
const PRECOMPILED = generated.design as DesignValidator;
const dir = mkdtempSync(join(tmpdir(), 'lumenfold-precompiled-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const valid: [string, Doc][] = ['demo-helix-7', 'demo-wire-4'].map((n) => [`example ${n}`, JSON.parse(readFileSync(`${ROOT}designs/examples/${n}.design.json`, 'utf8')) as Doc]);
let optimizeStderr = '';

beforeAll(() => {
  // NODE_DEBUG=module makes Node name every CommonJS file it loads (ajv and its URI library are CommonJS).
  const r = runCli(['optimize', '--budget', '32', '--out', join(dir, 'run'), '--force', '--quiet'], { env: { NODE_DEBUG: 'module' } });
  expect(r.code, r.stderr).toBe(0);
  optimizeStderr = r.stderr;
  for (const f of readdirSync(join(dir, 'run', 'designs')).sort()) valid.push([`written ${f}`, JSON.parse(readFileSync(join(dir, 'run', 'designs', f), 'utf8')) as Doc]);
}, 120_000);

/** Broken copies of a written design: each edit with what it breaks. */
const EDITS: [string, (d: Doc) => void][] = [
  ['an energy as a string and an unknown key', (d) => { d.sites[0].energy = '18000'; d.sites[1].colour = 'red'; }],
  ['a missing dipole and a wrong format', (d) => { delete d.sites[1].dipole; d.format = 'lumenfold.design/2'; }],
  ['a bad role and a negative dipole', (d) => { d.sites[0].role = 'acceptor'; d.sites[0].dipole = -1; }],
  ['a NaN coordinate and an infinite energy', (d) => { d.sites[0].position.x = Number.NaN; d.sites[1].energy = Number.POSITIVE_INFINITY; }],
  ['a bad metric name and a line break in the name', (d) => { d.metrics = { ...d.metrics, 'Not Snake': 1 }; d.name = 'two\nlines'; }],
  ['no sites and a name too long', (d) => { d.name = 'x'.repeat(300); d.sites = []; }],
  ['a list where the anchor goes and a zero lifetime', (d) => { d.sites[0].anchor = [1, 2]; d.sites[1].lifetime = 0; }],
];

/** Runs a validator on a copy of the document: its verdict and errors. */
function run(validate: DesignValidator, doc: unknown) {
  const valid = validate(structuredClone(doc));
  return { valid, errors: validate.errors ?? null };
}

function broken(edit: (d: Doc) => void): Doc {
  const doc = structuredClone(valid.at(-1)![1]);
  edit(doc);
  return doc;
}

describe('precompiled design validator', () => {
  it('was generated from the shipped schema (else: node tools/build-validators.mjs), and is the one used', () => {
    expect(generated.SCHEMA_HASH).toBe(designSchemaHash());
    expect(precompiledDesignValidator()).toBe(PRECOMPILED);
    expect(designValidator()).toBe(PRECOMPILED);
  });

  it('the optimize run wrote design files, without loading ajv or its URI library (only its runtime helpers)', () => {
    expect(valid.filter(([name]) => name.startsWith('written')).length).toBeGreaterThanOrEqual(2);
    expect(optimizeStderr).toMatch(/node_modules\/ajv\/dist\/runtime\/ucs2length/);
    expect(optimizeStderr).not.toMatch(/node_modules\/ajv\/dist\/(2020|core|ajv)\.js|fast-uri/);
  });

  it('gives the same verdict and errors as ajv compiling at run time, on valid files and broken copies', () => {
    const runtime = compileDesignSchema();
    for (const [name, doc] of valid) {
      expect(run(PRECOMPILED, doc), name).toEqual({ valid: true, errors: null });
      expect(run(runtime, doc), name).toEqual({ valid: true, errors: null });
    }
    for (const [name, edit] of EDITS) {
      const precompiled = run(PRECOMPILED, broken(edit));
      expect(precompiled.valid, name).toBe(false);
      expect(precompiled.errors!.length, name).toBeGreaterThan(1);
      for (const error of precompiled.errors!) expect(error, name).toHaveProperty('parentSchema');
      expect(precompiled, name).toEqual(run(runtime, broken(edit)));
    }
  });

  it('is not used when its hash is not that of the shipped schema: the schema is compiled, with the same messages', async () => {
    const GENERATED = '../../src/output/design-validator.generated.js';
    vi.resetModules();
    vi.doMock(GENERATED, async (original) => ({ ...(await original<object>()), SCHEMA_HASH: 'stale' }));
    // the module keeps the stale hash it was linked with after the mock is gone
    const stale = await import('../../src/output/design-schema.js').finally(() => { vi.doUnmock(GENERATED); vi.resetModules(); });
    expect(stale.precompiledDesignValidator()).toBeUndefined();
    // a function compiled by ajv at run time carries its schema environment; the standalone code does not
    expect(stale.designValidator()).toHaveProperty('schemaEnv');
    expect(PRECOMPILED).not.toHaveProperty('schemaEnv');
    for (const [name, edit] of EDITS) {
      const issues = schemaIssues(broken(edit), 'x.design.json');
      expect(issues.length, name).toBeGreaterThan(1);
      expect(stale.schemaIssues(broken(edit), 'x.design.json'), name).toEqual(issues);
    }
  });
});
