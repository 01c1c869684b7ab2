/**
 * CSV as RFC 4180 (Shafranovskiy, "Common Format and MIME Type for Comma-Separated Values (CSV) Files",
 * 2005) defines it: records end in CRLF, fields are separated by commas, and a field that holds a comma, a
 * double quote, CR or LF is enclosed in double quotes with each double quote doubled (section 2, rules 1-7).
 */
import { InputError } from '../errors.js';

export type Cell = string | number | undefined;

/** One field: numbers in their shortest exact decimal form, undefined as an empty field, quoted when needed. */
export function csvField(value: Cell): string {
  if (value === undefined) return '';
  if (typeof value === 'number' && !Number.isFinite(value)) throw new InputError(`a CSV table cannot hold the number ${value}`);
  const s = String(value);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** A table: the header row, then one row per record, each line ending in CRLF. */
export function formatCsv(header: readonly string[], rows: readonly (readonly Cell[])[]): string {
  return [header, ...rows].map((row) => row.map(csvField).join(',') + '\r\n').join('');
}

/** Parse RFC 4180 CSV text into rows of fields (a final line break is optional; LF alone is accepted too). */
export function parseCsv(text: string): string[][] {
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let i = 0;
  let quoted = false;
  let started = false;
  const endField = () => { row.push(field); field = ''; };
  const endRow = () => { endField(); rows.push(row); row = []; started = false; };
  while (i < text.length) {
    const c = text[i];
    started = true;
    if (quoted) {
      if (c === '"' && text[i + 1] === '"') { field += '"'; i += 2; continue; }
      if (c === '"') {
        quoted = false;
        i++;
        if (i < text.length && !/[,\r\n]/.test(text[i])) throw new InputError(`CSV: text after a closing double quote (row ${rows.length + 1})`);
        continue;
      }
      field += c; i++; continue;
    }
    if (c === '"' && field === '') { quoted = true; i++; continue; }
    if (c === '"') throw new InputError(`CSV: a double quote inside an unquoted field (row ${rows.length + 1})`);
    if (c === ',') { endField(); i++; continue; }
    if (c === '\r' && text[i + 1] === '\n') { endRow(); i += 2; continue; }
    if (c === '\n') { endRow(); i++; continue; }
    field += c; i++;
  }
  if (quoted) throw new InputError(`CSV: a quoted field is not closed (row ${rows.length + 1})`);
  if (started) endRow();
  return rows;
}
