/** The JSON Schema of lumenfold.design/1 (designs/design.schema.json), compiled once, with readable errors. */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Ajv2020, type ErrorObject, type ValidateFunction } from 'ajv/dist/2020.js';
import { pointerToken, type DesignIssue } from './design-error.js';

export const DESIGN_FORMAT = 'lumenfold.design/1';

/** Absolute path of the shipped schema (this module sits two folders below the package root). */
export const DESIGN_SCHEMA_PATH = fileURLToPath(new URL('../../designs/design.schema.json', import.meta.url));

/** The schema document. */
export function designSchema(): Record<string, unknown> {
  return JSON.parse(readFileSync(DESIGN_SCHEMA_PATH, 'utf8')) as Record<string, unknown>;
}

/** Compile the schema in ajv's strict mode (strictNumbers refuses NaN and Infinity); allErrors reports every problem. */
export function compileDesignSchema(): ValidateFunction {
  const ajv = new Ajv2020({ strict: true, strictNumbers: true, allErrors: true, verbose: true });
  return ajv.compile(designSchema());
}

let compiled: ValidateFunction | undefined;

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
  compiled ??= compileDesignSchema();
  if (compiled(doc)) return [];
  const seen = new Set<string>();
  const out: DesignIssue[] = [];
  for (const e of compiled.errors ?? []) {
    const { path, message } = explain(e);
    const key = `${path} ${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    out.push({ file, path, message: withSiteId(path, message) });
  }
  return out;
}
