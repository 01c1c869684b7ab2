import type { Vector3 } from '../constraints-types.js';

export const distance = (a: Vector3, b: Vector3): number => Math.hypot(a.x - b.x, a.y - b.y, a.z - b.z);

/** Angle between two lines (directions without sign), degrees, 0 to 90. */
export function lineAngle(a: Vector3, b: Vector3): number {
  const dot = Math.abs(a.x * b.x + a.y * b.y + a.z * b.z) / (Math.hypot(a.x, a.y, a.z) * Math.hypot(b.x, b.y, b.z));
  return (Math.acos(Math.min(1, dot)) * 180) / Math.PI;
}

export const formatVector = (v: Vector3): string => `(${v.x}, ${v.y}, ${v.z})`;

/** A number for a sentence: at most 4 significant digits, no trailing zeros. */
export const num = (x: number): string => String(Number(x.toPrecision(4)));
