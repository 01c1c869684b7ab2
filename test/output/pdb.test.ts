import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { parsePdb } from '../../src/output/pdb-parse.js';
import { formatPdb } from '../../src/output/pdb.js';
import type { DesignRecord } from '../../src/output/record.js';
import { residueNames } from '../../src/output/residue-names.js';
import { randomRecord, smallRecord } from './records.js';

// Column positions below are typed from the wwPDB "Atomic Coordinate Entry Format Version 3.3"
// (document v3.30, wwPDB), record format tables, columns numbered from 1 and inclusive:
//   HETATM (Coordinate section): 1-6 "HETATM", 7-11 serial, 13-16 atom name, 17 altLoc, 18-20 resName,
//     22 chainID, 23-26 resSeq, 27 iCode, 31-38 x Real(8.3), 39-46 y, 47-54 z (Å), 55-60 occupancy
//     Real(6.2), 61-66 tempFactor Real(6.2), 77-78 element (right-justified), 79-80 charge.
//   TER: 1-6 "TER   ", 7-11 serial, 18-20 resName, 22 chainID, 23-26 resSeq.
//   CONECT (Connectivity section): 7-11 atom serial, 12-16, 17-21, 22-26, 27-31 bonded atom serials.
//   HETNAM (Heterogen section): 9-10 continuation, 12-14 hetID (right-justified), 16-70 chemical name.
//   Every record is an 80-column line.
const col = (line: string, first: number, last: number) => line.slice(first - 1, last);

function hetatms(text: string): string[] {
  return text.split('\n').filter((l) => col(l, 1, 6) === 'HETATM');
}

/** The dye atoms as the test expects them (centre, head, tail), Å. */
function expectedAtoms(r: DesignRecord): number[][] {
  return r.sites.flatMap((s) => {
    const len = Math.hypot(...s.direction);
    const h = (s.length ?? 1) / 2;
    const c = s.position.map((v) => 10 * v);
    return [c, c.map((v, k) => v + (10 * h * s.direction[k]) / len), c.map((v, k) => v - (10 * h * s.direction[k]) / len)];
  });
}

describe('PDB export (wwPDB format v3.3)', () => {
  const cases: [string, DesignRecord][] = [['small', smallRecord()], ['random 8 dyes', randomRecord(11, 8)], ['random 30 dyes in 150 nm', randomRecord(12, 30, 150)]];
  it.each(cases)('%s: 80-column records, HETATM coordinate columns hold %%8.3f in Å', (_, r) => {
    const text = formatPdb(r);
    expect(text.endsWith('\n')).toBe(true);
    for (const line of text.slice(0, -1).split('\n')) expect(line).toHaveLength(80);
    const lines = hetatms(text);
    expect(lines).toHaveLength(3 * r.sites.length);
    expectedAtoms(r).forEach((want, k) => {
      const line = lines[k];
      [[31, 38], [39, 46], [47, 54]].forEach(([a, b], axis) => {
        const field = col(line, a, b);
        expect(field[4]).toBe('.'); // Real(8.3): the decimal point in the fifth of eight columns
        expect(field).toMatch(/^ *-?\d+\.\d{3}$/);
        expect(Math.abs(Number(field) - want[axis])).toBeLessThanOrEqual(0.0005 + 1e-9);
      });
      expect(Number(col(line, 7, 11))).toBe(k + 1);
      expect(Number(col(line, 23, 26))).toBe(Math.floor(k / 3) + 1);
      expect(col(line, 22, 22)).toBe('A');
      expect(col(line, 55, 60)).toBe('  1.00');
    });
  });

  it('marks roles by element and names the atoms, element right-justified in columns 77-78', () => {
    const lines = hetatms(formatPdb(smallRecord()));
    expect(lines.map((l) => col(l, 77, 78))).toEqual([' N', ' O', ' C', ' N', ' O', ' C', ' S', ' O', ' C']);
    expect(lines.map((l) => col(l, 13, 16)).slice(6)).toEqual([' SC ', ' OH ', ' CT ']);
    // the element symbol also stands in columns 13-14 of the atom name, where readers without column 77 look
    for (const l of lines) expect(col(l, 13, 14)).toBe(col(l, 77, 78));
  });

  it('puts the site energy in units of 1000 cm^-1 in the temperature factor (columns 61-66)', () => {
    const r = smallRecord();
    const lines = hetatms(formatPdb(r));
    r.sites.forEach((s, i) => expect(Number(col(lines[3 * i], 61, 66))).toBeCloseTo(s.energy / 1000, 2));
  });

  it('bonds each centre to both dipole ends in CONECT records, listed from both atoms, then TER and END', () => {
    const r = smallRecord();
    const text = formatPdb(r);
    const conect = text.split('\n').filter((l) => col(l, 1, 6) === 'CONECT');
    expect(conect.map((l) => [7, 12, 17].map((a) => col(l, a, a + 4).trim()).filter((s) => s !== '').map(Number))).toEqual([
      [1, 2, 3], [2, 1], [3, 1], [4, 5, 6], [5, 4], [6, 4], [7, 8, 9], [8, 7], [9, 7],
    ]);
    const ter = text.split('\n').find((l) => col(l, 1, 6) === 'TER   ')!;
    expect(Number(col(ter, 7, 11))).toBe(10);
    expect(Number(col(ter, 23, 26))).toBe(3);
    expect(text.slice(0, -1).split('\n').at(-1)).toBe('END'.padEnd(80));
  });

  it('maps dyes to residue names listed in HETNAM records', () => {
    const r = smallRecord();
    const text = formatPdb(r);
    const hetnam = text.split('\n').filter((l) => col(l, 1, 6) === 'HETNAM').map((l) => [col(l, 12, 14), col(l, 16, 70).trim()]);
    expect(hetnam).toEqual([['TE5', 'Tessin-555'], ['TE0', 'Tessin-590'], ['MO0', 'Morvane-630']]);
    expect(hetatms(text).map((l) => col(l, 18, 20))).toEqual(['TE5', 'TE5', 'TE5', 'TE0', 'TE0', 'TE0', 'MO0', 'MO0', 'MO0']);
  });

  it('gives distinct dyes distinct residue names and avoids standard residue names', () => {
    const m = residueNames(['Cy3', 'Cy3.5', 'Cy5', 'Cy3', 'Glory-Y', 'Al']);
    expect([...m.entries()]).toEqual([['Cy3', 'CY3'], ['Cy3.5', 'CY5'], ['Cy5', 'CY1'], ['Glory-Y', 'GL1'], ['Al', 'ALX']]);
  });

  it('round trip through parsePdb recovers coordinates, residues, bonds, title and the dye names', () => {
    const r = randomRecord(13, 6);
    const parsed = parsePdb(formatPdb(r));
    expect(parsed.end).toBe(true);
    expect(parsed.title).toBe(`lumenfold design ${r.name}`);
    expect(parsed.atoms).toHaveLength(18);
    expectedAtoms(r).forEach((want, k) => {
      const a = parsed.atoms[k];
      [a.x, a.y, a.z].forEach((v, axis) => expect(Math.abs(v - want[axis])).toBeLessThanOrEqual(0.0005 + 1e-9));
    });
    const names = new Map([...parsed.hetNames].map(([res, dye]) => [dye, res]));
    parsed.atoms.forEach((a) => expect(a.resName).toBe(names.get(r.dyes[a.resSeq - 1])));
    expect(parsed.conect.get(4)).toEqual([5, 6]);
    expect(parsed.ters).toEqual([{ serial: 19, resName: parsed.atoms[17].resName, chainId: 'A', resSeq: 6 }]);
  });

  it('parses a HETATM line laid out by hand from the v3.3 column table', () => {
    const line = 'HETATM' + '1234'.padStart(5) + ' ' + 'FE  ' + 'A' + 'HEM' + ' ' + 'B' + '201'.padStart(4) + ' ' + '   ' +
      '-12.345'.padStart(8) + '6.789'.padStart(8) + '1000.000'.padStart(8) + '0.50'.padStart(6) + '33.25'.padStart(6) + ' '.repeat(10) + 'FE' + '2+';
    expect(line).toHaveLength(80);
    const [a] = parsePdb(`${line}\nEND\n`).atoms;
    expect(a).toEqual({
      record: 'HETATM', serial: 1234, name: 'FE  ', altLoc: 'A', resName: 'HEM', chainId: 'B', resSeq: 201, iCode: '',
      x: -12.345, y: 6.789, z: 1000, occupancy: 0.5, tempFactor: 33.25, element: 'FE', charge: '2+',
    });
  });

  it('refuses coordinates outside -999.999 to 9999.999 Å with a message that says so', () => {
    const at = (x: number): DesignRecord => {
      const r = smallRecord();
      return { ...r, sites: [{ ...r.sites[0], position: [x, 0, 0], length: undefined, direction: [0, 1, 0] }, ...r.sites.slice(1)] };
    };
    expect(() => formatPdb(at(999.9999))).not.toThrow(); // 9999.999 Å
    expect(() => formatPdb(at(-99.9999))).not.toThrow(); // -999.999 Å
    expect(() => formatPdb(at(1000))).toThrow(/site 1 centre x is 1000 nm = 10000\.000 Å, outside what the PDB coordinate columns hold \(-999\.999 to 9999\.999 Å\)/);
    expect(() => formatPdb(at(-100))).toThrow(InputError);
    expect(() => formatPdb(at(-99.99996))).toThrow(/-1000\.000 Å/); // rounds to eight characters plus a sign
  });

  it('refuses more dyes than the four resSeq columns can number', () => {
    const r = randomRecord(14, 10000, 50);
    expect(() => formatPdb({ ...r, traps: [0] })).toThrow(/10000 dyes; a PDB file numbers at most 9999/);
  });

  it('reports a malformed number by line and columns', () => {
    const good = hetatms(formatPdb(smallRecord()))[0];
    const bad = good.slice(0, 30) + ' abcdefg' + good.slice(38);
    expect(() => parsePdb(bad)).toThrow(/PDB line 1: columns 31-38 \(x\) hold ' abcdefg', not a number/);
  });
});
