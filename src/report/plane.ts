/**
 * The best-fit plane of a set of points by principal component analysis: the plane through their
 * centroid spanned by the eigenvectors of the 3 x 3 covariance matrix with the two largest eigenvalues
 * (its normal is the direction of least spread).
 */
import { InputError } from '../errors.js';
import { symmetricEigen } from '../physics/linalg/symmetric-eigen.js';
import type { Vec3 } from '../physics/types.js';

export interface BestFitPlane {
  readonly centroid: Vec3;
  /** Unit principal axes by decreasing spread: axes[0], axes[1] span the plane, axes[2] is its normal. */
  readonly axes: readonly [Vec3, Vec3, Vec3];
  /** Root-mean-square spread along each axis, nm (axes order). */
  readonly spread: readonly [number, number, number];
}

/** Principal axes of points (nm). Axis signs follow the eigen solver's rule (largest component positive). */
export function bestFitPlane(points: readonly Vec3[]): BestFitPlane {
  const n = points.length;
  if (n === 0) throw new InputError('a best-fit plane needs at least one point');
  const c = [0, 0, 0];
  for (const p of points) for (let k = 0; k < 3; k++) c[k] += p[k] / n;
  const cov = new Float64Array(9);
  for (const p of points) {
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) cov[i * 3 + j] += ((p[i] - c[i]) * (p[j] - c[j])) / n;
  }
  const { values, vectors } = symmetricEigen(cov, 3);
  // ascending eigenvalues: columns 2, 1, 0 are the axes by decreasing spread
  const axis = (a: number): Vec3 => [vectors[a], vectors[3 + a], vectors[6 + a]];
  const rms = (a: number) => Math.sqrt(Math.max(0, values[a]));
  return { centroid: [c[0], c[1], c[2]], axes: [axis(2), axis(1), axis(0)], spread: [rms(2), rms(1), rms(0)] };
}

const dot = (a: Vec3, b: readonly number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];

/** In-plane coordinates (along axes[0], axes[1]) of a point. */
export function projectPoint(plane: BestFitPlane, p: Vec3): [number, number] {
  const d = [p[0] - plane.centroid[0], p[1] - plane.centroid[1], p[2] - plane.centroid[2]];
  return [dot(plane.axes[0], d), dot(plane.axes[1], d)];
}

/** In-plane components of a direction (not normalized: an out-of-plane direction comes out short). */
export function projectDirection(plane: BestFitPlane, u: Vec3): [number, number] {
  return [dot(plane.axes[0], u), dot(plane.axes[1], u)];
}
