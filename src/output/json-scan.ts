/**
 * A syntax check of JSON text (RFC 8259) before JSON.parse: it names the line and column of the first
 * syntax error (JSON.parse's messages do not always), refuses keys given twice in one object (JSON.parse
 * keeps the last one silently) and nesting deeper than a limit. Builds no values.
 */
import { pointerToken } from './design-error.js';

export interface JsonProblem {
  /** JSON pointer of the object holding a repeated key, or '' for a syntax error. */
  readonly path: string;
  readonly message: string;
}

/** Deepest nesting of objects and lists accepted (a design file needs 4). */
export const MAX_JSON_DEPTH = 32;

class Stop extends Error {
  constructor(readonly problem: JsonProblem) {
    super(problem.message);
  }
}

const NUMBER = /-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/y;
const STRING = /"(?:[^"\\\u0000-\u001f]|\\(?:["\\/bfnrt]|u[0-9a-fA-F]{4}))*"/y;

/** The first problem of the text, or undefined when it is well-formed JSON without repeated keys. */
export function scanJson(text: string): JsonProblem | undefined {
  let i = 0;
  const where = (at: number): string => {
    const before = text.slice(0, at).split('\n');
    return `line ${before.length}, column ${before[before.length - 1].length + 1}`;
  };
  const fail = (what: string): never => {
    const found = i < text.length ? `'${text[i]}'` : 'the end of the file';
    throw new Stop({ path: '', message: `is not valid JSON: ${what} at ${where(i)}, found ${found}` });
  };
  const space = () => { while (i < text.length && ' \t\n\r'.includes(text[i])) i++; };
  const match = (re: RegExp): string | undefined => {
    re.lastIndex = i;
    const m = re.exec(text);
    if (m) i += m[0].length;
    return m?.[0];
  };
  const value = (path: string, depth: number): void => {
    if (depth > MAX_JSON_DEPTH) throw new Stop({ path, message: `is nested more than ${MAX_JSON_DEPTH} levels deep` });
    space();
    const c = text[i];
    if (c === '{') {
      i++;
      const keys = new Set<string>();
      space();
      if (text[i] === '}') { i++; return; }
      for (;;) {
        space();
        const raw = match(STRING) ?? fail('expected a key in double quotes');
        const key = JSON.parse(raw) as string;
        if (keys.has(key)) throw new Stop({ path: `${path}/${pointerToken(key)}`, message: `the key "${key}" is given twice in one object (${where(i - raw.length)})` });
        keys.add(key);
        space();
        if (text[i++] !== ':') { i--; fail("expected ':' after the key"); }
        value(`${path}/${pointerToken(key)}`, depth + 1);
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === '}') { i++; return; }
        fail("expected ',' or '}'");
      }
    }
    if (c === '[') {
      i++;
      space();
      if (text[i] === ']') { i++; return; }
      for (let k = 0; ; k++) {
        value(`${path}/${k}`, depth + 1);
        space();
        if (text[i] === ',') { i++; continue; }
        if (text[i] === ']') { i++; return; }
        fail("expected ',' or ']'");
      }
    }
    if (c === '"') { if (match(STRING) === undefined) fail('a string that is not closed or holds a raw control character or a bad escape'); return; }
    if (match(NUMBER) !== undefined) return;
    for (const word of ['true', 'false', 'null']) if (text.startsWith(word, i)) { i += word.length; return; }
    fail('expected a value (NaN, Infinity, single quotes and comments are not JSON)');
  };
  try {
    value('', 0);
    space();
    if (i < text.length) fail('expected the end of the file after the value');
    return undefined;
  } catch (e) {
    if (e instanceof Stop) return e.problem;
    throw e;
  }
}
