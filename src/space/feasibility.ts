import type { ConstraintSet } from '../config/constraints-types.js';
import type { Site } from '../physics/types.js';
import type { Anchor } from './design-space.js';
import { distance } from './geometry.js';

/**
 * Feasibility margins of a design against its constraint set: positive means satisfied with that much room,
 * negative means violated by that much. Units: nm for spacing, cm^-1 for energies; Infinity where the
 * constraint set has no such limit.
 */
export interface Feasibility {
  /** Smallest centre-to-centre distance minus the minimum spacing, nm. */
  spacing: number;
  /** Number of anchors that carry more than one dye. */
  sharedAnchors: number;
  /** max_step minus the largest |E_i - E_{i+1}|, cm^-1. */
  step: number;
  /** max_span minus (highest - lowest energy), cm^-1. */
  span: number;
  /** Smallest room inside the trap-offset window over every trap-donor pair, cm^-1. */
  trapOffset: number;
}

export function feasibility(c: ConstraintSet, d: { sites: readonly Site[]; traps: readonly number[]; anchors?: readonly Anchor[] }): Feasibility {
  const { sites, traps } = d;
  let dmin = Infinity;
  for (let i = 0; i < sites.length; i++) for (let j = i + 1; j < sites.length; j++) dmin = Math.min(dmin, distance(sites[i].position, sites[j].position));
  let shared = 0;
  if (d.anchors) {
    const seen = new Set<number>();
    for (const a of d.anchors) { if (seen.has(a.index)) shared++; seen.add(a.index); }
  }
  const E = sites.map((s) => s.energy);
  const e = c.energetics;
  let step = Infinity;
  if (e.max_step !== undefined) {
    let worst = 0;
    for (let i = 0; i + 1 < E.length; i++) worst = Math.max(worst, Math.abs(E[i] - E[i + 1]));
    step = e.max_step - worst;
  }
  const span = e.max_span !== undefined ? e.max_span - (Math.max(...E) - Math.min(...E)) : Infinity;
  let trapOffset = Infinity;
  if (e.trap_offset) {
    const lo = e.trap_offset.min ?? -Infinity, hi = e.trap_offset.max ?? Infinity;
    for (const t of traps) for (let m = 0; m < E.length; m++) {
      if (traps.includes(m)) continue;
      const off = E[t] - E[m];
      trapOffset = Math.min(trapOffset, off - lo, hi - off);
    }
  }
  return { spacing: dmin - c.spacing.min, sharedAnchors: shared, step, span, trapOffset };
}
