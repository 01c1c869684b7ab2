import type { RegionScaffold } from '../constraints-types.js';
import { gridBound } from './packing-grid.js';
import { keplerBound } from './packing-kepler.js';
import { regionDiameter } from './region-geometry.js';

/**
 * An upper bound on how many dyes the region holds with centres at least dMin apart: the smallest of the
 * density bound (keplerBound), the pigeonhole bound (gridBound) and, when the region is narrower than
 * dMin, one.
 */
export function maxDyesInRegion(region: RegionScaffold, dMin: number): number {
  if (dMin <= 0) return Infinity;
  if (regionDiameter(region) < dMin - 1e-9) return 1;
  return Math.min(keplerBound(region, dMin), gridBound(region, dMin));
}
