import type { RegionScaffold } from '../constraints-types.js';

/** Edges of a box that contains the region (the region's own box for box and slab). */
export function boundingBox(region: RegionScaffold): [number, number, number] {
  switch (region.kind) {
    case 'box':
      return [region.size.x, region.size.y, region.size.z];
    case 'slab':
      return [region.size.x, region.size.y, region.thickness];
    case 'cylinder':
      return [2 * region.radius, 2 * region.radius, region.length];
    case 'sphere':
      return [2 * region.radius, 2 * region.radius, 2 * region.radius];
  }
}

/**
 * Most points with pairwise distances of at least dMin in the region, by pigeonholes: cut the bounding
 * box into nx * ny * nz equal cells whose diagonal is shorter than dMin; no cell holds two points, so
 * N <= nx * ny * nz. Returns the smallest such product (searched up to 256 cuts per edge). Strong for
 * thin and small regions, where the density bound is weak.
 */
export function gridBound(region: RegionScaffold, dMin: number): number {
  if (dMin <= 0) return Infinity;
  const [a, b, c] = boundingBox(region);
  const limit = dMin * dMin * (1 - 1e-12);
  const cap = (edge: number) => Math.min(256, Math.ceil((edge * Math.sqrt(3)) / dMin) + 1);
  let best = Infinity;
  for (let nx = 1; nx <= cap(a); nx++) {
    for (let ny = 1; ny <= cap(b); ny++) {
      const room = limit - (a / nx) ** 2 - (b / ny) ** 2;
      if (room <= 0) continue;
      const nz = Math.max(1, Math.floor(c / Math.sqrt(room)) + 1);
      best = Math.min(best, nx * ny * nz);
    }
  }
  return best;
}
