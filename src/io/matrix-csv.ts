import { readFileSync, statSync } from 'node:fs';
import { InputError } from '../errors.js';

/** Largest matrix file read, bytes (a 1000-site Hamiltonian at full precision is about 25 MB). */
export const MAX_MATRIX_FILE_BYTES = 64 * 1024 * 1024;

/**
 * Parse a square numeric matrix from CSV text: comma separated, no header, one row per line; blank lines
 * and surrounding spaces are ignored. Every cell must be a finite decimal number.
 */
export function parseMatrixCsv(text: string, file = 'matrix'): number[][] {
  if (text.includes('\u0000')) throw new InputError(`${file}: not a text file (contains NUL bytes)`);
  const rows: number[][] = [];
  text.split(/\r?\n/).forEach((line, li) => {
    if (line.trim() === '') return;
    const cells = line.split(',');
    rows.push(cells.map((cell, ci) => {
      const t = cell.trim();
      if (!/^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/.test(t)) {
        throw new InputError(`${file}: line ${li + 1}, column ${ci + 1}: '${t}' is not a finite number`);
      }
      return Number(t);
    }));
  });
  if (rows.length === 0) throw new InputError(`${file}: the file holds no matrix`);
  rows.forEach((r, i) => {
    if (r.length !== rows.length) throw new InputError(`${file}: the matrix must be square: row ${i + 1} has ${r.length} entries, expected ${rows.length}`);
  });
  return rows;
}

/** Read and parse a matrix CSV file, with a size limit. */
export function readMatrixCsv(path: string): number[][] {
  let size: number;
  try {
    size = statSync(path).size;
  } catch {
    throw new InputError(`${path}: cannot read the file`);
  }
  if (size > MAX_MATRIX_FILE_BYTES) throw new InputError(`${path}: file is ${size} bytes, above the limit of ${MAX_MATRIX_FILE_BYTES}`);
  return parseMatrixCsv(readFileSync(path, 'utf8'), path);
}

/** Write a matrix as CSV with the given significant digits. */
export function formatMatrixCsv(rows: ArrayLike<ArrayLike<number>>, digits = 10): string {
  return Array.from({ length: rows.length }, (_, i) => Array.from(rows[i], (v) => Number(v.toPrecision(digits)).toString()).join(',')).join('\n') + '\n';
}
