/**
 * ZDT1 and ZDT2 (Zitzler, Deb and Thiele, "Comparison of multiobjective evolutionary algorithms:
 * empirical results", Evol. Comput. 8(2), 2000), n variables in [0, 1], both objectives minimized:
 *   f1 = x1,  g = 1 + 9 sum_{i>=2} x_i / (n - 1),
 *   ZDT1: f2 = g (1 - sqrt(f1 / g)),   ZDT2: f2 = g (1 - (f1 / g)^2).
 * The Pareto front (g = 1) is f2 = 1 - sqrt(f1) (convex) and f2 = 1 - f1^2 (concave). The region
 * they dominate inside the reference box (1, 1) has area int_0^1 sqrt(f1) df1 = 2/3 (ZDT1) and
 * int_0^1 f1^2 df1 = 1/3 (ZDT2).
 */
import { InputError } from '../../errors.js';

export type ZdtName = 'zdt1' | 'zdt2';

export function zdt(name: ZdtName, x: ArrayLike<number>): [number, number] {
  const n = x.length;
  if (n < 2) throw new InputError(`${name} needs at least two variables`);
  let s = 0;
  for (let i = 1; i < n; i++) s += x[i];
  const g = 1 + (9 * s) / (n - 1);
  const f1 = x[0];
  const r = f1 / g;
  if (name === 'zdt1') return [f1, g * (1 - Math.sqrt(r))];
  if (name === 'zdt2') return [f1, g * (1 - r * r)];
  throw new InputError(`unknown ZDT problem "${name}"; known: zdt1, zdt2`);
}

/** Hypervolume of the true front with reference (1, 1). */
export const ZDT_FRONT_HYPERVOLUME: Record<ZdtName, number> = { zdt1: 2 / 3, zdt2: 1 / 3 };
