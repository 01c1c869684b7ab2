import type { ErrorObject } from 'ajv';
import { pointerKeys, pointerToken, sortIssues, type ConfigIssue } from './config-error.js';
import type { Position } from './parse-tree.js';

type Schema = Record<string, unknown>;

/** The JSON type of a value, with integers told apart, as JSON Schema's `type` names it. */
function jsonType(value: unknown): string {
  if (value === null) return 'null';
  if (Array.isArray(value)) return 'array';
  if (typeof value === 'number') return Number.isInteger(value) ? 'integer' : 'number';
  return typeof value;
}

function typeMatches(value: unknown, type: unknown): boolean {
  const types = Array.isArray(type) ? type : [type];
  const actual = jsonType(value);
  return types.some((t) => t === actual || (t === 'number' && actual === 'integer'));
}

const ARTICLE: Record<string, string> = {
  integer: 'a whole number',
  number: 'a number',
  string: 'a string',
  boolean: 'true or false',
  object: 'a mapping (keys and values)',
  array: 'a list',
  null: 'null',
};

function describeValue(value: unknown): string {
  if (typeof value === 'string') return `the string ${JSON.stringify(value.length > 40 ? `${value.slice(0, 40)}...` : value)}`;
  if (typeof value === 'number' || typeof value === 'boolean' || value === null) return String(value);
  return ARTICLE[jsonType(value)];
}

/** Ajv reports anyOf/oneOf failures with the errors of every branch; keep only the useful ones. */
function pruneCombinators(errors: ErrorObject[]): ErrorObject[] {
  const dropped = new Set<ErrorObject>();
  const extra: ErrorObject[] = [];
  const combinators = errors
    .filter((e) => e.keyword === 'anyOf' || e.keyword === 'oneOf')
    .sort((a, b) => a.schemaPath.length - b.schemaPath.length);
  for (const combinator of combinators) {
    if (dropped.has(combinator)) continue;
    const prefix = `${combinator.schemaPath}/`;
    const inside = errors.filter((e) => e.schemaPath.startsWith(prefix));
    const branches = combinator.schema as Schema[];
    dropped.add(combinator);
    const typed = branches.every((b) => b.type !== undefined);
    const matching = typed ? branches.flatMap((b, i) => (typeMatches(combinator.data, b.type) ? [i] : [])) : [];
    if (typed && matching.length === 1) {
      for (const e of inside) if (!e.schemaPath.startsWith(`${prefix}${matching[0]}/`)) dropped.add(e);
      continue;
    }
    for (const e of inside) dropped.add(e);
    if (typed && matching.length === 0) {
      const wanted = branches.map((b) => ARTICLE[String(b.type)] ?? String(b.type)).join(' or ');
      extra.push({ ...combinator, keyword: 'lumenfold', message: `must be ${wanted}, not ${describeValue(combinator.data)}.` });
      continue;
    }
    const options = branches.map((b) => ((b.required as string[] | undefined) ?? []).join(' and '));
    const passing = (combinator.params as { passingSchemas?: unknown }).passingSchemas;
    const message = Array.isArray(passing)
      ? `gives ${options.join(' and ')}; give only one of them.`
      : `needs one of: ${options.join(', ')}.`;
    extra.push({ ...combinator, keyword: 'lumenfold', message });
  }
  return [...errors.filter((e) => !dropped.has(e)), ...extra];
}

function resolveLocal(root: Schema, ref: string): Schema | undefined {
  return pointerKeys(ref.slice(1)).reduce<unknown>((node, key) => (node as Schema | undefined)?.[key], root) as
    | Schema
    | undefined;
}

/** The kinds a discriminated union accepts, read from its branches (resolved through local $refs). */
function discriminatorKinds(error: ErrorObject, roots: readonly Schema[]): string[] {
  const union = error.parentSchema as Schema;
  const tag = (error.params as { tag: string }).tag;
  const kinds: string[] = [];
  for (const branch of (union.oneOf as Schema[]) ?? []) {
    // A branch is inline or a local $ref ("#/$defs/box") into the schema file that holds the union;
    // the branch names are unique across our schema files, so the first file that resolves it is right.
    const candidates =
      typeof branch.$ref === 'string' && branch.$ref.startsWith('#/')
        ? roots.map((root) => resolveLocal(root, branch.$ref as string))
        : [branch];
    for (const target of candidates) {
      const value = ((target?.properties as Schema | undefined)?.[tag] as Schema | undefined)?.const;
      if (typeof value === 'string') {
        kinds.push(value);
        break;
      }
    }
  }
  return kinds;
}

function describe(error: ErrorObject, roots: readonly Schema[]): { path: string; message: string } {
  const path = error.instancePath;
  const params = error.params as Record<string, unknown>;
  const parent = error.parentSchema as Schema | undefined;
  switch (error.keyword) {
    case 'lumenfold':
      return { path, message: error.message ?? '' };
    case 'additionalProperties': {
      const key = String(params.additionalProperty);
      const allowed = Object.keys((parent?.properties as Schema | undefined) ?? {}).join(', ');
      return { path: `${path}/${pointerToken(key)}`, message: `is not a known key here; allowed keys: ${allowed}.` };
    }
    case 'required':
      return { path: `${path}/${pointerToken(String(params.missingProperty))}`, message: 'is required but missing.' };
    case 'type': {
      const wanted = ARTICLE[String(params.type)] ?? String(params.type);
      const data = error.data;
      const numeric = typeof data === 'string' && data.trim() !== '' && Number.isFinite(Number(data));
      const hint = numeric && /number|integer/.test(String(params.type)) ? '; write numbers without quotes' : '';
      return { path, message: `must be ${wanted}, not ${describeValue(data)}${hint}.` };
    }
    case 'const':
      return { path, message: `must be ${JSON.stringify(params.allowedValue)}, not ${describeValue(error.data)}.` };
    case 'enum':
      return { path, message: `must be one of: ${(params.allowedValues as unknown[]).join(', ')} (not ${describeValue(error.data)}).` };
    case 'discriminator': {
      const kinds = discriminatorKinds(error, roots).join(', ');
      const tagPath = `${path}/${pointerToken(String(params.tag))}`;
      if (params.tagValue === undefined) return { path: tagPath, message: `is required: one of ${kinds}.` };
      return { path: tagPath, message: `must be one of: ${kinds} (not ${describeValue(params.tagValue)}).` };
    }
    case 'minimum':
    case 'maximum':
    case 'exclusiveMinimum':
    case 'exclusiveMaximum':
      return { path, message: `must be ${String(params.comparison)} ${String(params.limit)} (not ${String(error.data)}).` };
    case 'minItems':
      return { path, message: `must have at least ${String(params.limit)} item(s).` };
    case 'maxItems':
      return { path, message: `must have at most ${String(params.limit)} items.` };
    case 'uniqueItems':
      return { path, message: `has the same value at items ${String(params.j)} and ${String(params.i)}; each may appear once.` };
    case 'minProperties': {
      const required = new Set((parent?.required as string[] | undefined) ?? []);
      const optional = Object.keys((parent?.properties as Schema | undefined) ?? {}).filter((k) => !required.has(k));
      return { path, message: `must give at least one of: ${optional.join(', ')}.` };
    }
    case 'pattern': {
      const why = typeof parent?.description === 'string' ? parent.description : `it must match ${String(params.pattern)}`;
      return { path, message: `${describeValue(error.data)} is not allowed here: ${why}` };
    }
    default:
      return { path, message: `${error.message ?? 'is not valid'}.` };
  }
}

/** The place of a pointer in the file, or of its nearest ancestor that has one. */
export function positionOf(positions: Map<string, Position>, pointer: string): Position | undefined {
  for (let p = pointer; ; p = p.slice(0, p.lastIndexOf('/'))) {
    const pos = positions.get(p);
    if (pos !== undefined || p === '') return pos;
  }
}

/** Turns ajv's errors into issues that name the file, the JSON pointer and what is wrong. */
export function ajvIssues(
  errors: readonly ErrorObject[],
  file: string,
  positions: Map<string, Position>,
  roots: readonly Schema[],
): ConfigIssue[] {
  const seen = new Set<string>();
  const issues: ConfigIssue[] = [];
  for (const error of pruneCombinators([...errors])) {
    const { path, message } = describe(error, roots);
    const key = `${path}\n${message}`;
    if (seen.has(key)) continue;
    seen.add(key);
    const pos = positionOf(positions, path);
    issues.push({ file, path, message, ...(pos ? { line: pos.line, column: pos.column } : {}) });
  }
  return sortIssues(issues);
}
