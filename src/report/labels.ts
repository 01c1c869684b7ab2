/** Label placement for hand-drawn diagrams. */

/**
 * Positions for labels that want to sit at `wanted` (px, any order) but need `gap` px between
 * neighbours: sorted, pushed apart downward, then shifted back up as a block to stay inside [lo, hi].
 * Returns the positions in the order given.
 */
export function spreadLabels(wanted: readonly number[], gap: number, lo: number, hi: number): number[] {
  const order = wanted.map((y, i) => [y, i] as const).sort((a, b) => a[0] - b[0]);
  const placed = order.map(([y]) => y);
  for (let k = 1; k < placed.length; k++) placed[k] = Math.max(placed[k], placed[k - 1] + gap);
  const over = placed.length ? placed[placed.length - 1] - hi : 0;
  if (over > 0) {
    placed[placed.length - 1] -= over;
    for (let k = placed.length - 2; k >= 0; k--) placed[k] = Math.min(placed[k], placed[k + 1] - gap);
  }
  for (let k = 0; k < placed.length && placed[k] < lo; k++) placed[k] = Math.max(lo, k > 0 ? placed[k - 1] + gap : lo);
  const out = new Array<number>(wanted.length);
  order.forEach(([, i], k) => { out[i] = placed[k]; });
  return out;
}
