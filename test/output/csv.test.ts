import { spawnSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { parseMatrixCsv } from '../../src/io/matrix-csv.js';
import { anchorMapCsv, couplingTableCsv, csvField, hamiltonianCsv, parseCsv, rankingCsv, siteTableCsv } from '../../src/output/csv.js';
import type { DesignRecord } from '../../src/output/record.js';
import { buildSystem } from '../../src/physics/hamiltonian.js';
import { randomRecord, smallRecord } from './records.js';

/** Rows as Python's csv module (standard library, RFC 4180 style "excel" dialect) reads the text. */
function pythonRows(text: string): string[][] {
  const script = 'import csv, io, json, sys\nprint(json.dumps(list(csv.reader(io.StringIO(sys.stdin.read(), newline="")))))';
  const out = spawnSync('/usr/bin/python3', ['-c', script], { input: text, encoding: 'utf8' });
  if (out.status !== 0) throw new Error(`python3 failed: ${out.stderr}`);
  return JSON.parse(out.stdout) as string[][];
}

describe('RFC 4180 fields', () => {
  // RFC 4180 section 2: fields with commas, double quotes or line breaks are enclosed in double quotes (rule 6),
  // and a double quote inside such a field is written twice (rule 7); records end in CRLF (rule 1).
  it.each([
    ['plain', 'plain'], ['a,b', '"a,b"'], ['say "hi"', '"say ""hi"""'], ['two\nlines', '"two\nlines"'], ['cr\r', '"cr\r"'], ['', ''],
  ])('%j is written as %j', (value, written) => {
    expect(csvField(value)).toBe(written);
  });

  it('writes numbers in their shortest exact form, undefined as empty, and refuses NaN', () => {
    expect([csvField(0.1), csvField(-2.5e-12), csvField(undefined)]).toEqual(['0.1', '-2.5e-12', '']);
    expect(() => csvField(Number.NaN)).toThrow(InputError);
  });

  it('parseCsv and Python\'s csv module read the same rows from awkward fields', () => {
    const text = 'a,"b,c","d ""e"""\r\n"line\r\nbreak",,x\r\n""\r\n';
    expect(parseCsv(text)).toEqual([['a', 'b,c', 'd "e"'], ['line\r\nbreak', '', 'x'], ['']]);
    expect(pythonRows(text)).toEqual(parseCsv(text));
  });
});

describe('site table', () => {
  it('has the documented columns, one row per dye, and reads back the coordinates exactly', () => {
    const r = randomRecord(21, 7);
    const rows = parseCsv(siteTableCsv(r));
    expect(rows[0]).toEqual(['id', 'dye', 'role', 'x_nm', 'y_nm', 'z_nm', 'ux', 'uy', 'uz', 'energy_cm', 'dipole_D', 'reorganization_cm', 'lifetime_ps', 'anchor', 'helix', 'step']);
    expect(rows).toHaveLength(8);
    r.sites.forEach((s, i) => {
      const row = rows[i + 1];
      expect(Number(row[0])).toBe(i + 1);
      expect(row[2]).toBe(r.traps.includes(i) ? 'trap' : 'donor');
      expect(row.slice(3, 6).map(Number)).toEqual([...s.position]); // shortest round-trip decimals (ECMA-262 Number::toString)
      const u = row.slice(6, 9).map(Number);
      expect(Math.hypot(...u)).toBeCloseTo(1, 14);
      expect(Number(row[9])).toBe(s.energy);
    });
  });

  it('quotes what needs quoting, so Python\'s csv module reads the same table', () => {
    const r = smallRecord();
    const text = siteTableCsv(r);
    expect(text.endsWith('\r\n')).toBe(true);
    expect(pythonRows(text)).toEqual(parseCsv(text));
    const ranking = rankingCsv([r]);
    expect(ranking).toContain('"small, ""quoted"" wire"');
    expect(pythonRows(ranking)[1][1]).toBe(r.name);
  });

  it('leaves optional values empty and fills anchors when present', () => {
    const rows = parseCsv(siteTableCsv(smallRecord()));
    expect(rows[3].slice(11)).toEqual(['', '', '24', '1', '3']);
    expect(parseCsv(siteTableCsv(randomRecord(3, 2)))[1].slice(13)).toEqual(['', '', '']);
  });
});

describe('Hamiltonian and coupling table', () => {
  it('writes the Hamiltonian so that the simulate reader (parseMatrixCsv) reads it back to 12 digits', () => {
    const r = randomRecord(31, 6);
    const H = buildSystem(r.sites, { traps: r.traps }).hamiltonian;
    const text = hamiltonianCsv(r);
    expect(text.split('\n')[0]).not.toMatch(/[a-z]/i);
    const rows = parseMatrixCsv(text, 'h.csv');
    expect(rows).toHaveLength(6);
    rows.forEach((row, i) => row.forEach((v, j) => expect(Math.abs(v - H[i * 6 + j])).toBeLessThanOrEqual(1e-11 * Math.abs(H[i * 6 + j]))));
    expect(rows.map((row, i) => row[i])).toEqual(r.sites.map((s) => s.energy).map((e) => Number(e.toPrecision(12))));
  });

  it('takes a Hamiltonian the caller built, and refuses one of the wrong size', () => {
    const r = randomRecord(32, 3);
    const M = [[1, 2, 3], [2, 5, 6], [3, 6, 9]];
    expect(parseMatrixCsv(hamiltonianCsv(M))).toEqual(M);
    expect(parseCsv(couplingTableCsv(r, M)).slice(1).map((row) => Number(row[4]))).toEqual([2, 3, 6]);
    expect(() => couplingTableCsv(r, [[1, 2], [2, 1]])).toThrow(/2 rows but the design has 3 sites/);
  });

  it('gives kappa -2 head to tail and +1 side by side, and the point-dipole coupling 5.0341 kappa mu^2 / R^3', () => {
    // Orientation factor and point-dipole coupling: Förster theory, e.g. Scholes, Annu. Rev. Phys. Chem. 54, 57
    // (2003); kappa = -2 for collinear dipoles and +1 for parallel dipoles side by side. Prefactor
    // (1 D)^2 / (4 pi eps0 (1 nm)^3) = 5.0341 cm^-1 from CODATA 2018 constants (CONVENTIONS.md).
    const site = (x: number, y: number) => ({ position: [x, y, 0] as const, direction: [1, 0, 0] as const, dipole: 10, energy: 17000 });
    const r: DesignRecord = { name: 'kappa', sites: [site(0, 0), site(2, 0), site(0, 3)], traps: [2], dyes: ['A', 'B', 'C'] };
    const rows = parseCsv(couplingTableCsv(r, { couplingMethod: 'point-dipole' }));
    expect(rows[0]).toEqual(['i', 'j', 'distance_nm', 'kappa', 'coupling_cm']);
    const [, r12, r13] = rows.map((row) => row.map(Number));
    expect(r12.slice(0, 4)).toEqual([1, 2, 2, -2]);
    expect(r12[4]).toBeCloseTo((5.0341 * -2 * 100) / 8, 2);
    expect(r13.slice(0, 3)).toEqual([1, 3, 3]);
    expect(r13[3]).toBeCloseTo(1, 14);
    expect(r13[4]).toBeCloseTo((5.0341 * 100) / 27, 3);
    expect(rows).toHaveLength(4); // n (n - 1) / 2 pairs plus the header
  });
});

describe('ranking and anchor map', () => {
  it('ranks in the given order with the known metrics first, then others alphabetically, empty where missing', () => {
    const a = { ...smallRecord(), name: 'a', metrics: { zeta_extra: 1, efficiency: 0.9 } };
    const b = { ...smallRecord(), name: 'b', score: undefined, metrics: { transfer_time: 3, alpha_extra: 2, efficiency: 0.7 } };
    expect(parseCsv(rankingCsv([a, b]))).toEqual([
      ['rank', 'name', 'score', 'efficiency', 'transfer_time', 'alpha_extra', 'zeta_extra'],
      ['1', 'a', '0.8', '0.9', '', '', '1'],
      ['2', 'b', '', '0.7', '3', '2', ''],
    ]);
  });

  it('lists which dye goes on which anchor, sorted by anchor, and needs anchors', () => {
    const r = smallRecord();
    const shuffled = { ...r, anchors: [r.anchors![2], r.anchors![0], r.anchors![1]] };
    expect(parseCsv(anchorMapCsv(shuffled))).toEqual([
      ['site', 'dye', 'anchor', 'helix', 'step'],
      ['2', 'Tessin-590', '3', '0', '3'],
      ['3', 'Morvane-630', '7', '0', '7'],
      ['1', 'Tessin-555', '24', '1', '3'],
    ]);
    expect(() => anchorMapCsv({ ...r, anchors: undefined })).toThrow(/has no anchors/);
  });
});
