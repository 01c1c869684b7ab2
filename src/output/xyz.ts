/**
 * XYZ export: the atom count on the first line, a comment on the second, then one line per atom
 * "element x y z" with coordinates in ångström (1 nm = 10 Å). Three atoms per dye (see dye-atoms.ts).
 * XYZ has no formal standard; this is the layout every viewer reads (common practice).
 */
import { InputError } from '../errors.js';
import { designToJson } from './design-json.js';
import { dyeAtoms } from './dye-atoms.js';
import type { DesignRecord } from './record.js';

export const ANGSTROM_PER_NM = 10;
/** Decimal places of XYZ coordinates, Å. */
export const XYZ_DECIMALS = 6;

/** The comment line: the design's name, then what the atoms mean. */
function comment(record: DesignRecord): string {
  const name = record.name.replace(/[\u0000-\u001f\u007f]/g, ' ');
  return `lumenfold design "${name}": 3 atoms per dye: centre (N donor, S trap), dipole head O and tail C; angstrom`;
}

/** A design as XYZ text. */
export function formatXyz(record: DesignRecord): string {
  designToJson(record, { label: `XYZ export of "${String(record?.name)}"` });
  const atoms = dyeAtoms(record).flatMap((d) => d.atoms);
  const lines = atoms.map((a) => `${a.element.padEnd(2)} ${a.position.map((v) => (v * ANGSTROM_PER_NM).toFixed(XYZ_DECIMALS).padStart(14)).join(' ')}`);
  return [String(atoms.length), comment(record), ...lines].join('\n') + '\n';
}

export interface XyzAtom {
  readonly element: string;
  /** Position as written, Å. */
  readonly x: number;
  readonly y: number;
  readonly z: number;
}

export interface XyzFrame {
  readonly comment: string;
  readonly atoms: XyzAtom[];
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** Parse one XYZ frame: the atom count line decides how many atom lines are read; anything after them must be blank. */
export function parseXyz(text: string): XyzFrame {
  const lines = text.split(/\r?\n/);
  const count = lines[0]?.trim() ?? '';
  if (!/^\d+$/.test(count)) throw new InputError(`XYZ line 1: expected the number of atoms, got '${count}'`);
  const n = Number(count);
  if (lines.length < n + 2) throw new InputError(`XYZ: the first line announces ${n} atoms but the text has ${Math.max(0, lines.length - 2)} atom lines`);
  const atoms = lines.slice(2, n + 2).map((line, k) => {
    const f = line.trim().split(/\s+/);
    if (f.length < 4 || !/^[A-Z][a-z]?$/.test(f[0]) || !f.slice(1, 4).every((v) => NUMBER.test(v))) {
      throw new InputError(`XYZ line ${k + 3}: expected 'element x y z', got '${line}'`);
    }
    return { element: f[0], x: Number(f[1]), y: Number(f[2]), z: Number(f[3]) };
  });
  const extra = lines.slice(n + 2).findIndex((l) => l.trim() !== '');
  if (extra >= 0) throw new InputError(`XYZ line ${n + 3 + extra}: more atom lines than the ${n} announced on line 1`);
  return { comment: lines[1], atoms };
}
