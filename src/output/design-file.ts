/** Reading and writing lumenfold.design/1 files. */
import { readFileSync, statSync } from 'node:fs';
import { writeFileAtomic } from './atomic.js';
import { designFail, DesignFileError } from './design-error.js';
import { designFromJson, designToJson } from './design-json.js';
import { scanJson } from './json-scan.js';
import { prettyJson } from './json-text.js';
import type { DesignRecord } from './record.js';

/** Largest design file read, bytes (16 MiB; a 10 000-site design is about 5 MB). */
export const MAX_DESIGN_FILE_BYTES = 16 * 1024 * 1024;

/** The text of a design file: size-limited, not empty, UTF-8 text without control bytes (tab, CR, LF allowed). */
function readText(file: string): string {
  let size: number;
  try {
    const st = statSync(file);
    if (!st.isFile()) designFail(file, '', 'is not a regular file');
    size = st.size;
  } catch (e) {
    if (e instanceof DesignFileError) throw e;
    designFail(file, '', `cannot be read (${(e as NodeJS.ErrnoException).code ?? String(e)})`);
  }
  if (size > MAX_DESIGN_FILE_BYTES) designFail(file, '', `is ${size} bytes; design files are limited to ${MAX_DESIGN_FILE_BYTES} bytes (16 MiB)`);
  const bytes = readFileSync(file);
  if (bytes.length === 0) designFail(file, '', 'is empty (0 bytes); a design file holds one JSON object with "format": "lumenfold.design/1"');
  const control = bytes.findIndex((b) => b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d);
  if (control >= 0) designFail(file, '', `is a binary file, not JSON text (control byte 0x${bytes[control].toString(16).padStart(2, '0')} at offset ${control})`);
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    designFail(file, '', 'is not UTF-8 text; save it as UTF-8');
  }
  if (text.charCodeAt(0) === 0xfeff) text = text.slice(1);
  if (text.trim() === '') designFail(file, '', 'holds only white space; a design file holds one JSON object with "format": "lumenfold.design/1"');
  return text;
}

/** Parse design JSON text: syntax errors name the line and column, repeated keys the pointer. */
export function parseDesignText(text: string, file: string): DesignRecord {
  const problem = scanJson(text);
  if (problem !== undefined) designFail(file, problem.path, problem.message);
  return designFromJson(JSON.parse(text), file);
}

/** Read and validate a design file. Every problem is a DesignFileError (an InputError) naming the file and the JSON pointer. */
export function readDesignFile(path: string): DesignRecord {
  return parseDesignText(readText(path), path);
}

/** The text of a design file for a record (validated; throws DesignFileError when the record is not valid). */
export function formatDesignFile(record: DesignRecord, options: { schemaRef?: string } = {}): string {
  return prettyJson(designToJson(record, options));
}

/** Write a record as a design file, atomically (a reader sees the old file or the whole new one). */
export function writeDesignFile(path: string, record: DesignRecord, options: { schemaRef?: string } = {}): void {
  writeFileAtomic(path, formatDesignFile(record, options));
}
