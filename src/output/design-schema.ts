/** The JSON Schema of lumenfold.design/1 (designs/design.schema.json), precompiled or compiled once, with readable errors. */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import type { ErrorObject, ValidateFunction } from 'ajv';
import { pointerToken, type DesignIssue } from './design-error.js';
import { validatorHash } from '../validator-hash.js';
import * as generated from './design-validator.generated.js';

// ajv itself (with its URI library) is loaded only when the schema has to be compiled at run time.
const require = createRequire(import.meta.url);

export const DESIGN_FORMAT = 'lumenfold.design/1';

/** Absolute path of the shipped schema (this module sits two folders below the package root). */
export const DESIGN_SCHEMA_PATH = fileURLToPath(new URL('../../designs/design.schema.json', import.meta.url));

/** The schema document. */
export function designSchema(): Record<string, unknown> {
  return JSON.parse(readFileSync(DESIGN_SCHEMA_PATH, 'utf8')) as Record<string, unknown>;
}

/**
 * ajv's options here and in the precompiled validator (tools/build-validators.mjs): strict mode, strictNumbers
 * (refuses NaN and Infinity), allErrors (report every problem), verbose (errors carry schema and data, for our messages).
 */
export const DESIGN_AJV_OPTIONS = { strict: true, strictNumbers: true, allErrors: true, verbose: true } as const;

/** Compile the schema now with ajv (the fallback when the precompiled validator is stale). */
export function compileDesignSchema(): ValidateFunction {
  const ajv = new (require('ajv/dist/2020.js') as typeof import('ajv/dist/2020.js')).Ajv2020({ ...DESIGN_AJV_OPTIONS });
  return ajv.compile(designSchema());
}

/**
 * sha256 of ajv's version, DESIGN_AJV_OPTIONS and the shipped schema (parsed, so white space does not count), as
 * tools/build-validators.mjs computes it: the precompiled validator is used only while its hash is this one.
 */
export function designSchemaHash(): string {
  return validatorHash(DESIGN_AJV_OPTIONS, [['design.schema.json', designSchema()]]);
}

/** A validator: true when the document is valid, else false with `errors` set. */
export type DesignValidator = ((doc: unknown) => boolean) & { errors?: ErrorObject[] | null };

/** The validator of tools/build-validators.mjs, or undefined when it was not made from the shipped schema. */
export function precompiledDesignValidator(): DesignValidator | undefined {
  return generated.SCHEMA_HASH === designSchemaHash() ? (generated.design as DesignValidator) : undefined;
}

let compiled: DesignValidator | undefined;

/** The validator in use: the precompiled one when it is current, else the schema compiled once per process. */
export function designValidator(): DesignValidator {
  return (compiled ??= precompiledDesignValidator() ?? compileDesignSchema());
}

function shown(v: unknown): string {
  if (typeof v === 'string') return JSON.stringify(v.length > 40 ? `${v.slice(0, 40)}...` : v);
  if (Array.isArray(v)) return 'a list';
  if (v !== null && typeof v === 'object') return 'an object';
  return String(v);
}

/** Words for one ajv error, and the pointer it belongs to. */
function explain(e: ErrorObject): { path: string; message: string } {
  const p = e.params as Record<string, unknown>;
  const parent = (e.parentSchema ?? {}) as Record<string, unknown>;
  const at = e.instancePath;
  if (p.propertyName !== undefined) {
    return { path: `${at}/${pointerToken(String(p.propertyName))}`, message: 'is not an allowed name: a letter, then lower-case letters, digits and _ (at most 64 characters)' };
  }
  switch (e.keyword) {
    case 'required':
      return { path: `${at}/${pointerToken(String(p.missingProperty))}`, message: 'is required but missing' };
    case 'additionalProperties':
      return { path: `${at}/${pointerToken(String(p.additionalProperty))}`, message: `is not a known key; known keys here: ${Object.keys((parent.properties as object) ?? {}).join(', ')}` };
    case 'type': {
      const quoted = typeof e.data === 'string' && e.data.trim() !== '' && !Number.isNaN(Number(e.data));
      return { path: at, message: `must be ${String(p.type)}, not ${shown(e.data)}${quoted ? ' (write numbers without quotes)' : ''}` };
    }
    case 'const':
      return { path: at, message: `must be ${JSON.stringify(p.allowedValue)}, not ${shown(e.data)}` };
    case 'enum':
      return { path: at, message: `must be one of ${(p.allowedValues as unknown[]).join(', ')}, not ${shown(e.data)}` };
    case 'pattern':
    case 'minLength':
    case 'maxLength':
      return { path: at, message: `${shown(e.data)} is not allowed: ${String(parent.description ?? e.message)}` };
    case 'minimum':
    case 'maximum':
    case 'exclusiveMinimum':
    case 'exclusiveMaximum':
      return { path: at, message: `must be ${String(p.comparison)} ${String(p.limit)}, not ${shown(e.data)}` };
    case 'minItems':
    case 'maxItems':
      return { path: at, message: `must have ${e.keyword === 'minItems' ? 'at least' : 'at most'} ${String(p.limit)} entries` };
    default:
      return { path: at, message: e.message ?? 'is not valid' };
  }
}

/** Site n is at /sites/(n-1); say its 1-based id beside the pointer. */
function withSiteId(path: string, message: string): string {
  const m = /^\/sites\/(\d+)/.exec(path);
  return m ? `${message} (site ${Number(m[1]) + 1})` : message;
}

/** Check a parsed document against the schema; every problem as an issue (empty when valid). */
export function schemaIssues(doc: unknown, file: string): DesignIssue[] {
  const validate = designValidator();
  if (validate(doc)) return [];
  const seen = new Set<string>();
  const out: DesignIssue[] = [];
  for (const e of validate.errors ?? []) {
    const { path, message } = explain(e);
    const key = `${path} ${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ file, path, message: withSiteId(path, message) });
  }
  return out;
}
