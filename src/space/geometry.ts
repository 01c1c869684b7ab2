import type { Vec3 } from '../physics/types.js';
import { norm3 } from '../physics/norm3.js';

/** Unit vector within a cone of half-angle `half` (rad) around unit `axis`: cos(theta) = c, azimuth phi. */
export function coneDirection(axis: Vec3, c: number, phi: number): Vec3 {
  const [ax, ay, az] = axis;
  // any unit vector perpendicular to the axis, then the third by a cross product
  const p: Vec3 = Math.abs(ax) < 0.9 ? [0, az, -ay] : [-az, 0, ax];
  const pl = norm3(p[0], p[1], p[2]);
  const e1: Vec3 = [p[0] / pl, p[1] / pl, p[2] / pl];
  const e2: Vec3 = [ay * e1[2] - az * e1[1], az * e1[0] - ax * e1[2], ax * e1[1] - ay * e1[0]];
  const s = Math.sqrt(Math.max(0, 1 - c * c));
  const cp = Math.cos(phi), sp = Math.sin(phi);
  return [c * ax + s * (cp * e1[0] + sp * e2[0]), c * ay + s * (cp * e1[1] + sp * e2[1]), c * az + s * (cp * e1[2] + sp * e2[2])];
}

export function normalize(v: Vec3): Vec3 {
  const l = norm3(v[0], v[1], v[2]);
  return [v[0] / l, v[1] / l, v[2] / l];
}

export function distance(a: Vec3, b: Vec3): number {
  return norm3(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
}

/** Angle (rad) between a dipole and an axis, ignoring the dipole's sign. */
export function axisAngle(u: Vec3, axis: Vec3): number {
  const d = Math.abs(u[0] * axis[0] + u[1] * axis[1] + u[2] * axis[2]) / (Math.hypot(...u) * Math.hypot(...axis));
  return Math.acos(Math.min(1, d));
}
