import { degToRad } from '../physics/constants.js';
import type { Vec3 } from '../physics/types.js';

/** One anchor point of a scaffold with its local frame (unit vectors). */
export interface Anchor {
  readonly index: number;
  readonly position: Vec3;
  readonly helix?: number;
  readonly step?: number;
  /** Local frame on a helical lattice: along the axis, out from the axis, and axial x radial. */
  readonly frame?: { readonly axial: Vec3; readonly radial: Vec3; readonly tangent: Vec3 };
}

export interface HelixLatticeGeometry {
  rise: number;
  twist: number;
  radius: number;
  steps: number;
  helices: number;
  spacing: number;
  phase: number;
  helix_phase: number;
}

/**
 * Anchors of parallel helices with axes along z, side by side along x and centred at the origin: step k of
 * helix h at angle phase + h*helix_phase + k*twist (degrees), height (k - (steps-1)/2)*rise, index h*steps + k
 * (the constraint-set format's definition).
 */
export function helixAnchors(g: HelixLatticeGeometry): Anchor[] {
  const out: Anchor[] = [];
  for (let h = 0; h < g.helices; h++) {
    const x0 = (h - (g.helices - 1) / 2) * g.spacing;
    for (let k = 0; k < g.steps; k++) {
      const a = degToRad(g.phase + h * g.helix_phase + k * g.twist);
      const c = Math.cos(a), s = Math.sin(a);
      out.push({
        index: h * g.steps + k,
        position: [x0 + g.radius * c, g.radius * s, (k - (g.steps - 1) / 2) * g.rise],
        helix: h,
        step: k,
        frame: { axial: [0, 0, 1], radial: [c, s, 0], tangent: [-s, c, 0] },
      });
    }
  }
  return out;
}

/** Anchors from an explicit list of points. */
export function listAnchors(points: readonly { x: number; y: number; z: number }[]): Anchor[] {
  return points.map((p, i) => ({ index: i, position: [p.x, p.y, p.z] }));
}
