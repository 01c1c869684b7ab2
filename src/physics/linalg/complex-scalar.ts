/** Complex scalar helpers on (re, im) pairs, returned as two-element tuples. */

/** Principal square root of a complex number (Re >= 0); |z| by a plain sqrt (fine below 1e150). */
export function csqrt(r: number, i: number): [number, number] {
  if (r === 0 && i === 0) return [0, 0];
  const m = Math.sqrt(r * r + i * i);
  const t = Math.sqrt(0.5 * (m + Math.abs(r)));
  if (r >= 0) return [t, i / (2 * t)];
  return [Math.abs(i) / (2 * t), i >= 0 ? t : -t];
}

/** a / b for complex a, b (Smith's algorithm, Comm. ACM 5, 435 (1962)). */
export function cdiv(ar: number, ai: number, br: number, bi: number): [number, number] {
  if (Math.abs(br) >= Math.abs(bi)) {
    const r = bi / br, d = br + bi * r;
    return [(ar + ai * r) / d, (ai - ar * r) / d];
  }
  const r = br / bi, d = bi + br * r;
  return [(ar * r + ai) / d, (ai * r - ar) / d];
}

/** |z| by a plain sqrt (several times faster than Math.hypot; fine for |re|, |im| below 1e150). */
export function cabs(r: number, i: number): number {
  return Math.sqrt(r * r + i * i);
}
