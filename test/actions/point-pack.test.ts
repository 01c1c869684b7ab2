import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { packPoints, unpackPoints } from '../../src/actions/point-pack.js';

// Points cross to worker threads packed; results must not depend on the number of workers, so a packed batch
// has to come back as the same records, value for value (Object.is: -0 and NaN included) and in key order.
const value = fc.oneof(fc.double(), fc.string(), fc.array(fc.double(), { maxLength: 4 }));
const sameRecords = (a: Record<string, unknown>[], b: Record<string, unknown>[]) => {
  expect(b.length).toBe(a.length);
  for (let j = 0; j < a.length; j++) {
    expect(Object.keys(b[j])).toEqual(Object.keys(a[j]));
    for (const k of Object.keys(a[j])) {
      const x = a[j][k], y = b[j][k];
      if (Array.isArray(x)) {
        expect(Array.isArray(y)).toBe(true);
        expect((y as number[]).length).toBe(x.length);
        x.forEach((v, i) => expect(Object.is(v, (y as number[])[i])).toBe(true));
      } else expect(Object.is(x, y)).toBe(true);
    }
  }
};

describe('packed design points', () => {
  it('round-trip bit for bit when the points share one layout', () => {
    // one layout (keys and kinds of value), several points filled in with it
    const layout = fc.uniqueArray(fc.tuple(fc.string({ minLength: 1, maxLength: 6 }), fc.integer({ min: 0, max: 2 }), fc.integer({ min: 0, max: 3 })), { selector: (t) => t[0], maxLength: 12 });
    fc.assert(fc.property(layout, fc.integer({ min: 1, max: 6 }), fc.integer(), (keys, count, seed) => {
      let s = seed >>> 0;
      const next = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s; };
      const special = [0, -0, NaN, Infinity, -Infinity, 5e-324, 1.7976931348623157e308];
      const num = () => (next() % 4 === 0 ? special[next() % special.length] : (next() / 2 ** 32 - 0.5) * 10 ** ((next() % 20) - 10));
      const points = Array.from({ length: count }, () => Object.fromEntries(keys.map(([k, kind, len]) =>
        [k, kind === 0 ? num() : kind === 1 ? `dye-${next() % 97}` : Array.from({ length: len }, num)])));
      const packed = packPoints(points);
      // integer-like keys reorder objects; the packing must still give the records back as they were
      sameRecords(points, unpackPoints(structuredClone(packed)));
    }));
  });

  it('sends records as they are when points differ in layout or hold other values', () => {
    fc.assert(fc.property(fc.dictionary(fc.string({ minLength: 1, maxLength: 4 }), value, { minKeys: 1, maxKeys: 5 }), (a) => {
      const keys = Object.keys(a);
      const differentKeys = [a, { ...a, extra: 1 }];
      const differentKind = [a, { ...a, [keys[0]]: typeof a[keys[0]] === 'string' ? 1 : 'x' }];
      const otherValue = [{ ...a, flag: true }];
      for (const points of [differentKeys, differentKind, otherValue]) {
        const packed = packPoints(points);
        expect('records' in packed).toBe(true);
        sameRecords(points, unpackPoints(structuredClone(packed)));
      }
    }));
  });

  it('packs a demo-like batch into one number array and a string list', () => {
    const p = (i: number) => ({ offset_0: [i, -0, 0.5], cos_0: 0.25 * i, dye_1: `Tessin-${590 + i}`, anchor_1: i });
    const packed = packPoints([p(0), p(1), p(2)]);
    expect('numbers' in packed && packed.numbers.length).toBe(3 * 5);
    expect('strings' in packed && packed.strings).toEqual(['Tessin-590', 'Tessin-591', 'Tessin-592']);
    sameRecords([p(0), p(1), p(2)], unpackPoints(packed));
  });
});
