import type { AnchorScaffold, Vector3 } from './constraints-types.js';

/** Unit vectors of an anchor's local frame on a helical lattice. */
export interface AnchorFrame {
  /** Along the helix axis (+z). */
  axial: Vector3;
  /** From the axis out to the anchor. */
  radial: Vector3;
  /** axial x radial: along the strand, perpendicular to the axis. */
  tangent: Vector3;
}

/** One anchor point (nm), numbered from 0 as the constraint-set format defines. */
export interface AnchorPoint {
  index: number;
  position: Vector3;
  /** Helical lattices only. */
  helix?: number;
  step?: number;
  frame?: AnchorFrame;
}

const DEG = Math.PI / 180;

/**
 * The anchor points of an anchor scaffold. For a helical lattice (axes along z, side by side along x,
 * centred at the origin): step k of helix h sits at angle phase + h*helix_phase + k*twist, at radius
 * from its axis and at height (k - (steps-1)/2)*rise; its index is h*steps + k.
 */
export function scaffoldAnchors(scaffold: AnchorScaffold): AnchorPoint[] {
  if (scaffold.kind === 'anchors') return scaffold.anchors.map((p, index) => ({ index, position: { ...p } }));
  const out: AnchorPoint[] = [];
  for (let h = 0; h < scaffold.helices; h++) {
    const axisX = (h - (scaffold.helices - 1) / 2) * scaffold.spacing;
    for (let k = 0; k < scaffold.steps; k++) {
      const angle = (scaffold.phase + h * scaffold.helix_phase + k * scaffold.twist) * DEG;
      const c = Math.cos(angle);
      const s = Math.sin(angle);
      out.push({
        index: h * scaffold.steps + k,
        position: { x: axisX + scaffold.radius * c, y: scaffold.radius * s, z: (k - (scaffold.steps - 1) / 2) * scaffold.rise },
        helix: h,
        step: k,
        frame: { axial: { x: 0, y: 0, z: 1 }, radial: { x: c, y: s, z: 0 }, tangent: { x: -s, y: c, z: 0 } },
      });
    }
  }
  return out;
}
