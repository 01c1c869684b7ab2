import type { RegionScaffold } from '../constraints-types.js';

/** Densest packing fraction of equal balls in space, pi/sqrt(18) = 0.7405 (Kepler's conjecture, proved by Hales 2005, Annals of Mathematics 162, 1065). */
export const KEPLER_DENSITY = Math.PI / Math.sqrt(18);

/**
 * Volume of a tile that fills space by translations and contains the region dilated by r:
 * a box grown by r on every side (box, slab); a regular hexagonal prism around the dilated cylinder
 * (hexagon of inradius R + r, area 2*sqrt(3)*(R + r)^2); the rhombic dodecahedron around the dilated
 * ball (the Voronoi cell of the face-centred cubic lattice, volume 4*sqrt(2)*a^3 for inradius a).
 */
export function tileVolume(region: RegionScaffold, r: number): number {
  switch (region.kind) {
    case 'box':
      return (region.size.x + 2 * r) * (region.size.y + 2 * r) * (region.size.z + 2 * r);
    case 'slab':
      return (region.size.x + 2 * r) * (region.size.y + 2 * r) * (region.thickness + 2 * r);
    case 'cylinder':
      return 2 * Math.sqrt(3) * (region.radius + r) ** 2 * (region.length + 2 * r);
    case 'sphere':
      return 4 * Math.SQRT2 * (region.radius + r) ** 3;
  }
}

/**
 * Most points with pairwise distances of at least dMin that the region can hold, by the packing density.
 * Balls of diameter dMin around the points are disjoint and lie in the region dilated by dMin/2, hence in
 * the tile; copies of the tile by its lattice translations give a periodic packing of density
 * N * (ball volume) / (tile volume), which cannot exceed pi/sqrt(18). So N <= pi/sqrt(18) * tile / ball.
 * (The plain "dilated volume times pi/sqrt(18)" is not a valid bound for small regions: one ball in a
 * region that is a single point already fills its dilation.)
 */
export function keplerBound(region: RegionScaffold, dMin: number): number {
  if (dMin <= 0) return Infinity;
  const r = dMin / 2;
  const ball = (4 / 3) * Math.PI * r ** 3;
  return Math.floor((KEPLER_DENSITY * tileVolume(region, r)) / ball + 1e-9);
}
