import { readFileSync, statSync } from 'node:fs';
import { extname } from 'node:path';
import { ConfigError } from './config-error.js';
import { MAX_FILE_BYTES } from './limits.js';

export type Syntax = 'yaml' | 'json';

/** The decoded text of a config file and the syntax it is parsed with. */
export interface SourceText {
  file: string;
  text: string;
  syntax: Syntax;
}

const EXTENSIONS: Record<string, Syntax> = { '.json': 'json', '.yaml': 'yaml', '.yml': 'yaml' };

function fail(file: string, message: string): never {
  throw new ConfigError([{ file, path: '', message }]);
}

/**
 * Reads a config file: at most MAX_FILE_BYTES, UTF-8 text, not empty, not binary. The syntax comes
 * from the extension (.json, .yaml, .yml); a file without an extension is sniffed (JSON when it starts
 * with { or [).
 */
export function readConfigText(file: string): SourceText {
  let size: number;
  try {
    const stat = statSync(file);
    if (!stat.isFile()) fail(file, 'is not a regular file.');
    size = stat.size;
  } catch (err) {
    if (err instanceof ConfigError) throw err;
    fail(file, `cannot be read (${(err as NodeJS.ErrnoException).code ?? String(err)}).`);
  }
  if (size > MAX_FILE_BYTES) fail(file, tooLarge(size));
  const bytes = readFileSync(file);
  const extension = extname(file).toLowerCase();
  const known = EXTENSIONS[extension];
  if (extension !== '' && known === undefined) {
    fail(file, `has the extension "${extension}"; config files end in .yaml, .yml or .json (or have no extension).`);
  }
  const text = decodeConfigBytes(bytes, file);
  return { file, text, syntax: known ?? sniffSyntax(text) };
}

function tooLarge(size: number): string {
  return `is ${size} bytes; config files are limited to ${MAX_FILE_BYTES} bytes (1 MiB).`;
}

/** Checks size, emptiness and encoding of raw bytes and returns the text without a byte-order mark. */
export function decodeConfigBytes(bytes: Uint8Array, file: string): string {
  const issue = byteProblem(bytes);
  if (issue !== undefined) throw new ConfigError([{ file, path: '', message: issue }]);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    fail(file, 'is not valid UTF-8 text; save it as UTF-8.');
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '') fail(file, 'is empty; a config file holds one mapping starting with a format key.');
  return text;
}

function byteProblem(bytes: Uint8Array): string | undefined {
  if (bytes.length === 0) return 'is empty (0 bytes); a config file holds one mapping starting with a format key.';
  if (bytes.length > MAX_FILE_BYTES) return tooLarge(bytes.length);
  if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
    return 'is UTF-16 text; save it as UTF-8.';
  }
  for (let i = 0; i < bytes.length; i++) {
    const b = bytes[i];
    // C0 control bytes other than tab, line feed and carriage return never occur in a text config.
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d) {
      return `looks like a binary file (control byte 0x${b.toString(16).padStart(2, '0')} at offset ${i}); config files are YAML or JSON text.`;
    }
  }
  return undefined;
}

/** JSON when the first non-blank character opens an object or a list, YAML otherwise. */
export function sniffSyntax(text: string): Syntax {
  const first = text.trimStart()[0];
  return first === '{' || first === '[' ? 'json' : 'yaml';
}
