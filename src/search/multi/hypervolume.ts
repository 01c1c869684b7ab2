/**
 * Hypervolume (the Lebesgue measure of the region dominated by a set of points and bounded by a
 * reference point, all objectives minimized; Zitzler and Thiele 1998).
 * Two objectives: exact sweep over the points sorted by the first objective, O(n log n).
 * More objectives: exact "hypervolume by slicing objectives" (While, Hingston, Barone and Huband,
 * IEEE TEC 10(1), 2006): slices along the last objective, each slice a hypervolume in one dimension
 * less. Exponential in the number of objectives, fine for the small fronts of a design run.
 * Points not strictly better than the reference in every objective add nothing.
 */
import { InputError } from '../../errors.js';

function sweep2(points: ArrayLike<number>[], r0: number, r1: number): number {
  const ps = points.filter((p) => p[0] < r0 && p[1] < r1).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  let hv = 0;
  let y = r1;
  for (const p of ps) {
    if (p[1] < y) {
      hv += (r0 - p[0]) * (y - p[1]);
      y = p[1];
    }
  }
  return hv;
}

function slice(points: ArrayLike<number>[], ref: readonly number[], d: number): number {
  if (points.length === 0) return 0;
  if (d === 1) return Math.max(0, ref[0] - Math.min(...points.map((p) => p[0])));
  if (d === 2) return sweep2(points, ref[0], ref[1]);
  const k = d - 1;
  const ps = [...points].sort((a, b) => a[k] - b[k]);
  let hv = 0;
  for (let i = 0; i < ps.length; i++) {
    const top = i + 1 < ps.length ? ps[i + 1][k] : ref[k];
    const depth = top - ps[i][k];
    if (depth > 0) hv += depth * slice(ps.slice(0, i + 1), ref, k);
  }
  return hv;
}

export function hypervolume(points: readonly ArrayLike<number>[], reference: readonly number[]): number {
  const m = reference.length;
  if (m === 0 || !reference.every(Number.isFinite)) throw new InputError('hypervolume needs a finite reference point');
  for (const p of points) {
    if (p.length !== m) throw new InputError(`hypervolume: a point has ${p.length} objectives, the reference ${m}`);
  }
  const inside = points.filter((p) => {
    for (let i = 0; i < m; i++) if (!(p[i] < reference[i])) return false;
    return true;
  });
  return slice(inside, reference, m);
}
