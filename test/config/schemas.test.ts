import { readFileSync } from 'node:fs';
import { Ajv2020 } from 'ajv/dist/2020.js';
import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import { readSchema } from '../../src/config/schemas.js';

// The shipped schemas are checked with a fresh ajv in strict mode (no lumenfold code in between), and
// the demo files, parsed by the yaml package itself, must validate against them as written.
const SCHEMAS = ['palette.schema.json', 'scaffold.schema.json', 'constraints.schema.json', 'objective.schema.json', 'sweep.schema.json'] as const;

function strictAjv(): Ajv2020 {
  const ajv = new Ajv2020({ strict: true, allErrors: true, discriminator: true });
  for (const name of SCHEMAS) ajv.addSchema(readSchema(name), name);
  return ajv;
}

const DEMOS: [string, string][] = [
  ['constraints/demo-helix.yaml', 'constraints.schema.json'],
  ['constraints/palettes/demo-dyes.yaml', 'palette.schema.json'],
  ['objectives/demo-robust.yaml', 'objective.schema.json'],
  ['objectives/demo-uphill.yaml', 'objective.schema.json'],
  ['sweeps/demo-temperature.yaml', 'sweep.schema.json'],
];

describe('shipped JSON Schemas', () => {
  it.each(SCHEMAS)('%s is a valid draft 2020-12 schema and compiles in strict mode', (name) => {
    const ajv = strictAjv();
    expect(ajv.validateSchema(readSchema(name)), JSON.stringify(ajv.errors)).toBe(true);
    expect(() => ajv.getSchema(name)).not.toThrow();
  });

  it.each(DEMOS)('%s validates against %s', (file, schema) => {
    const validate = strictAjv().getSchema(schema)!;
    const doc = parse(readFileSync(new URL(`../../${file}`, import.meta.url), 'utf8'));
    expect(validate(doc), JSON.stringify(validate.errors)).toBe(true);
  });

  it('every object in every schema closes its keys (additionalProperties false) or is a union or a $ref', () => {
    const open: string[] = [];
    const visit = (node: unknown, where: string): void => {
      if (Array.isArray(node)) return node.forEach((n, i) => visit(n, `${where}/${i}`));
      if (node === null || typeof node !== 'object') return;
      const schema = node as Record<string, unknown>;
      const isObjectSchema = schema.type === 'object' && schema.properties !== undefined;
      const isBranchMarker = Object.keys(schema.properties ?? {}).every((k) => (schema.properties as Record<string, unknown>)[k] === true);
      if (isObjectSchema && !isBranchMarker && schema.additionalProperties !== false) open.push(where);
      for (const [key, value] of Object.entries(schema)) visit(value, `${where}/${key}`);
    };
    for (const name of SCHEMAS) visit(readSchema(name), name);
    expect(open).toEqual([]);
  });

  it('states a $schema key as allowed and a format constant at the top of every file schema', () => {
    for (const name of ['palette.schema.json', 'constraints.schema.json', 'objective.schema.json', 'sweep.schema.json'] as const) {
      const properties = readSchema(name).properties as Record<string, Record<string, unknown>>;
      expect(properties.$schema.type).toBe('string');
      expect(properties.format.const).toMatch(/^lumenfold\.[a-z]+\/1$/);
    }
  });
});
