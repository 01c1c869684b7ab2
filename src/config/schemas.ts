import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Ajv2020, type ValidateFunction } from 'ajv/dist/2020.js';

/** The kinds of config file lumenfold reads, each with its own format name and schema. */
export type ConfigKind = 'constraints' | 'objective' | 'sweep' | 'palette';

/** Format name and version written in each file's `format` key. */
export const FORMATS: Readonly<Record<ConfigKind, string>> = {
  constraints: 'lumenfold.constraints/1',
  objective: 'lumenfold.objective/1',
  sweep: 'lumenfold.sweep/1',
  palette: 'lumenfold.palette/1',
};

/** Schema files, relative to the package root; the key is the name other schemas use in $ref. */
const SCHEMA_FILES = {
  'palette.schema.json': 'constraints/palette.schema.json',
  'scaffold.schema.json': 'constraints/scaffold.schema.json',
  'constraints.schema.json': 'constraints/constraints.schema.json',
  'objective.schema.json': 'objectives/objective.schema.json',
  'sweep.schema.json': 'sweeps/sweep.schema.json',
} as const;

const TOP_SCHEMA: Readonly<Record<ConfigKind, keyof typeof SCHEMA_FILES>> = {
  constraints: 'constraints.schema.json',
  objective: 'objective.schema.json',
  sweep: 'sweep.schema.json',
  palette: 'palette.schema.json',
};

/** Absolute path of a shipped schema file (this module sits two levels below the package root). */
export function schemaPath(name: keyof typeof SCHEMA_FILES): string {
  return fileURLToPath(new URL(`../../${SCHEMA_FILES[name]}`, import.meta.url));
}

/** Reads a shipped schema file as JSON. */
export function readSchema(name: keyof typeof SCHEMA_FILES): Record<string, unknown> {
  return JSON.parse(readFileSync(schemaPath(name), 'utf8')) as Record<string, unknown>;
}

/**
 * A fresh ajv instance in strict mode with every shipped schema added: allErrors (report every problem),
 * useDefaults (fill in the defaults the schemas declare), discriminator (one branch per `kind`), verbose
 * (errors carry the schema and data, for our messages).
 */
export function createAjv(): Ajv2020 {
  const ajv = new Ajv2020({ strict: true, allErrors: true, useDefaults: true, discriminator: true, verbose: true });
  for (const name of Object.keys(SCHEMA_FILES) as (keyof typeof SCHEMA_FILES)[]) {
    ajv.addSchema(readSchema(name), name);
  }
  return ajv;
}

let ajv: Ajv2020 | undefined;
const validators = new Map<ConfigKind, ValidateFunction>();

/** The compiled validator for one kind of file (compiled once per process, and only for the kinds used). */
export function validatorFor(kind: ConfigKind): ValidateFunction {
  let validate = validators.get(kind);
  if (validate === undefined) {
    ajv ??= createAjv();
    validate = ajv.getSchema(TOP_SCHEMA[kind]);
    if (validate === undefined) throw new Error(`schema ${TOP_SCHEMA[kind]} did not compile`);
    validators.set(kind, validate);
  }
  return validate;
}
