/**
 * Three-character PDB residue names for dyes. From a dye name written in upper case with only its letters
 * and digits kept (Tessin-590 -> TESSIN590): its first two characters and its last (TE0); a name of two
 * characters is padded with X (CY -> CYX), of one with XX. When that name is already given to another dye of
 * the same design, or is a standard residue name that viewers treat specially (amino acids, water,
 * unknown), the third character is replaced by the first of 1-9, A-Z that is free (and then the second).
 * The PDB export lists the mapping in HETNAM records.
 */
import { InputError } from '../errors.js';

/** Residue names a dye must not take: wwPDB standard amino acids, water and the unknown-residue codes (common practice). */
export const RESERVED_RESIDUE_NAMES: ReadonlySet<string> = new Set([
  'ALA', 'ARG', 'ASN', 'ASP', 'CYS', 'GLN', 'GLU', 'GLY', 'HIS', 'ILE', 'LEU', 'LYS', 'MET', 'PHE', 'PRO', 'SER', 'THR',
  'TRP', 'TYR', 'VAL', 'SEC', 'PYL', 'ASX', 'GLX', 'UNK', 'UNL', 'UNX', 'HOH', 'DOD', 'DIS',
]);

const FILL = '123456789ABCDEFGHIJKLMNOPQRSTUVWXYZ';

/** The first-choice residue name of a dye, before collisions are resolved. */
export function baseResidueName(dye: string): string {
  const s = dye.toUpperCase().replace(/[^A-Z0-9]/g, '');
  if (s.length === 0) throw new InputError(`dye name '${dye}' has no letter or digit to make a residue name from`);
  return s.length >= 3 ? s[0] + s[1] + s[s.length - 1] : s.padEnd(3, 'X');
}

/** Residue name of every distinct dye, in order of first appearance; distinct dyes get distinct names. */
export function residueNames(dyes: readonly string[]): Map<string, string> {
  const out = new Map<string, string>();
  const taken = new Set<string>();
  for (const dye of dyes) {
    if (out.has(dye)) continue;
    const base = baseResidueName(dye);
    const candidates = [base, ...[...FILL].map((c) => base.slice(0, 2) + c), ...[...FILL].flatMap((b) => [...FILL].map((c) => base[0] + b + c))];
    const name = candidates.find((c) => !taken.has(c) && !RESERVED_RESIDUE_NAMES.has(c));
    if (name === undefined) throw new InputError(`too many dyes starting with '${base[0]}' to give each its own residue name`);
    out.set(dye, name);
    taken.add(name);
  }
  return out;
}
