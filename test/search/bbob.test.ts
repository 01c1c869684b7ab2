/**
 * The BBOB test functions against their definitions (Hansen, Finck, Ros and Auger 2009, INRIA
 * RR-6829) and, for Rosenbrock, against SciPy's scipy.optimize.rosen.
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { bbob, Rng, type BbobName } from '../../src/search/index.js';
import { tasy, tosz } from '../../src/search/problems/bbob.js';
import { python } from './helpers.js';

const NAMES: BbobName[] = ['sphere', 'ellipsoid', 'rastrigin', 'rosenbrock'];

describe('BBOB functions', () => {
  it('have their minimum f_opt at x_opt, inside the documented range', () => {
    for (const name of NAMES) {
      for (const dim of [2, 10, 40]) {
        const f = bbob(name, dim, 17, 12.5);
        expect(f.evaluate(f.xopt)).toBeCloseTo(12.5, 12);
        const bound = name === 'rosenbrock' ? 3 : 4;
        for (const v of f.xopt) expect(Math.abs(v)).toBeLessThanOrEqual(bound);
        // Any other point is worse.
        const rng = Rng.fromSeed(dim);
        for (let i = 0; i < 50; i++) {
          const x = Array.from(f.xopt, (v) => v + 0.5 * (rng.uniform() - 0.5));
          expect(f.evaluate(x)).toBeGreaterThan(12.5);
        }
      }
    }
  });

  it('f8 Rosenbrock is scipy.optimize.rosen of z = max(1, sqrt(D)/8) (x - x_opt) + 1', () => {
    for (const dim of [2, 10, 100]) {
      const f = bbob('rosenbrock', dim, 3);
      const rng = Rng.fromSeed(dim);
      const xs = Array.from({ length: 5 }, () => Array.from({ length: dim }, () => 10 * rng.uniform() - 5));
      const c = Math.max(1, Math.sqrt(dim) / 8);
      const zs = xs.map((x) => x.map((v, i) => c * (v - f.xopt[i]) + 1));
      const ref = python<number[]>(
        `import json,sys
from scipy.optimize import rosen
print(json.dumps([float(rosen(z)) for z in json.load(sys.stdin)]))`,
        zs,
      );
      xs.forEach((x, k) => expect(f.evaluate(x) / ref[k]).toBeCloseTo(1, 12));
    }
  });

  it('f1 sphere is the squared distance to x_opt', () => {
    const f = bbob('sphere', 5, 8);
    const x = [1, -2, 0.5, 3, -4];
    expect(f.evaluate(x)).toBeCloseTo(x.reduce((s, v, i) => s + (v - f.xopt[i]) ** 2, 0), 12);
  });

  it('f2 ellipsoid has axis weights 10^(6 (i-1)/(D-1)): conditioning 1e6 between first and last axis', () => {
    const f = bbob('ellipsoid', 10, 5);
    for (const t of [0.01, 0.3, 2]) {
      const along = (i: number) => f.evaluate(Array.from(f.xopt, (v, k) => (k === i ? v + t : v)));
      expect(along(9) / along(0)).toBeCloseTo(1e6, 3);
      expect(along(4) / along(0)).toBeCloseTo(10 ** ((6 * 4) / 9), 3);
    }
  });

  it('f3 Rastrigin agrees with a NumPy rewrite of the RR-6829 formula', () => {
    const f = bbob('rastrigin', 6, 21);
    const rng = Rng.fromSeed(6);
    const xs = Array.from({ length: 8 }, () => Array.from({ length: 6 }, () => 10 * rng.uniform() - 5));
    const ref = python<number[]>(
      `import json,sys
import numpy as np
d=json.load(sys.stdin); xopt=np.array(d["xopt"]); D=len(xopt)
def tosz(x):
    xh=np.where(x!=0, np.log(np.abs(x)+(x==0)), 0.0)
    c1=np.where(x>0,10.0,5.5); c2=np.where(x>0,7.9,3.1)
    return np.sign(x)*np.exp(xh+0.049*(np.sin(c1*xh)+np.sin(c2*xh)))
def tasy(x,beta):
    i=np.arange(D)
    return np.where(x>0, np.abs(x)**(1+beta*i/(D-1)*np.sqrt(np.abs(x))), x)
lam=10.0**(0.5*np.arange(D)/(D-1))
out=[]
for x in d["xs"]:
    z=lam*tasy(tosz(np.array(x)-xopt),0.2)
    out.append(float(10*(D-np.sum(np.cos(2*np.pi*z)))+np.sum(z*z)))
print(json.dumps(out))`,
      { xopt: Array.from(f.xopt), xs },
    );
    xs.forEach((x, k) => expect(f.evaluate(x)).toBeCloseTo(ref[k], 9));
  });

  it('T_osz is increasing with T_osz(0) = 0, T_osz(+-1) = +-1; T_asy leaves negatives and coordinate 1 alone', () => {
    expect(tosz(0)).toBe(0);
    expect(tosz(1)).toBe(1);
    expect(tosz(-1)).toBe(-1);
    fc.assert(fc.property(fc.double({ min: -100, max: 100, noNaN: true }), fc.double({ min: 1e-6, max: 1, noNaN: true }), (x, d) => tosz(x + d) > tosz(x)));
    expect(tasy(-2, 0.5, 3, 5)).toBe(-2);
    expect(tasy(2, 0.5, 0, 5)).toBe(2);
    expect(tasy(2, 0.5, 4, 5)).toBeCloseTo(2 ** (1 + 0.5 * Math.sqrt(2)), 14);
  });
});
