import { describe, expect, it } from 'vitest';
import { extendedDipoleCoupling, orientationFactor, pointDipoleCoupling, screeningFactor } from '../../src/physics/couplings.js';
import { DIPOLE_PREFACTOR_CM } from '../../src/physics/constants.js';
import { randomUnit, rng } from '../helpers/random.js';

const x = [1, 0, 0] as const, y = [0, 1, 0] as const;

describe('orientation factor (CONVENTIONS.md; Foerster, Ann. Phys. 1948)', () => {
  it('is -2 head-to-tail and +1 parallel side by side', () => {
    expect(orientationFactor(x, x, x)).toBe(-2);
    expect(orientationFactor(y, y, x)).toBe(1);
    expect(orientationFactor(x, y, [0, 0, 1])).toBe(0);
  });
  it('averages kappa^2 to 2/3 over random orientations (isotropic dynamic average)', () => {
    const r = rng(7);
    let s = 0;
    const N = 200_000;
    for (let i = 0; i < N; i++) s += orientationFactor(randomUnit(r), randomUnit(r), [0, 0, 1]) ** 2;
    // Monte Carlo standard error of kappa^2 is about 0.6 / sqrt(N) = 0.0013.
    expect(s / N).toBeCloseTo(2 / 3, 2);
  });
});

describe('point-dipole coupling', () => {
  it('gives J = 5.0341 kappa mu^2 / R^3 (two 10 D dyes, 2 nm head-to-tail: -125.85 cm^-1)', () => {
    const J = pointDipoleCoupling({ position: [0, 0, 0], direction: x, dipole: 10 }, { position: [2, 0, 0], direction: x, dipole: 10 });
    expect(J).toBeCloseTo((-2 * DIPOLE_PREFACTOR_CM * 100) / 8, 10);
    expect(J).toBeCloseTo(-125.85, 1);
  });
  it('is divided by n^2 under constant screening and follows A exp(-B R) + s0 under the exponential law', () => {
    expect(screeningFactor({ kind: 'constant', refractiveIndex: 1.5 }, 3)).toBeCloseTo(1 / 2.25, 12);
    expect(screeningFactor({ kind: 'exponential', amplitude: 2.68, decayPerNm: 2.7, offset: 0.54 }, 1)).toBeCloseTo(2.68 * Math.exp(-2.7) + 0.54, 12);
  });
});

describe('extended-dipole coupling (charges +-q at +-l/2, q l = mu)', () => {
  it('approaches the point-dipole value when R >> l, with a 1/R^2 relative correction', () => {
    const r = rng(3);
    for (let k = 0; k < 10; k++) {
      const a = { position: [0, 0, 0] as const, direction: randomUnit(r), dipole: 8, length: 1 };
      const dir = randomUnit(r), ub = randomUnit(r);
      const errs = [20, 40].map((R) => {
        const b = { position: [R * dir[0], R * dir[1], R * dir[2]] as const, direction: ub, dipole: 12, length: 1.5 };
        const p = pointDipoleCoupling(a, b), e = extendedDipoleCoupling(a, b);
        return Math.abs(e - p) / (Math.abs(DIPOLE_PREFACTOR_CM * 96) / R ** 3);
      });
      expect(errs[0]).toBeLessThan(0.02);
      // quadrupolar correction terms fall as (l/R)^2: doubling R cuts the relative error about 4x
      expect(errs[1]).toBeLessThan(errs[0] / 3);
    }
  });
  it('departs from the point dipole at contact (two 1.2 nm dyes stacked 0.8 nm apart)', () => {
    const a = { position: [0, 0, 0] as const, direction: x, dipole: 10, length: 1.2 };
    const b = { position: [0, 0.8, 0] as const, direction: x, dipole: 10, length: 1.2 };
    const p = pointDipoleCoupling(a, b), e = extendedDipoleCoupling(a, b);
    expect(e).toBeGreaterThan(0);
    expect(e).toBeLessThan(0.6 * p); // the point dipole overestimates at close range (common practice)
  });
});
