import type { RegionScaffold, Vector3 } from '../constraints-types.js';
import { num } from './vector.js';

const TOL = 1e-9;

/** Is a point inside the region (boundary included)? Every region is centred at the origin. */
export function insideRegion(region: RegionScaffold, p: Vector3): boolean {
  switch (region.kind) {
    case 'box':
      return Math.abs(p.x) <= region.size.x / 2 + TOL && Math.abs(p.y) <= region.size.y / 2 + TOL && Math.abs(p.z) <= region.size.z / 2 + TOL;
    case 'slab':
      return Math.abs(p.x) <= region.size.x / 2 + TOL && Math.abs(p.y) <= region.size.y / 2 + TOL && Math.abs(p.z) <= region.thickness / 2 + TOL;
    case 'cylinder':
      return Math.hypot(p.x, p.y) <= region.radius + TOL && Math.abs(p.z) <= region.length / 2 + TOL;
    case 'sphere':
      return Math.hypot(p.x, p.y, p.z) <= region.radius + TOL;
  }
}

/** The region in words, e.g. "a box of 4 x 4 x 2 nm". */
export function describeRegion(region: RegionScaffold): string {
  switch (region.kind) {
    case 'box':
      return `a box of ${num(region.size.x)} x ${num(region.size.y)} x ${num(region.size.z)} nm`;
    case 'slab':
      return `a slab of ${num(region.size.x)} x ${num(region.size.y)} nm, ${num(region.thickness)} nm thick`;
    case 'cylinder':
      return `a cylinder of radius ${num(region.radius)} nm and length ${num(region.length)} nm`;
    case 'sphere':
      return `a sphere of radius ${num(region.radius)} nm`;
  }
}

/** Largest distance between two points of the region, nm. */
export function regionDiameter(region: RegionScaffold): number {
  switch (region.kind) {
    case 'box':
      return Math.hypot(region.size.x, region.size.y, region.size.z);
    case 'slab':
      return Math.hypot(region.size.x, region.size.y, region.thickness);
    case 'cylinder':
      return Math.hypot(2 * region.radius, region.length);
    case 'sphere':
      return 2 * region.radius;
  }
}
