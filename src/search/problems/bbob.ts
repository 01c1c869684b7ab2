/**
 * Test functions from Hansen, Finck, Ros and Auger, "Real-parameter black-box optimization
 * benchmarking 2009: noiseless functions definitions", INRIA RR-6829:
 *   f1 sphere              ||z||^2,                                   z = x - x_opt
 *   f2 separable ellipsoid sum 10^(6 (i-1)/(D-1)) z_i^2,              z = T_osz(x - x_opt)
 *   f3 separable Rastrigin 10 (D - sum cos(2 pi z_i)) + ||z||^2,      z = L^10 T_asy^0.2(T_osz(x - x_opt))
 *   f8 Rosenbrock          sum 100 (z_i^2 - z_{i+1})^2 + (z_i - 1)^2, z = max(1, sqrt(D)/8)(x - x_opt) + 1
 * with T_osz, T_asy and L^alpha as defined there. These four are unrotated by definition, so no
 * rotation matrices are involved. The shift x_opt is included: it is drawn uniformly from [-4, 4]^D
 * with our own seeded generator (for f8 scaled by 0.75, into [-3, 3]^D, as in the BBOB code), not
 * from the BBOB instance generator, so instance numbers do not match COCO's. f_opt is a parameter
 * (default 0); `evaluate` returns f(x) including f_opt. The search domain is [-5, 5]^D, where the
 * boundary penalty f_pen of f3 is zero.
 */
import { InputError } from '../../errors.js';
import { Rng } from '../rng.js';

export type BbobName = 'sphere' | 'ellipsoid' | 'rastrigin' | 'rosenbrock';

export interface BbobFunction {
  readonly name: BbobName;
  /** Function number in the BBOB suite. */
  readonly id: number;
  readonly dim: number;
  readonly xopt: Float64Array;
  readonly fopt: number;
  evaluate(x: ArrayLike<number>): number;
}

/** The oscillation transformation T_osz of the BBOB definitions, for one coordinate. */
export function tosz(v: number): number {
  const xh = v !== 0 ? Math.log(Math.abs(v)) : 0;
  const c1 = v > 0 ? 10 : 5.5;
  const c2 = v > 0 ? 7.9 : 3.1;
  return Math.sign(v) * Math.exp(xh + 0.049 * (Math.sin(c1 * xh) + Math.sin(c2 * xh)));
}

/** The asymmetry transformation T_asy^beta, coordinate i of D (0-based i). */
export function tasy(v: number, beta: number, i: number, dim: number): number {
  return v > 0 ? Math.pow(v, 1 + ((beta * i) / (dim - 1)) * Math.sqrt(v)) : v;
}

const IDS: Record<BbobName, number> = { sphere: 1, ellipsoid: 2, rastrigin: 3, rosenbrock: 8 };

export function bbob(name: BbobName, dim: number, seed = 1, fopt = 0): BbobFunction {
  if (!(name in IDS)) throw new InputError(`unknown BBOB function "${name}"; known: ${Object.keys(IDS).join(', ')}`);
  if (!Number.isInteger(dim) || dim < 2) throw new InputError(`BBOB functions here need dimension >= 2, got ${dim}`);
  const rng = Rng.fromSeed(seed);
  const scale = name === 'rosenbrock' ? 0.75 : 1;
  const xopt = Float64Array.from({ length: dim }, () => scale * (8 * rng.uniform() - 4));
  const D = dim;
  const rosenFactor = Math.max(1, Math.sqrt(D) / 8);
  const evaluate = (x: ArrayLike<number>): number => {
    if (x.length !== D) throw new InputError(`${name}: expected ${D} coordinates, got ${x.length}`);
    let f = 0;
    switch (name) {
      case 'sphere':
        for (let i = 0; i < D; i++) f += (x[i] - xopt[i]) ** 2;
        break;
      case 'ellipsoid':
        for (let i = 0; i < D; i++) f += Math.pow(10, (6 * i) / (D - 1)) * tosz(x[i] - xopt[i]) ** 2;
        break;
      case 'rastrigin': {
        let c = 0;
        for (let i = 0; i < D; i++) {
          const z = Math.pow(10, (0.5 * i) / (D - 1)) * tasy(tosz(x[i] - xopt[i]), 0.2, i, D);
          c += Math.cos(2 * Math.PI * z);
          f += z * z;
        }
        f += 10 * (D - c);
        break;
      }
      case 'rosenbrock': {
        let prev = rosenFactor * (x[0] - xopt[0]) + 1;
        for (let i = 0; i < D - 1; i++) {
          const next = rosenFactor * (x[i + 1] - xopt[i + 1]) + 1;
          f += 100 * (prev * prev - next) ** 2 + (prev - 1) ** 2;
          prev = next;
        }
        break;
      }
    }
    return f + fopt;
  };
  return { name, id: IDS[name], dim, xopt, fopt, evaluate };
}
