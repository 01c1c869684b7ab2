/**
 * Read the records of a PDB file by their column positions (wwPDB Atomic Coordinate Entry Format
 * Version 3.3; columns in pdb-columns.ts): TITLE, HETNAM, ATOM/HETATM, TER, CONECT and END. Other records
 * are passed over. For checking exports and reading simple coordinate files, not whole archive entries.
 */
import { InputError } from '../errors.js';
import { columns, CONECT_COLUMNS, CONTINUATION, HETATM_COLUMNS, HETNAM_ID, HETNAM_TEXT, TER_COLUMNS, TITLE_TEXT, type Columns } from './pdb-columns.js';

export interface PdbAtom {
  readonly record: 'ATOM' | 'HETATM';
  readonly serial: number;
  /** The four columns of the atom name, as written (" NC "). */
  readonly name: string;
  readonly altLoc: string;
  readonly resName: string;
  readonly chainId: string;
  readonly resSeq: number;
  readonly iCode: string;
  /** Å. */
  readonly x: number;
  readonly y: number;
  readonly z: number;
  readonly occupancy?: number;
  readonly tempFactor?: number;
  readonly element: string;
  readonly charge: string;
}

export interface PdbTer {
  readonly serial?: number;
  readonly resName: string;
  readonly chainId: string;
  readonly resSeq?: number;
}

export interface PdbFile {
  /** TITLE text with continuation records joined by a space. */
  readonly title: string;
  /** HETNAM: residue name -> chemical name. */
  readonly hetNames: Map<string, string>;
  readonly atoms: PdbAtom[];
  readonly ters: PdbTer[];
  /** CONECT: atom serial -> bonded serials, in file order (several records for one atom are joined). */
  readonly conect: Map<number, number[]>;
  /** Whether an END record was found (and nothing but blank lines after it). */
  readonly end: boolean;
}

const INTEGER = /^-?\d+$/;
const REAL = /^[+-]?(\d+\.?\d*|\.\d+)$/;

function reader(lineNo: number, line: string) {
  const text = (c: Columns) => columns(line, c);
  const fail = (c: Columns, what: string): never => {
    throw new InputError(`PDB line ${lineNo}: columns ${c[0]}-${c[1]} (${what}) hold '${text(c)}', not a number`);
  };
  return {
    text,
    integer(c: Columns, what: string): number {
      const t = text(c).trim();
      return INTEGER.test(t) ? Number(t) : fail(c, what);
    },
    real(c: Columns, what: string): number {
      const t = text(c).trim();
      return REAL.test(t) ? Number(t) : fail(c, what);
    },
    optional(c: Columns, kind: 'integer' | 'real', what: string): number | undefined {
      return text(c).trim() === '' ? undefined : this[kind](c, what);
    },
  };
}

function atom(record: 'ATOM' | 'HETATM', r: ReturnType<typeof reader>): PdbAtom {
  const H = HETATM_COLUMNS;
  return {
    record,
    serial: r.integer(H.serial, 'serial'),
    name: r.text(H.name),
    altLoc: r.text(H.altLoc).trim(),
    resName: r.text(H.resName).trim(),
    chainId: r.text(H.chainId).trim(),
    resSeq: r.integer(H.resSeq, 'residue number'),
    iCode: r.text(H.iCode).trim(),
    x: r.real(H.x, 'x'),
    y: r.real(H.y, 'y'),
    z: r.real(H.z, 'z'),
    occupancy: r.optional(H.occupancy, 'real', 'occupancy'),
    tempFactor: r.optional(H.tempFactor, 'real', 'temperature factor'),
    element: r.text(H.element).trim(),
    charge: r.text(H.charge).trim(),
  };
}

/** Parse PDB text by column positions. Malformed numeric fields are InputErrors naming the line and columns. */
export function parsePdb(text: string): PdbFile {
  const title: string[] = [];
  const hetNames = new Map<string, string>();
  const atoms: PdbAtom[] = [];
  const ters: PdbTer[] = [];
  const conect = new Map<number, number[]>();
  let end = false;
  text.split(/\r?\n/).forEach((line, k) => {
    const lineNo = k + 1;
    const name = line.slice(0, 6).trimEnd();
    if (end) {
      if (line.trim() !== '') throw new InputError(`PDB line ${lineNo}: '${name}' after the END record`);
      return;
    }
    const r = reader(lineNo, line);
    switch (name) {
      case 'TITLE':
        title.push(r.text(TITLE_TEXT).trim());
        break;
      case 'HETNAM': {
        const id = r.text(HETNAM_ID).trim();
        const more = r.text(CONTINUATION).trim() !== '';
        const piece = r.text(HETNAM_TEXT).trim();
        hetNames.set(id, more && hetNames.has(id) ? `${hetNames.get(id)} ${piece}` : piece);
        break;
      }
      case 'ATOM':
      case 'HETATM':
        atoms.push(atom(name, r));
        break;
      case 'TER':
        ters.push({
          serial: r.optional(TER_COLUMNS.serial, 'integer', 'serial'),
          resName: r.text(TER_COLUMNS.resName).trim(),
          chainId: r.text(TER_COLUMNS.chainId).trim(),
          resSeq: r.optional(TER_COLUMNS.resSeq, 'integer', 'residue number'),
        });
        break;
      case 'CONECT': {
        const from = r.integer(CONECT_COLUMNS[0], 'atom serial');
        const to = CONECT_COLUMNS.slice(1).flatMap((c) => (r.text(c).trim() === '' ? [] : [r.integer(c, 'bonded atom serial')]));
        conect.set(from, [...(conect.get(from) ?? []), ...to]);
        break;
      }
      case 'END':
        end = true;
        break;
      default:
        break;
    }
  });
  return { title: title.join(' '), hetNames, atoms, ters, conect, end };
}
