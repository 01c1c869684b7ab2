import { describe, expect, it } from 'vitest';
import type { Vec3 } from '../../src/physics/types.js';
import { bestFitPlane, projectDirection, projectPoint } from '../../src/report/plane.js';
import { Rng } from '../../src/search/rng.js';
import { python } from '../search/helpers.js';

/** Rotation by angle t about the unit axis k (Rodrigues' formula). */
function rotate(p: Vec3, k: Vec3, t: number): Vec3 {
  const [c, s] = [Math.cos(t), Math.sin(t)];
  const kp = k[0] * p[0] + k[1] * p[1] + k[2] * p[2];
  const x: Vec3 = [k[1] * p[2] - k[2] * p[1], k[2] * p[0] - k[0] * p[2], k[0] * p[1] - k[1] * p[0]];
  return [0, 1, 2].map((i) => p[i] * c + x[i] * s + k[i] * kp * (1 - c)) as unknown as Vec3;
}

const AXIS: Vec3 = (() => { const v = [1, -2, 0.5]; const n = Math.hypot(...v); return v.map((x) => x / n) as unknown as Vec3; })();
const SHIFT: Vec3 = [3.1, -0.7, 12.4];
const place = (p: Vec3): Vec3 => { const r = rotate(p, AXIS, 0.83); return [r[0] + SHIFT[0], r[1] + SHIFT[1], r[2] + SHIFT[2]]; };
const dist2 = (a: readonly number[], b: readonly number[]) => Math.hypot(...a.map((x, i) => x - b[i]));

describe('best-fit plane of the dye centres', () => {
  it('a regular hexagon of side 1.4 nm in a tilted, shifted plane keeps its in-plane distances exactly', () => {
    // worked case: a regular hexagon of side a has neighbours at a, second neighbours at a*sqrt(3), opposite corners at 2a
    const a = 1.4;
    const corners = Array.from({ length: 6 }, (_, k): Vec3 => place([a * Math.cos((k * Math.PI) / 3), a * Math.sin((k * Math.PI) / 3), 0]));
    const plane = bestFitPlane(corners);
    const flat = corners.map((p) => projectPoint(plane, p));
    for (let i = 0; i < 6; i++) {
      for (let j = i + 1; j < 6; j++) {
        const gap = Math.min(j - i, 6 - (j - i));
        const expected = gap === 1 ? a : gap === 2 ? a * Math.sqrt(3) : 2 * a;
        expect(dist2(flat[i], flat[j])).toBeCloseTo(expected, 12);
        expect(dist2(flat[i], flat[j])).toBeCloseTo(dist2(corners[i], corners[j]), 12);
      }
    }
    // the normal is the rotated z axis; the centroid is the shifted origin; nothing spreads off the plane
    const normal = rotate([0, 0, 1], AXIS, 0.83);
    expect(Math.abs(plane.axes[2].reduce((s, x, i) => s + x * normal[i], 0))).toBeCloseTo(1, 12);
    plane.centroid.forEach((c, i) => expect(c).toBeCloseTo(SHIFT[i], 12));
    expect(plane.spread[2]).toBeLessThan(1e-7);
    // a hexagon's in-plane second moment is a^2 / 2 along every in-plane direction (common practice: sum of cos^2 over 6 corners is 3)
    expect(plane.spread[0]).toBeCloseTo(a / Math.SQRT2, 12);
    // a dipole along the normal has no in-plane part; one in the plane keeps its length
    const [nx, ny] = projectDirection(plane, normal);
    expect(Math.hypot(nx, ny)).toBeLessThan(1e-12);
    const inPlane = rotate([0.6, 0.8, 0], AXIS, 0.83);
    expect(Math.hypot(...projectDirection(plane, inPlane))).toBeCloseTo(1, 12);
  });

  it('a rectangle of 4 by 2 nm: the first axis runs along its long side', () => {
    const pts: Vec3[] = [[0, 0, 0], [4, 0, 0], [4, 2, 0], [0, 2, 0], [2, 0, 0], [2, 2, 0]].map((p) => place(p as unknown as Vec3));
    const plane = bestFitPlane(pts);
    const along = rotate([1, 0, 0], AXIS, 0.83);
    expect(Math.abs(plane.axes[0].reduce((s, x, i) => s + x * along[i], 0))).toBeCloseTo(1, 12);
    expect(plane.spread[0]).toBeGreaterThan(plane.spread[1]);
  });

  it('matches numpy.linalg.svd of the centred coordinates for a seeded random cloud', () => {
    const rng = Rng.fromSeed(17);
    const pts = Array.from({ length: 25 }, (): Vec3 => [3 * rng.normal(), 1.5 * rng.normal(), 0.4 * rng.normal()]).map(place);
    const plane = bestFitPlane(pts);
    // principal axes are the right singular vectors of the centred data matrix; spreads are s / sqrt(n)
    const ref = python<{ vt: number[][]; s: number[] }>(
      `
import sys, json, numpy as np
x = np.array(json.load(sys.stdin)); x = x - x.mean(axis=0)
u, s, vt = np.linalg.svd(x, full_matrices=False)
print(json.dumps({'vt': vt.tolist(), 's': (s / np.sqrt(len(x))).tolist()}))
`,
      pts,
    );
    for (let k = 0; k < 3; k++) {
      expect(Math.abs(plane.axes[k].reduce((s, x, i) => s + x * ref.vt[k][i], 0))).toBeCloseTo(1, 10);
      expect(plane.spread[k]).toBeCloseTo(ref.s[k], 10);
    }
    // the projection keeps the in-plane part of every distance: |d|^2 = |d_plane|^2 + (d . normal)^2
    const [p, q] = [pts[3], pts[11]];
    const d = [0, 1, 2].map((i) => q[i] - p[i]);
    const off = d.reduce((s, x, i) => s + x * plane.axes[2][i], 0);
    expect(dist2(projectPoint(plane, p), projectPoint(plane, q)) ** 2 + off ** 2).toBeCloseTo(dist2(p, q) ** 2, 10);
  });

  it('refuses an empty set of points', () => {
    expect(() => bestFitPlane([])).toThrow(/at least one point/);
  });
});
