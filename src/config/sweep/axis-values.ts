import type { SweepAxis } from '../sweep-types.js';

/**
 * The values of one varied field: the list as given, or `steps` evenly spaced numbers from start to stop
 * (both included), rounded to 12 significant digits so that 0.1 steps read as 0.1, 0.2, 0.3.
 */
export function axisValues(axis: SweepAxis): unknown[] {
  if ('values' in axis) return axis.values;
  const { start, stop, steps } = axis.range;
  if (steps === 1) return [start];
  return [...Array(steps).keys()].map((i) => Number((start + ((stop - start) * i) / (steps - 1)).toPrecision(12)));
}

/** Every combination (grid, the first axis varying slowest) or the i-th values together (zip). */
export function combinePoints(lists: unknown[][], combine: 'grid' | 'zip'): unknown[][] {
  if (combine === 'zip') return lists[0].map((_, i) => lists.map((list) => list[i]));
  return lists.reduce<unknown[][]>((points, list) => points.flatMap((p) => list.map((v) => [...p, v])), [[]]);
}
