import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import type { ErrorObject } from 'ajv';
import type { Ajv2020 } from 'ajv/dist/2020.js';
import { validatorHash } from '../validator-hash.js';
import * as generated from './validators.generated.js';

// ajv itself (about 70 ms to load) is loaded only when a schema has to be compiled at run time.
const require = createRequire(import.meta.url);

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

/** The options of every ajv instance here and of the precompiled validators (tools/build-validators.mjs). */
export const AJV_OPTIONS = { strict: true, allErrors: true, useDefaults: true, discriminator: true, verbose: true } as const;

/**
 * A fresh ajv instance in strict mode with every shipped schema added: allErrors (report every problem),
 * useDefaults (fill in the defaults the schemas declare), discriminator (one branch per `kind`), verbose
 * (errors carry the schema and data, for our messages).
 */
export function createAjv(): Ajv2020 {
  const ajv = new (require('ajv/dist/2020.js') as typeof import('ajv/dist/2020.js')).Ajv2020({ ...AJV_OPTIONS });
  for (const name of Object.keys(SCHEMA_FILES) as (keyof typeof SCHEMA_FILES)[]) {
    ajv.addSchema(readSchema(name), name);
  }
  return ajv;
}

/**
 * sha256 of ajv's version, AJV_OPTIONS and the shipped schemas in name order (parsed, so white space does not count): the
 * precompiled validators are used only while the hash they were generated with is this one.
 */
export function schemaHash(): string {
  return validatorHash(AJV_OPTIONS, (Object.keys(SCHEMA_FILES) as (keyof typeof SCHEMA_FILES)[]).sort().map((name) => [name, readSchema(name)] as const));
}

/** A validator: true when the data is valid (filling in defaults, in place), else false with `errors` set. */
export type ConfigValidator = ((data: unknown) => boolean) & { errors?: ErrorObject[] | null };

/** The validators of tools/build-validators.mjs, or undefined when they are not those of the shipped schemas. */
export function precompiledValidators(): Readonly<Record<ConfigKind, ConfigValidator>> | undefined {
  if (generated.SCHEMA_HASH !== schemaHash()) return undefined;
  return generated as unknown as Record<ConfigKind, ConfigValidator>;
}

/** The validator of one kind compiled now, as the precompiled ones were (also the fallback when they are stale). */
export function compileValidator(kind: ConfigKind, ajv: Ajv2020 = createAjv()): ConfigValidator {
  const validate = ajv.getSchema(TOP_SCHEMA[kind]);
  if (validate === undefined) throw new Error(`schema ${TOP_SCHEMA[kind]} did not compile`);
  return validate;
}

let precompiled: Readonly<Record<ConfigKind, ConfigValidator>> | null | undefined;
let ajv: Ajv2020 | undefined;
const validators = new Map<ConfigKind, ConfigValidator>();

/**
 * The validator for one kind of file: the precompiled one when it matches the shipped schemas, else compiled
 * once per process (and only for the kinds used).
 */
export function validatorFor(kind: ConfigKind): ConfigValidator {
  let validate = validators.get(kind);
  if (validate === undefined) {
    if (precompiled === undefined) precompiled = precompiledValidators() ?? null;
    if (precompiled !== null) validate = precompiled[kind];
    else validate = compileValidator(kind, (ajv ??= createAjv()));
    validators.set(kind, validate);
  }
  return validate;
}
