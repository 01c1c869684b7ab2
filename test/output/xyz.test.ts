import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { formatXyz, parseXyz } from '../../src/output/xyz.js';
import type { DesignRecord } from '../../src/output/record.js';
import { randomRecord, smallRecord } from './records.js';

// The XYZ layout (common practice; no formal standard, described e.g. in the Open Babel and Jmol format
// pages, from memory): line 1 the number of atoms, line 2 a free comment, then "element x y z" per atom,
// coordinates in ångström. 1 nm = 10 Å exactly (SI prefixes; 1 Å = 1e-10 m).
const WRITTEN = 0.5e-6 + 1e-9; // half a unit in the sixth decimal written, plus rounding of the product

/** Centre, head and tail of each dye as the test expects them, Å. */
function expected(r: DesignRecord) {
  return r.sites.map((s) => {
    const len = Math.hypot(...s.direction);
    const h = (s.length ?? 1) / 2;
    const u = s.direction.map((v) => v / len);
    const c = s.position.map((v) => 10 * v);
    return { c, head: c.map((v, k) => v + 10 * h * u[k]), tail: c.map((v, k) => v - 10 * h * u[k]) };
  });
}

describe('XYZ export', () => {
  it.each([[smallRecord()], [randomRecord(7, 9)], [randomRecord(8, 25, 200)]])('round trip of %#: three atoms per dye recovered to the written precision', (r) => {
    const text = formatXyz(r);
    const frame = parseXyz(text);
    expect(Number(text.split('\n')[0])).toBe(3 * r.sites.length);
    expect(frame.atoms).toHaveLength(3 * r.sites.length);
    expected(r).forEach((e, i) => {
      const [c, h, t] = frame.atoms.slice(3 * i, 3 * i + 3);
      [[c, e.c], [h, e.head], [t, e.tail]].forEach(([a, want]) => {
        const got = [(a as { x: number }).x, (a as { y: number }).y, (a as { z: number }).z];
        (want as number[]).forEach((w, k) => expect(Math.abs(got[k] - w)).toBeLessThanOrEqual(WRITTEN * Math.max(1, Math.abs(w))));
      });
    });
  });

  it('tells roles and dipole ends apart by element: N donor, S trap, O head, C tail', () => {
    const r = smallRecord();
    const els = parseXyz(formatXyz(r)).atoms.map((a) => a.element);
    expect(els).toEqual(['N', 'O', 'C', 'N', 'O', 'C', 'S', 'O', 'C']);
  });

  it('draws a dye without a length as a 1 nm (10 Å) dipole and one with a length at that length', () => {
    const r = smallRecord();
    const a = parseXyz(formatXyz(r)).atoms;
    const span = (k: number) => Math.hypot(a[k + 1].x - a[k + 2].x, a[k + 1].y - a[k + 2].y, a[k + 1].z - a[k + 2].z);
    expect(span(0)).toBeCloseTo(12, 5); // length 1.2 nm
    expect(span(6)).toBeCloseTo(10, 5); // no length
  });

  it('names the design on the comment line, on one line', () => {
    const r = { ...smallRecord(), name: 'two\nlines' };
    const text = formatXyz({ ...r, name: 'demo wire' });
    expect(parseXyz(text).comment).toMatch(/^lumenfold design "demo wire"/);
    expect(() => formatXyz(r)).toThrow(InputError); // a record whose name the design format refuses
  });

  it('refuses text whose atom lines do not match the count line', () => {
    expect(() => parseXyz('4\nc\nN 0 0 0\nO 1 0 0\n')).toThrow(InputError);
    expect(() => parseXyz('1\nc\nN 0 0 0\nO 1 0 0\n')).toThrow(/more atom lines than the 1 announced/);
    expect(() => parseXyz('x\nc\n')).toThrow(/expected the number of atoms/);
    expect(() => parseXyz('1\nc\nN 0 zero 0\n')).toThrow(/line 3: expected 'element x y z'/);
  });
});
