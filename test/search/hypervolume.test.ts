/**
 * Hypervolume, crowding distance and non-dominated sorting, checked against independent formulas:
 * inclusion-exclusion over the dominated boxes, and the definitions of Deb et al. (IEEE TEC 2002).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { hypervolume, Rng } from '../../src/search/index.js';
import { crowdingDistance } from '../../src/search/multi/crowding.js';
import { nondominatedSort } from '../../src/search/multi/nondominatedSort.js';

/** Volume of the union of the boxes [p, ref] by inclusion-exclusion (exponential; small sets only). */
function inclusionExclusion(points: number[][], ref: number[]): number {
  let total = 0;
  const n = points.length;
  for (let mask = 1; mask < 1 << n; mask++) {
    let vol = 1;
    let size = 0;
    for (let k = 0; k < ref.length; k++) {
      let worst = -Infinity;
      for (let i = 0; i < n; i++) if (mask & (1 << i)) worst = Math.max(worst, points[i][k]);
      vol *= Math.max(0, ref[k] - worst);
    }
    for (let i = 0; i < n; i++) if (mask & (1 << i)) size++;
    total += (size % 2 === 1 ? 1 : -1) * vol;
  }
  return total;
}

const pointSets = (m: number) =>
  fc.array(fc.array(fc.double({ min: 0, max: 1.2, noNaN: true }), { minLength: m, maxLength: m }), { minLength: 1, maxLength: 8 });

const dominates = (a: number[], b: number[]) => a.every((v, k) => v <= b[k]) && a.some((v, k) => v < b[k]);

describe('hypervolume', () => {
  for (const m of [2, 3, 4]) {
    it(`equals inclusion-exclusion for random sets in ${m} objectives`, () => {
      const ref = new Array(m).fill(1);
      fc.assert(fc.property(pointSets(m), (pts) => Math.abs(hypervolume(pts, ref) - inclusionExclusion(pts, ref)) < 1e-12));
    });
  }

  it('approaches the area 2/3 dominated by the ZDT1 front f2 = 1 - sqrt(f1)', () => {
    const n = 4000;
    const front = Array.from({ length: n }, (_, i) => [i / (n - 1), 1 - Math.sqrt(i / (n - 1))]);
    const hv = hypervolume(front, [1, 1]);
    expect(hv).toBeLessThan(2 / 3);
    expect(hv).toBeGreaterThan(2 / 3 - 1 / n);
  });

  it('ignores dominated points and points outside the reference box', () => {
    const base = [
      [0.2, 0.6],
      [0.5, 0.3],
    ];
    const hv = hypervolume(base, [1, 1]);
    expect(hv).toBeCloseTo(0.8 * 0.4 + 0.5 * 0.3, 15);
    expect(hypervolume([...base, [0.6, 0.7], [1.5, 0], [0, 1]], [1, 1])).toBeCloseTo(hv, 15);
  });
});

describe('crowding distance and non-dominated sorting', () => {
  it('crowding: extremes infinite, inner points the sum of normalized neighbour gaps', () => {
    const d = crowdingDistance([
      [0, 3],
      [1, 2],
      [2, 1],
      [3, 0],
    ]);
    expect(d[0]).toBe(Infinity);
    expect(d[3]).toBe(Infinity);
    expect(d[1]).toBeCloseTo(2 / 3 + 2 / 3, 15);
    expect(d[2]).toBeCloseTo(4 / 3, 15);
  });

  it('fronts: each is non-dominated, and every later point is dominated by one of the front before', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.integer({ min: 0, max: 5 }), fc.integer({ min: 0, max: 5 }), fc.integer({ min: 0, max: 5 })), { maxLength: 40 }), (pts) => {
        const fronts = nondominatedSort(pts, dominates);
        expect(fronts.flat().sort((a, b) => a - b)).toEqual(pts.map((_, i) => i));
        fronts.forEach((front, r) => {
          for (const i of front) for (const j of front) expect(dominates(pts[i], pts[j])).toBe(false);
          if (r > 0) for (const i of front) expect(fronts[r - 1].some((j) => dominates(pts[j], pts[i]))).toBe(true);
        });
      }),
    );
  });

  it('sorts a random cloud in O(N^2) comparisons without losing points', () => {
    const rng = Rng.fromSeed(3);
    const pts = Array.from({ length: 300 }, () => [rng.uniform(), rng.uniform()]);
    const fronts = nondominatedSort(pts, dominates);
    expect(fronts.reduce((s, f) => s + f.length, 0)).toBe(300);
    expect(fronts.length).toBeGreaterThan(5);
  });
});
