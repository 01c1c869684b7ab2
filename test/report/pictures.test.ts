import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { readDesignFile } from '../../src/output/design-file.js';
import type { DesignRecord } from '../../src/output/record.js';
import { arraySvg } from '../../src/report/array-svg.js';
import { levelsSvg } from '../../src/report/levels-svg.js';
import { label } from '../../src/report/svg.js';
import { byClass, numpyExcitons, parseSvg } from './helpers.js';

const example = (f: string) => readDesignFile(fileURLToPath(new URL(`../../designs/examples/${f}`, import.meta.url)));
const DESIGNS = [example('demo-helix-7.design.json'), example('demo-wire-4.design.json')];
/** Point dipoles in vacuum, so that numpy can rebuild every coupling from the formula in CONVENTIONS.md. */
const POINT = { couplingMethod: 'point-dipole', screening: { kind: 'none' } } as const;

function withName(r: DesignRecord, name: string): DesignRecord {
  return { ...r, name };
}

describe('the array picture', () => {
  for (const design of DESIGNS) {
    it(`${design.name}: well-formed SVG with one arrow per dye, the trap marked and the legend spanning the site energies`, () => {
      const svg = parseSvg(arraySvg(design, { system: POINT }));
      expect(svg.root).toBe('svg');
      const dyes = byClass(svg, 'dye');
      expect(dyes.map((d) => Number(d.data.site))).toEqual(design.sites.map((_, i) => i + 1));
      // each arrow carries its dye's exact site energy
      expect(dyes.map((d) => Number(d.data.energy))).toEqual(design.sites.map((s) => s.energy));
      expect(byClass(svg, 'trap').map((t) => Number(t.data.site))).toEqual(design.traps.map((t) => t + 1));
      const legend = byClass(svg, 'legend');
      expect(legend).toHaveLength(1);
      const energies = design.sites.map((s) => s.energy);
      expect(Number(legend[0].data.min)).toBe(Math.min(...energies));
      expect(Number(legend[0].data.max)).toBe(Math.max(...energies));
      expect(byClass(svg, 'legend-min')[0].text).toBe(label(Math.min(...energies), 6));
      expect(byClass(svg, 'legend-max')[0].text).toBe(label(Math.max(...energies), 6));
    });
  }

  it('draws exactly the couplings at or above the threshold, as numpy finds them from the point-dipole formula', () => {
    for (const design of DESIGNS) {
      const { H } = numpyExcitons(design.sites);
      for (const threshold of [5, 20, 60]) {
        const svg = parseSvg(arraySvg(design, { system: POINT, threshold }));
        const drawn = byClass(svg, 'coupling').map((c) => c.data.sites).sort();
        const expected: string[] = [];
        H.forEach((row, i) => row.forEach((J, j) => { if (j > i && Math.abs(J) >= threshold) expected.push(`${i + 1} ${j + 1}`); }));
        expect(drawn, `${design.name}, |J| >= ${threshold}`).toEqual(expected.sort());
        for (const c of byClass(svg, 'coupling')) {
          const [i, j] = c.data.sites.split(' ').map(Number);
          expect(Math.abs(Number(c.data.coupling) - H[i - 1][j - 1])).toBeLessThan(1e-9 * Math.abs(H[i - 1][j - 1]));
        }
      }
    }
  });

  it('keeps a one-colour legend when every dye has the same energy, and escapes names', () => {
    const flat = withName({ ...DESIGNS[1], sites: DESIGNS[1].sites.map((s) => ({ ...s, energy: 17000 })) }, 'wire <flat> & "same"');
    const text = arraySvg(flat, { system: POINT });
    const svg = parseSvg(text);
    const legend = byClass(svg, 'legend')[0];
    expect([legend.data.min, legend.data.max]).toEqual(['17000', '17000']);
    expect(new Set(byClass(svg, 'dye').map((d) => d.data.colour)).size).toBe(1);
    expect(text).toContain('wire &lt;flat&gt; &amp; &quot;same&quot;');
  });

  it('rejects a negative coupling threshold', () => {
    expect(() => arraySvg(DESIGNS[0], { threshold: -1 })).toThrow(/threshold/);
  });
});

describe('the energy-level diagram', () => {
  for (const design of DESIGNS) {
    it(`${design.name}: site energies beside the exciton energies and oscillator strengths numpy computes`, () => {
      const ref = numpyExcitons(design.sites);
      const svg = parseSvg(levelsSvg(design, { system: POINT }));
      expect(svg.root).toBe('svg');
      const sites = byClass(svg, 'site-level');
      expect(sites.map((s) => Number(s.data.energy))).toEqual(design.sites.map((s) => s.energy));
      expect(byClass(svg, 'trap').map((t) => Number(t.data.site))).toEqual(design.traps.map((t) => t + 1));
      const levels = byClass(svg, 'exciton-level');
      expect(levels).toHaveLength(design.sites.length);
      levels.forEach((l, a) => {
        expect(Number(l.data.energy)).toBeCloseTo(ref.energies[a], 2);
        expect(Number(l.data.strength)).toBeCloseTo(ref.strengths[a], 3);
      });
      // oscillator-strength sum rule: the exciton strengths add up to the monomers' (N in units of the mean monomer)
      // (e.g. May and Kuehn, Charge and Energy Transfer Dynamics in Molecular Systems, 3rd ed. 2011, ch. 9; from memory)
      expect(levels.reduce((s, l) => s + Number(l.data.strength), 0)).toBeCloseTo(design.sites.length, 9);
    });
  }
});
