import { dirname, isAbsolute, join } from 'node:path';
import { ajvIssues, positionOf } from './ajv-issues.js';
import { ConfigError, sortIssues, type ConfigIssue } from './config-error.js';
import type { ConstraintSet, Palette } from './constraints-types.js';
import { constraintProblems, objectiveProblems, paletteProblems, type DocumentProblem } from './document-checks.js';
import { checkFormat } from './format-check.js';
import type { Objective } from './objective-types.js';
import { parseTree, type Position } from './parse-tree.js';
import { decodeConfigBytes, readConfigText, sniffSyntax, type SourceText, type Syntax } from './read-text.js';
import { readSchema, validatorFor, type ConfigKind } from './schemas.js';
import type { Sweep } from './sweep-types.js';

/** The typed object each kind of file loads to. */
export interface ConfigByKind {
  constraints: ConstraintSet;
  objective: Objective;
  sweep: Sweep;
  palette: Palette;
}

/** The outcome of reading one file: its kind and typed value when valid, and every issue found. */
export interface Inspection<K extends ConfigKind = ConfigKind> {
  kind?: K;
  value?: ConfigByKind[K];
  issues: ConfigIssue[];
  /** Places of the document's keys in the file (line and column), when read from text. */
  positions?: Map<string, Position>;
}

export interface ValidateOptions {
  /** Name of the file the value came from, for messages. */
  file: string;
  /** Folder that relative paths inside the document (palette_file) are resolved against. */
  baseDir: string;
  /** Places of the document's keys in the file, for messages. */
  positions?: Map<string, Position>;
}

let schemaRoots: Record<string, unknown>[] | undefined;
function roots(): Record<string, unknown>[] {
  schemaRoots ??= (['palette.schema.json', 'scaffold.schema.json', 'constraints.schema.json', 'objective.schema.json', 'sweep.schema.json'] as const).map(readSchema);
  return schemaRoots;
}

/** Issues at JSON pointers of a file, with their line and column when known. */
export function asIssues(problems: readonly DocumentProblem[], file: string, positions: Map<string, Position> = new Map()): ConfigIssue[] {
  return problems.map((p) => {
    const pos = positionOf(positions, p.path);
    return { file, path: p.path, message: p.message, ...(pos ? { line: pos.line, column: pos.column } : {}) };
  });
}

/**
 * Validates plain data as a config of the given kind (or of the kind its format key names): format,
 * schema (filling in defaults, in place), the checks a schema cannot state, and for a constraint set its
 * palette file. Never throws for bad input; returns every issue found.
 */
export function validateConfigValue<K extends ConfigKind>(value: unknown, kind: K | undefined, options: ValidateOptions): Inspection<K> {
  const { file } = options;
  const positions = options.positions ?? new Map<string, Position>();
  const format = checkFormat(value, kind);
  if (!('kind' in format)) return { issues: asIssues([format], file, positions) };
  const actual = format.kind as K;
  const validate = validatorFor(actual);
  if (!validate(value)) return { kind: actual, issues: ajvIssues(validate.errors ?? [], file, positions, roots()) };
  const issues: ConfigIssue[] = [];
  if (actual === 'constraints') {
    const doc = value as ConstraintSet & { palette_file?: string; dyes: { count: unknown } };
    issues.push(...sortIssues(asIssues(constraintProblems(doc), file, positions)));
    if (doc.palette_file !== undefined) {
      // The palette file's own issues follow, under its own name.
      const path = isAbsolute(doc.palette_file) ? doc.palette_file : join(options.baseDir, doc.palette_file);
      const palette = inspectConfigFile(path, 'palette');
      issues.push(...palette.issues);
      if (palette.value !== undefined) doc.palette = palette.value.dyes;
      delete doc.palette_file;
    }
    if (typeof doc.dyes.count === 'number') doc.dyes.count = { min: doc.dyes.count, max: doc.dyes.count };
  } else if (actual === 'objective') {
    issues.push(...sortIssues(asIssues(objectiveProblems(value as Objective), file, positions)));
  } else if (actual === 'palette') {
    issues.push(...asIssues(paletteProblems((value as Palette).dyes, '/dyes'), file, positions));
  }
  if (issues.length > 0) return { kind: actual, issues, positions };
  return { kind: actual, value: value as ConfigByKind[K], issues, positions };
}

function inspectSource<K extends ConfigKind>(source: SourceText, kind: K | undefined, baseDir: string): Inspection<K> {
  const parsed = parseTree(source);
  if (parsed.tree === undefined) return { issues: parsed.issues };
  return validateConfigValue(parsed.tree.value, kind, { file: source.file, baseDir, positions: parsed.tree.positions });
}

/** Reads and validates one file without throwing; kind undefined means: whatever its format key says. */
export function inspectConfigFile<K extends ConfigKind>(file: string, kind?: K): Inspection<K> {
  let source: SourceText;
  try {
    source = readConfigText(file);
  } catch (err) {
    if (err instanceof ConfigError) return { issues: [...err.issues] };
    throw err;
  }
  return inspectSource(source, kind, dirname(file));
}

function valueOrThrow<K extends ConfigKind>(inspection: Inspection<K>): ConfigByKind[K] {
  if (inspection.value === undefined) throw new ConfigError(inspection.issues);
  return inspection.value;
}

/**
 * Loads a config file (YAML or JSON by extension; sniffed when there is none) as a typed object with
 * defaults applied. Throws ConfigError (an InputError) listing every issue, each naming the file, the
 * JSON pointer in it and what is wrong.
 */
export function loadConfigFile<K extends ConfigKind>(file: string, kind: K): ConfigByKind[K] {
  return valueOrThrow(inspectConfigFile(file, kind));
}

export interface ParseTextOptions {
  /** Name shown in messages (default "<text>"). */
  file?: string;
  /** yaml or json (default: sniffed from the text). */
  syntax?: Syntax;
  /** Folder for relative paths inside the document (default: the folder of file, else the working folder). */
  baseDir?: string;
}

/** Like loadConfigFile, for text held in memory. */
export function parseConfigText<K extends ConfigKind>(text: string, kind: K, options: ParseTextOptions = {}): ConfigByKind[K] {
  const file = options.file ?? '<text>';
  const decoded = decodeConfigBytes(new TextEncoder().encode(text), file);
  const source: SourceText = { file, text: decoded, syntax: options.syntax ?? sniffSyntax(decoded) };
  const baseDir = options.baseDir ?? (options.file !== undefined ? dirname(options.file) : '.');
  return valueOrThrow(inspectSource(source, kind, baseDir));
}
