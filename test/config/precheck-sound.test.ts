import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseConfigText } from '../../src/config/load.js';
import { precheckConstraints } from '../../src/config/precheck/precheck.js';

// Soundness: precheck only states necessary conditions, so a constraint set built around a design that
// meets it must never be rejected. Each case starts from explicit site energies and derives limits that
// those energies satisfy (with random room to spare).
describe('precheck never rejects a constraint set that a known design satisfies', () => {
  it('holds for random energies, dye choices, ranges and limits', () => {
    const cases = fc.record({
      energies: fc.array(fc.integer({ min: 14000, max: 20000 }), { minLength: 2, maxLength: 8 }),
      trapMask: fc.array(fc.boolean(), { minLength: 8, maxLength: 8 }),
      useRange: fc.array(fc.boolean(), { minLength: 8, maxLength: 8 }),
      decoy: fc.integer({ min: 14000, max: 20000 }),
      room: fc.array(fc.double({ min: 0, max: 300, noNaN: true }), { minLength: 5, maxLength: 5 }),
      limits: fc.array(fc.boolean(), { minLength: 3, maxLength: 3 }),
    });
    fc.assert(
      fc.property(cases, ({ energies, trapMask, useRange, decoy, room, limits }) => {
        const n = energies.length;
        let traps = [...Array(n).keys()].filter((i) => trapMask[i]);
        if (traps.length === 0) traps = [n - 1];
        if (traps.length === n) traps = traps.slice(1);
        const donors = [...Array(n).keys()].filter((i) => !traps.includes(i));
        const palette = energies.map((energy, i) => ({ name: `D${i}`, energy, dipole: 10, reorganization: 100, lifetime: 1000, length: 1 }));
        palette.push({ name: 'Decoy', energy: decoy, dipole: 10, reorganization: 100, lifetime: 1000, length: 1 });
        const rules = energies.map((e, i) =>
          useRange[i] ? { sites: [i], range: { min: e - room[0], max: e + room[1], like: 'Decoy' } } : { sites: [i], dyes: [`D${i}`, 'Decoy'] },
        );
        const steps = energies.slice(1).map((e, i) => Math.abs(e - energies[i]));
        const offsets = traps.flatMap((t) => donors.map((d) => energies[t] - energies[d]));
        const energetics: Record<string, unknown> = { rules };
        if (limits[0]) energetics.max_step = Math.max(...steps) + room[2];
        if (limits[1]) energetics.max_span = Math.max(...energies) - Math.min(...energies) + room[3];
        if (limits[2]) energetics.trap_offset = { min: Math.min(...offsets) - room[4], max: Math.max(...offsets) + room[4] };
        const doc = {
          format: 'lumenfold.constraints/1',
          palette,
          dyes: { count: n, traps },
          scaffold: { kind: 'box', size: { x: 10, y: 10, z: 10 } },
          fixed: traps.filter((t) => !useRange[t]).map((t) => ({ site: t, dye: `D${t}` })),
          energetics,
        };
        expect(precheckConstraints(parseConfigText(JSON.stringify(doc), 'constraints'))).toEqual([]);
      }),
      { numRuns: 300 },
    );
  });
});
