import type { Vector3 } from '../constraints-types.js';
import { distance } from './vector.js';

export type SpreadAnswer = 'yes' | 'no' | 'unknown';

/** Above this many points the pairwise search is skipped ('unknown'): it needs n^2 distances. */
export const MAX_SPREAD_POINTS = 3000;

/**
 * Is there a set of k points, containing every index in `required`, whose pairwise distances are all at
 * least minDistance? (An independent set of size k in the graph of too-close pairs.) Greedy first
 * (fewest conflicts first); if the greedy pick falls short, an exact branch-and-bound search that gives
 * up ('unknown') after nodeLimit branches.
 */
export function spreadSubset(
  points: readonly Vector3[],
  k: number,
  minDistance: number,
  required: readonly number[] = [],
  nodeLimit = 200_000,
): SpreadAnswer {
  const n = points.length;
  if (n < k) return 'no';
  if (minDistance <= 0) return 'yes';
  if (n > MAX_SPREAD_POINTS) return 'unknown';
  const close = new Uint8Array(n * n);
  const tooClose = (i: number, j: number) => close[i * n + j] === 1;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (distance(points[i], points[j]) < minDistance - 1e-9) close[i * n + j] = close[j * n + i] = 1;
    }
  }
  for (const a of required) for (const b of required) if (a !== b && tooClose(a, b)) return 'no';
  const free = [...Array(n).keys()].filter((i) => !required.includes(i) && !required.some((r) => tooClose(r, i)));
  const need = k - required.length;
  if (need <= 0) return 'yes';
  if (free.length < need) return 'no';

  const degree = new Map(free.map((i) => [i, free.reduce((s, j) => s + close[i * n + j], 0)]));
  const order = [...free].sort((i, j) => degree.get(i)! - degree.get(j)! || i - j);
  const picked: number[] = [];
  for (const i of order) if (picked.every((j) => !tooClose(i, j))) picked.push(i);
  if (picked.length >= need) return 'yes';

  let nodes = 0;
  const search = (chosen: number, candidates: number[]): SpreadAnswer => {
    if (chosen >= need) return 'yes';
    if (chosen + candidates.length < need) return 'no';
    if (++nodes > nodeLimit) return 'unknown';
    const [v, ...rest] = candidates;
    const withV = search(chosen + 1, rest.filter((u) => !tooClose(v, u)));
    return withV !== 'no' ? withV : search(chosen, rest);
  };
  return search(0, order);
}
