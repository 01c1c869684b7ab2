/** The typed search space: every variable kind maps to [0, 1] coordinates and back. */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { InputError } from '../../src/errors.js';
import { Rng, SearchSpace } from '../../src/search/index.js';
import { python } from './helpers.js';

const chiSquareP = (counts: number[]) =>
  python<number>(
    `import json,sys
from scipy import stats
print(json.dumps(stats.chisquare(json.load(sys.stdin)).pvalue))`,
    counts,
  );

describe('search space', () => {
  const space = new SearchSpace()
    .real('gap', 0.5, 4)
    .logReal('rate', 1e-3, 10)
    .reals('pos', 3, -2, 2)
    .integer('count', 2, 6)
    .choice('dye', ['A', 'B', 'C', 'D'])
    .unitVector('dipole');

  it('lays the variables out in standardized coordinates', () => {
    expect(space.dim).toBe(1 + 1 + 3 + 1 + 4 + 3);
    expect(space.categorical).toEqual([{ offset: 6, width: 4 }]);
    expect(space.discreteShare).toBeCloseTo(2 / 6, 15);
  });

  it('decodes the box corners and centre to the documented values', () => {
    const lo = space.decode(new Float64Array(space.dim).fill(0));
    const mid = space.decode(new Float64Array(space.dim).fill(0.5));
    expect(lo.gap).toBe(0.5);
    expect(lo.rate).toBeCloseTo(1e-3, 15);
    expect(lo.count).toBe(2);
    expect(mid.gap).toBeCloseTo(2.25, 15);
    // Log scale: the centre is the geometric mean of the bounds.
    expect(mid.rate).toBeCloseTo(Math.sqrt(1e-3 * 10), 12);
    expect(mid.count).toBe(4);
    expect(space.decode(new Float64Array(space.dim).fill(1)).count).toBe(6);
  });

  it('round-trips every point: decode(encode(p)) = p', () => {
    const rng = Rng.fromSeed(5);
    for (let i = 0; i < 200; i++) {
      const x = new Float64Array(space.dim);
      space.sampleInto(rng, x);
      const p = space.decode(x);
      const q = space.decode(space.encode(p));
      expect(q.count).toBe(p.count);
      expect(q.dye).toBe(p.dye);
      expect(q.gap).toBeCloseTo(p.gap, 12);
      expect(q.rate / p.rate).toBeCloseTo(1, 12);
      q.pos.forEach((v, k) => expect(v).toBeCloseTo(p.pos[k], 12));
      q.dipole.forEach((v, k) => expect(v).toBeCloseTo(p.dipole[k], 12));
    }
  });

  it('decodes any coordinates to a valid point (property test)', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -3, max: 4, noNaN: true }), { minLength: space.dim, maxLength: space.dim }), (arr) => {
        const p = space.decode(Float64Array.from(arr));
        expect(p.gap >= 0.5 && p.gap <= 4).toBe(true);
        expect(p.rate >= 1e-3 && p.rate <= 10).toBe(true);
        expect(Number.isInteger(p.count) && p.count >= 2 && p.count <= 6).toBe(true);
        expect(['A', 'B', 'C', 'D']).toContain(p.dye);
        expect(Math.hypot(...p.dipole)).toBeCloseTo(1, 12);
      }),
    );
  });

  it('samples integers and choices uniformly (chi-square, SciPy)', () => {
    const rng = Rng.fromSeed(8);
    const counts = [0, 0, 0, 0, 0];
    const dyes: Record<string, number> = { A: 0, B: 0, C: 0, D: 0 };
    const x = new Float64Array(space.dim);
    for (let i = 0; i < 10000; i++) {
      space.sampleInto(rng, x);
      const p = space.decode(x);
      counts[p.count - 2]++;
      dyes[p.dye]++;
    }
    expect(chiSquareP(counts)).toBeGreaterThan(1e-3);
    expect(chiSquareP(Object.values(dyes))).toBeGreaterThan(1e-3);
  });

  it('starts from the init values where given', () => {
    const s = new SearchSpace().real('a', 0, 10, { init: 7 }).choice('c', ['x', 'y', 'z'], { init: 'z' }).integer('k', 0, 3);
    const x = new Float64Array(s.dim);
    s.startInto(Rng.fromSeed(1), x);
    const p = s.decode(x);
    expect(p.a).toBeCloseTo(7, 12);
    expect(p.c).toBe('z');
    expect(s.startGiven).toBe(false);
  });

  it('rejects bad definitions and values with InputError', () => {
    expect(() => new SearchSpace().real('a', 1, 1)).toThrow(InputError);
    expect(() => new SearchSpace().logReal('a', 0, 1)).toThrow(/lower > 0/);
    expect(() => new SearchSpace().real('a', 0, 1).real('a', 0, 2)).toThrow(/defined twice/);
    expect(() => new SearchSpace().integer('k', 0.5, 3)).toThrow(InputError);
    expect(() => new SearchSpace().choice('c', [])).toThrow(InputError);
    expect(() => new SearchSpace().choice('c', ['a', 'a'])).toThrow(/distinct/);
    expect(() => space.encode({ ...space.decode(new Float64Array(space.dim)), dye: 'E' as 'A' })).toThrow(/"E" is not one of/);
    expect(() => space.encode({ ...space.decode(new Float64Array(space.dim)), gap: 9 })).toThrow(/outside \[0.5, 4\]/);
    expect(() => space.decode(new Float64Array(3))).toThrow(InputError);
  });
});

describe('unit vectors', () => {
  const space = new SearchSpace().unitVector('u');

  it('samples uniformly on the sphere: same law as SciPy uniform_direction (two-sample KS)', () => {
    const rng = Rng.fromSeed(31);
    const x = new Float64Array(3);
    const ours = Array.from({ length: 4000 }, () => {
      space.sampleInto(rng, x);
      return space.decode(x).u;
    });
    const p = python<number[]>(
      `import json,sys
import numpy as np
from scipy import stats
ours=np.array(json.load(sys.stdin))
ref=stats.uniform_direction(3).rvs(4000, random_state=np.random.default_rng(3))
print(json.dumps([stats.ks_2samp(ours[:,k], ref[:,k]).pvalue for k in range(3)] + [stats.kstest(ours[:,2], "uniform", args=(-1, 2)).pvalue]))`,
      ours,
    );
    // Each coordinate of a uniform direction is uniform on [-1, 1] (Archimedes' hat-box theorem).
    for (const v of p) expect(v).toBeGreaterThan(1e-3);
  });

  it('has no pole artefacts: a small coordinate step turns the direction alike at a pole and at the equator', () => {
    const rng = Rng.fromSeed(4);
    const maxTurn = (u: [number, number, number]) => {
      const base = space.encode({ u });
      let worst = 0;
      for (let i = 0; i < 2000; i++) {
        const step = [rng.normal(), rng.normal(), rng.normal()];
        const norm = Math.hypot(...step);
        const delta = 1e-5;
        const moved = base.map((c, k) => c + (delta * step[k]) / norm);
        const v = space.decode(moved).u;
        const angle = Math.acos(Math.min(1, u[0] * v[0] + u[1] * v[1] + u[2] * v[2]));
        worst = Math.max(worst, angle / delta);
      }
      return worst;
    };
    // Encoded at |w| = 1/2 with w = 2c - 1, a step d in c turns the direction by at most 4 d.
    expect(maxTurn([0, 0, 1])).toBeCloseTo(4, 1);
    expect(maxTurn([1, 0, 0])).toBeCloseTo(4, 1);
    expect(maxTurn([0, 0, -1])).toBeCloseTo(4, 1);
  });
});

describe('constraints', () => {
  const space = new SearchSpace()
    .reals('x', 2, -1, 1)
    .constraint('sum >= 0', (p) => p.x[0] + p.x[1] >= 0, (p) => -(p.x[0] + p.x[1]))
    .constraint('x0 <= 0.5', (p) => p.x[0] <= 0.5);

  it('sums the violations; a constraint without a measure counts 1; a broken measure counts Infinity', () => {
    expect(space.violation({ x: [0.2, 0.1] })).toBe(0);
    expect(space.violation({ x: [-0.5, 0.1] })).toBeCloseTo(0.4, 15);
    expect(space.violation({ x: [0.9, -1] })).toBeCloseTo(0.1 + 1, 15);
    const broken = new SearchSpace().real('a', 0, 1).constraint('never', () => false, () => NaN);
    expect(broken.violation({ a: 0.5 })).toBe(Infinity);
    const zero = new SearchSpace().real('a', 0, 1).constraint('never', () => false, () => 0);
    expect(zero.violation({ a: 0.5 })).toBeGreaterThan(0);
    expect(space.constraintNames).toEqual(['sum >= 0', 'x0 <= 0.5']);
  });
});
