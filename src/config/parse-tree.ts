import { isAlias, isMap, isScalar, isSeq, LineCounter, parseDocument, type Node as YamlNode } from 'yaml';
import { pointerToken, type ConfigIssue } from './config-error.js';
import { findDeepFlow } from './flow-depth.js';
import { FORBIDDEN_KEYS, MAX_DEPTH } from './limits.js';
import type { SourceText } from './read-text.js';

export interface Position {
  line: number;
  column: number;
}

/** A parsed document as plain JSON data, with the place in the file of every key and list item. */
export interface ParsedTree {
  value: unknown;
  positions: Map<string, Position>;
}

/**
 * Parses YAML (1.2 core schema) or JSON text into plain data. Refused, each as an issue with its JSON
 * pointer: duplicate keys, aliases, tags, NaN and Infinity, keys that name JavaScript internals,
 * non-string keys, nesting deeper than MAX_DEPTH, several documents in one file. JSON is first checked by
 * JSON.parse, so YAML-only syntax in a .json file is an error.
 */
export function parseTree(source: SourceText): { tree?: ParsedTree; issues: ConfigIssue[] } {
  const { file, text, syntax } = source;
  const lines = new LineCounter();
  const issues: ConfigIssue[] = [];
  const at = (offset: number): Position => {
    const pos = lines.linePos(offset);
    return { line: pos.line, column: pos.col };
  };
  const deep = findDeepFlow(text, MAX_DEPTH);
  if (deep >= 0) {
    indexLines(text, lines);
    return { issues: [{ file, path: '', message: `is nested more than ${MAX_DEPTH} levels deep.`, ...at(deep) }] };
  }
  if (syntax === 'json') {
    const problem = jsonSyntaxProblem(text);
    if (problem !== undefined) {
      indexLines(text, lines);
      const pos = problem.offset === undefined ? {} : at(problem.offset);
      return { issues: [{ file, path: '', message: `is not valid JSON: ${problem.message}`, ...pos }] };
    }
  }
  const doc = parseDocument(text, {
    version: '1.2',
    schema: 'core',
    merge: false,
    uniqueKeys: false,
    prettyErrors: false,
    lineCounter: lines,
  });
  for (const problem of [...doc.errors, ...doc.warnings]) {
    const message =
      problem.code === 'RESOURCE_EXHAUSTION'
        ? `is nested too deeply to parse (at most ${MAX_DEPTH} levels).`
        : `is not valid ${syntax === 'json' ? 'JSON' : 'YAML'}: ${problem.message.split('\n')[0]}`;
    issues.push({ file, path: '', message, ...at(problem.pos[0]) });
  }
  if (issues.length > 0) return { issues };
  if (doc.contents === null) {
    return { issues: [{ file, path: '', message: 'holds no value (only comments); a config file holds one mapping.' }] };
  }
  const positions = new Map<string, Position>();
  const walk = (node: unknown, pointer: string, depth: number): unknown => {
    const yamlNode = node as YamlNode | null;
    const report = (message: string) =>
      issues.push({ file, path: pointer, message, ...(yamlNode?.range ? at(yamlNode.range[0]) : {}) });
    if (yamlNode === null || yamlNode === undefined) return null;
    if (depth > MAX_DEPTH) return report(`is nested more than ${MAX_DEPTH} levels deep.`), null;
    if (isAlias(yamlNode)) return report('uses a YAML alias (*name); aliases are not accepted, write the value out.'), null;
    if (yamlNode.tag !== undefined) return report(`uses the YAML tag ${yamlNode.tag}; tags are not accepted.`), null;
    if (isScalar(yamlNode)) {
      const v = yamlNode.value;
      if (typeof v === 'number' && !Number.isFinite(v)) {
        return report(`is ${String(v)}; NaN and Infinity are not allowed, write a finite number.`), null;
      }
      if (v !== null && typeof v === 'object') return report('is not a plain value.'), null;
      return v;
    }
    if (isSeq(yamlNode)) {
      return yamlNode.items.map((item, i) => {
        const child = `${pointer}/${i}`;
        const range = (item as YamlNode | null)?.range;
        if (range) positions.set(child, at(range[0]));
        return walk(item, child, depth + 1);
      });
    }
    if (isMap(yamlNode)) {
      const out: Record<string, unknown> = {};
      for (const pair of yamlNode.items) {
        const keyNode = pair.key as YamlNode | null;
        const keyPos = keyNode?.range ? at(keyNode.range[0]) : {};
        if (!isScalar(keyNode) || keyNode.tag !== undefined || keyNode.value === null || typeof keyNode.value === 'object') {
          issues.push({ file, path: pointer, message: 'has a key that is not a plain string.', ...keyPos });
          continue;
        }
        const key = String(keyNode.value);
        const child = `${pointer}/${pointerToken(key)}`;
        if (FORBIDDEN_KEYS.has(key)) {
          issues.push({ file, path: child, message: `uses the key "${key}", which is reserved (a JavaScript object internal).`, ...keyPos });
          continue;
        }
        if (Object.hasOwn(out, key)) {
          issues.push({ file, path: child, message: `repeats the key "${key}"; each key may appear once in a mapping.`, ...keyPos });
          continue;
        }
        if (keyNode.range) positions.set(child, at(keyNode.range[0]));
        out[key] = walk(pair.value, child, depth + 1);
      }
      return out;
    }
    return report('is not a value lumenfold can read.'), null;
  };
  const contents = doc.contents as YamlNode;
  if (contents.range) positions.set('', at(contents.range[0]));
  const value = walk(contents, '', 1);
  return issues.length > 0 ? { issues } : { tree: { value, positions }, issues };
}

/** The yaml parser fills the line counter as it reads; when we stop before parsing, fill it here. */
function indexLines(text: string, lines: LineCounter): void {
  lines.addNewLine(0);
  for (let i = text.indexOf('\n'); i >= 0; i = text.indexOf('\n', i + 1)) lines.addNewLine(i + 1);
}

function jsonSyntaxProblem(text: string): { message: string; offset?: number } | undefined {
  try {
    JSON.parse(text);
    return undefined;
  } catch (err) {
    const message = (err as Error).message;
    const match = /at position (\d+)/.exec(message);
    return { message, offset: match ? Number(match[1]) : undefined };
  }
}
