/**
 * PDB export in the wwPDB Atomic Coordinate Entry Format Version 3.3 (column layout in pdb-columns.ts).
 * A coordinate file for viewers, not an archive entry: TITLE, HETNAM, HETATM, TER, CONECT, END.
 *   - one residue per dye, chain A, residue number = site id, residue name from the dye (residue-names.ts),
 *     listed with the dye's name in a HETNAM record;
 *   - three atoms per dye (dye-atoms.ts): centre " NC " (donor, element N) or " SC " (trap, element S),
 *     dipole head " OH " (element O) and tail " CT " (element C); coordinates in Å, %8.3f;
 *   - occupancy 1.00; temperature factor = site energy in units of 1000 cm^-1 (%6.2f, so colouring by
 *     B-factor shows the energy landscape; resolution 10 cm^-1);
 *   - CONECT records bond the centre to both dipole ends, each bond listed from both of its atoms.
 */
import { InputError } from '../errors.js';
import { designToJson } from './design-json.js';
import { dyeAtoms, type DyeAtom } from './dye-atoms.js';
import { CONECT_COLUMNS, CONTINUATION, HETATM_COLUMNS, HETNAM_ID, HETNAM_TEXT, layoutRecord, TER_COLUMNS, TITLE_TEXT, type Columns } from './pdb-columns.js';
import type { DesignRecord } from './record.js';
import { residueNames } from './residue-names.js';

/** Most dyes a PDB file can number: the residue sequence number has four columns. */
export const MAX_PDB_DYES = 9999;
/** The temperature-factor column holds the site energy in these units, cm^-1. */
export const PDB_ENERGY_UNIT_CM = 1000;

const ATOM_NAMES: Record<DyeAtom['part'], (element: string) => string> = {
  centre: (e) => ` ${e}C `,
  head: () => ' OH ',
  tail: () => ' CT ',
};

/** %8.3f of a coordinate in Å, or an InputError when it does not fit the eight columns. */
function coordinate(nm: number, what: string): string {
  const text = (nm * 10).toFixed(3);
  if (text.length > 8) {
    throw new InputError(
      `${what} is ${nm} nm = ${(nm * 10).toFixed(3)} Å, outside what the PDB coordinate columns hold (-999.999 to 9999.999 Å); move the design nearer the origin or export XYZ instead`,
    );
  }
  return text;
}

/** TITLE records: the text cut at spaces into pieces of at most 70 (first) or 69 (continued) characters. */
function titleRecords(text: string): string[] {
  const out: string[] = [];
  let rest = text.replace(/[\u0000-\u001f\u007f]/g, ' ').trim();
  while (rest.length > 0) {
    const width = out.length === 0 ? 70 : 69;
    let cut = rest.length <= width ? rest.length : rest.lastIndexOf(' ', width);
    if (cut <= 0) cut = width;
    const piece = rest.slice(0, cut);
    rest = rest.slice(cut).trimStart();
    const cont = out.length === 0 ? '' : String(out.length + 1);
    out.push(layoutRecord('TITLE', [[CONTINUATION, cont, 'continuation'], [TITLE_TEXT, out.length === 0 ? piece : ` ${piece}`, 'title']]));
  }
  return out;
}

function conect(serials: number[]): string {
  return layoutRecord('CONECT', serials.map((s, k): readonly [Columns, string, string] => [CONECT_COLUMNS[k], String(s), 'serial']));
}

/** A design as PDB text. Throws InputError when it does not fit the fixed columns. */
export function formatPdb(record: DesignRecord): string {
  designToJson(record, { label: `PDB export of "${String(record?.name)}"` });
  const n = record.sites.length;
  if (n > MAX_PDB_DYES) throw new InputError(`the design has ${n} dyes; a PDB file numbers at most ${MAX_PDB_DYES} residues (export XYZ instead)`);
  const names = residueNames(record.dyes);
  const lines = titleRecords(`lumenfold design ${record.name}`);
  for (const [dye, res] of names) lines.push(layoutRecord('HETNAM', [[HETNAM_ID, res, 'hetID'], [HETNAM_TEXT, dye, 'name']]));
  const bonds: string[] = [];
  let serial = 0;
  const H = HETATM_COLUMNS;
  for (const dye of dyeAtoms(record)) {
    const i = dye.site;
    const res = names.get(record.dyes[i])!;
    const first = serial + 1;
    for (const a of dye.atoms) {
      serial++;
      const [x, y, z] = a.position.map((v, k) => coordinate(v, `site ${i + 1} ${a.part} ${'xyz'[k]}`));
      const energy = (record.sites[i].energy / PDB_ENERGY_UNIT_CM).toFixed(2);
      lines.push(layoutRecord('HETATM', [
        [H.serial, String(serial), 'serial'], [H.name, ATOM_NAMES[a.part](a.element), 'atom name'], [H.resName, res, 'residue name'],
        [H.chainId, 'A', 'chain'], [H.resSeq, String(i + 1), 'residue number'], [H.x, x, 'x'], [H.y, y, 'y'], [H.z, z, 'z'],
        [H.occupancy, '1.00', 'occupancy'], [H.tempFactor, energy, `temperature factor (site ${i + 1} energy / ${PDB_ENERGY_UNIT_CM} cm^-1)`],
        [H.element, a.element, 'element'],
      ]));
    }
    bonds.push(conect([first, first + 1, first + 2]), conect([first + 1, first]), conect([first + 2, first]));
  }
  const last = record.sites.length - 1;
  lines.push(layoutRecord('TER', [
    [TER_COLUMNS.serial, String(serial + 1), 'serial'], [TER_COLUMNS.resName, names.get(record.dyes[last])!, 'residue name'],
    [TER_COLUMNS.chainId, 'A', 'chain'], [TER_COLUMNS.resSeq, String(last + 1), 'residue number'],
  ]));
  lines.push(...bonds, layoutRecord('END', []));
  return lines.join('\n') + '\n';
}
