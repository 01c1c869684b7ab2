import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { RegionScaffold, Vector3 } from '../../src/config/constraints-types.js';
import { maxDyesInRegion } from '../../src/config/precheck/packing-bound.js';
import { gridBound } from '../../src/config/precheck/packing-grid.js';
import { KEPLER_DENSITY, keplerBound } from '../../src/config/precheck/packing-kepler.js';
import { insideRegion } from '../../src/config/precheck/region-geometry.js';
import { spreadSubset } from '../../src/config/precheck/spread-subset.js';

const free = { kind: 'free' } as const;
const box = (x: number, y: number, z: number): RegionScaffold => ({ kind: 'box', size: { x, y, z }, dipole: free });
const cylinder = (radius: number, length: number): RegionScaffold => ({ kind: 'cylinder', radius, length, dipole: free });
const sphere = (radius: number): RegionScaffold => ({ kind: 'sphere', radius, dipole: free });
const slab = (x: number, y: number, thickness: number): RegionScaffold => ({ kind: 'slab', size: { x, y }, thickness, dipole: free });
const bound = maxDyesInRegion;
const dist = (a: Vector3, b: Vector3) => Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);

/** Points of the face-centred cubic lattice (nearest-neighbour distance d) inside a box centred at the origin. */
function fccInBox(side: number, d: number): Vector3[] {
  const a = d * Math.SQRT2; // cubic cell edge of FCC with nearest-neighbour distance d
  const basis = [[0, 0, 0], [0.5, 0.5, 0], [0.5, 0, 0.5], [0, 0.5, 0.5]];
  const points: Vector3[] = [];
  const m = Math.ceil(side / a) + 1;
  for (let i = -m; i <= m; i++) for (let j = -m; j <= m; j++) for (let k = -m; k <= m; k++) {
    for (const [u, v, w] of basis) {
      const p = { x: (i + u) * a, y: (j + v) * a, z: (k + w) * a };
      if (insideRegion(box(side, side, side), p)) points.push(p);
    }
  }
  return points;
}

describe('packing bounds for a free region', () => {
  it('uses the Kepler density pi/sqrt(18) = 0.74048 (Hales 2005)', () => {
    expect(KEPLER_DENSITY).toBeCloseTo(0.74048, 5);
  });

  it('allows exactly one dye in a region that is a single point', () => {
    // The rhombic dodecahedron around a ball of radius d/2 has volume 4*sqrt(2)*(d/2)^3, and
    // pi/sqrt(18) * 4*sqrt(2) / (4*pi/3) = 1: the bound is tight here.
    expect(keplerBound(sphere(0), 1)).toBe(1);
    expect(bound(box(0, 0, 0), 1)).toBe(1);
  });

  it('is exact on a segment: floor(L/d) + 1 dyes fit on a line of length L', () => {
    for (const L of [0, 0.5, 1, 2.99, 3, 7.2]) expect(gridBound(cylinder(0, L), 1)).toBe(Math.floor(L + 1e-12) + 1);
  });

  it('approaches the Kepler density in a large box (the density bound dominates)', () => {
    // The tile is the box grown by d/2 on each side, so the ratio is (side + 1)^3 / side^3 for d = 1.
    const side = 1000;
    const ball = Math.PI / 6;
    expect(keplerBound(box(side, side, side), 1) / ((KEPLER_DENSITY * side ** 3) / ball)).toBeCloseTo(1, 2);
  });

  it('never rejects the face-centred cubic packing, the densest one, cut out of a box', () => {
    for (const side of [1, 2.5, 4, 7]) {
      const points = fccInBox(side, 1);
      expect(points.length).toBeGreaterThan(0);
      expect(bound(box(side, side, side), 1)).toBeGreaterThanOrEqual(points.length);
    }
  });

  it('never rejects a set of points that was actually placed (random sequential addition)', () => {
    const region = fc.oneof(
      fc.tuple(fc.double({ min: 0, max: 6, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true })).map(([x, y, z]) => box(x, y, z)),
      fc.tuple(fc.double({ min: 0, max: 3, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true })).map(([r, l]) => cylinder(r, l)),
      fc.double({ min: 0, max: 3, noNaN: true }).map(sphere),
      fc.tuple(fc.double({ min: 0, max: 6, noNaN: true }), fc.double({ min: 0, max: 6, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true })).map(([x, y, t]) => slab(x, y, t)),
    );
    fc.assert(
      fc.property(region, fc.double({ min: 0.3, max: 2, noNaN: true }), fc.integer({ min: 1, max: 2 ** 31 }), (r, d, seed) => {
        const rand = fc.sample(fc.double({ min: -0.5, max: 0.5, noNaN: true }), { numRuns: 6000, seed });
        const [ex, ey, ez] = r.kind === 'box' ? [r.size.x, r.size.y, r.size.z] : r.kind === 'slab' ? [r.size.x, r.size.y, r.thickness] : r.kind === 'cylinder' ? [2 * r.radius, 2 * r.radius, r.length] : [2 * r.radius, 2 * r.radius, 2 * r.radius];
        const points: Vector3[] = [];
        for (let i = 0; i + 2 < rand.length; i += 3) {
          const p = { x: rand[i] * ex, y: rand[i + 1] * ey, z: rand[i + 2] * ez };
          if (insideRegion(r, p) && points.every((q) => dist(p, q) >= d)) points.push(p);
        }
        expect(bound(r, d)).toBeGreaterThanOrEqual(points.length);
      }),
      { numRuns: 60 },
    );
  });

  it('rejects clearly impossible counts', () => {
    expect(bound(sphere(1), 1)).toBeLessThan(100);
    // Two dyes 1 nm apart need a region at least 1 nm across.
    expect(bound(sphere(0.45), 1)).toBe(1);
    expect(bound(sphere(0.5), 1)).toBeGreaterThanOrEqual(2);
    expect(bound(box(0.5, 0.5, 0.5), 1)).toBe(1);
  });
});

describe('spread subsets of anchor points', () => {
  /** Brute force over every subset: the reference for small cases. */
  function bruteForce(points: Vector3[], k: number, d: number, required: number[]): boolean {
    const n = points.length;
    for (let mask = 0; mask < 1 << n; mask++) {
      const chosen = [...Array(n).keys()].filter((i) => mask & (1 << i));
      if (chosen.length !== k || !required.every((r) => chosen.includes(r))) continue;
      if (chosen.every((i) => chosen.every((j) => i === j || dist(points[i], points[j]) >= d - 1e-9))) return true;
    }
    return false;
  }

  it('agrees with brute force on random small point sets', () => {
    const point = fc.record({ x: fc.double({ min: 0, max: 3, noNaN: true }), y: fc.double({ min: 0, max: 3, noNaN: true }), z: fc.constant(0) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 1, maxLength: 11 }), fc.integer({ min: 1, max: 6 }), fc.double({ min: 0.2, max: 2, noNaN: true }), fc.boolean(), (points, k, d, pin) => {
        const required = pin ? [0] : [];
        const answer = spreadSubset(points, k, d, required);
        expect(answer).toBe(bruteForce(points, k, d, required) ? 'yes' : 'no');
      }),
      { numRuns: 300 },
    );
  });

  it('finds the exact count on a line of anchors 0.3 nm apart', () => {
    const line = [...Array(10).keys()].map((i) => ({ x: 0.3 * i, y: 0, z: 0 }));
    // At 1.0 nm: 0, 1.2 and 2.4 nm; at 0.6 nm: 0, 0.6, 1.2, 1.8 and 2.4 nm.
    expect(spreadSubset(line, 3, 1.0)).toBe('yes');
    expect(spreadSubset(line, 4, 1.0)).toBe('no');
    expect(spreadSubset(line, 5, 0.6)).toBe('yes');
    expect(spreadSubset(line, 6, 0.6)).toBe('no');
  });
});
