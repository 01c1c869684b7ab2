/**
 * Fixed columns of the wwPDB Atomic Coordinate Entry Format Version 3.3 (document v3.30, wwPDB):
 * every record is one 80-column line, columns numbered from 1, the record name in columns 1-6. The
 * tables below copy the column ranges of the records lumenfold writes from that document's record
 * format descriptions (Title section: TITLE; Heterogen section: HETNAM; Coordinate section: HETATM, TER;
 * Connectivity section: CONECT; Bookkeeping section: END).
 */
import { InputError } from '../errors.js';

/** [first column, last column, justification] of one field, 1-based and inclusive. */
export type Columns = readonly [number, number, 'left' | 'right'];

export const HETATM_COLUMNS = {
  serial: [7, 11, 'right'],
  name: [13, 16, 'left'],
  altLoc: [17, 17, 'left'],
  resName: [18, 20, 'right'],
  chainId: [22, 22, 'left'],
  resSeq: [23, 26, 'right'],
  iCode: [27, 27, 'left'],
  x: [31, 38, 'right'],
  y: [39, 46, 'right'],
  z: [47, 54, 'right'],
  occupancy: [55, 60, 'right'],
  tempFactor: [61, 66, 'right'],
  element: [77, 78, 'right'],
  charge: [79, 80, 'left'],
} as const satisfies Record<string, Columns>;

export const TER_COLUMNS = {
  serial: [7, 11, 'right'],
  resName: [18, 20, 'right'],
  chainId: [22, 22, 'left'],
  resSeq: [23, 26, 'right'],
  iCode: [27, 27, 'left'],
} as const satisfies Record<string, Columns>;

/** CONECT: the atom in 7-11, up to four bonded atoms in 12-16, 17-21, 22-26, 27-31. */
export const CONECT_COLUMNS: readonly Columns[] = [[7, 11, 'right'], [12, 16, 'right'], [17, 21, 'right'], [22, 26, 'right'], [27, 31, 'right']];

/** TITLE and HETNAM: continuation number in 9-10 (blank on the first record). */
export const CONTINUATION: Columns = [9, 10, 'right'];
export const TITLE_TEXT: Columns = [11, 80, 'left'];
export const HETNAM_ID: Columns = [12, 14, 'right'];
export const HETNAM_TEXT: Columns = [16, 70, 'left'];

export const LINE_WIDTH = 80;

/**
 * One 80-column record: the record name in columns 1-6, each field justified in its columns. A value wider
 * than its columns is an InputError naming `what` (a fixed-width format cannot hold it).
 */
export function layoutRecord(recordName: string, fields: readonly (readonly [Columns, string, string])[]): string {
  const line = recordName.padEnd(6).split('');
  while (line.length < LINE_WIDTH) line.push(' ');
  for (const [[first, last, justify], text, what] of fields) {
    const width = last - first + 1;
    if (text.length > width) throw new InputError(`PDB ${recordName.trim()} ${what}: '${text}' does not fit in columns ${first}-${last} (${width} characters)`);
    const cell = justify === 'right' ? text.padStart(width) : text.padEnd(width);
    for (let k = 0; k < width; k++) line[first - 1 + k] = cell[k];
  }
  return line.join('');
}

/** The text of columns first-last of a line (1-based, inclusive; missing columns read as blanks). */
export function columns(line: string, [first, last]: Columns): string {
  return line.slice(first - 1, last).padEnd(last - first + 1);
}
