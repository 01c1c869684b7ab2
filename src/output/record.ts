/**
 * The design record of the output layer: a scored array of dyes with what a chemist needs to build it.
 * In memory, sites and traps are numbered from 0 (as everywhere in the code); files number sites from 1.
 */
import type { Design } from '../metrics/evaluate.js';

/** Which scaffold anchor carries a dye, numbered from 0 as the constraint set's scaffold numbers them. */
export interface SiteAnchor {
  /** Anchor index (on a helix lattice: helix * steps + step). */
  readonly index: number;
  /** Helix of a helix lattice. */
  readonly helix?: number;
  /** Step (base-pair position) along that helix. */
  readonly step?: number;
}

/** Where a record came from. */
export interface Provenance {
  readonly runId?: string;
  /** 1-based rank in its run. */
  readonly rank?: number;
  readonly seed?: number;
  readonly toolVersion?: string;
}

/** A design with names, optional anchors, metrics, score and provenance. */
export interface DesignRecord extends Design {
  readonly name: string;
  /** Dye name per site (same length as sites). */
  readonly dyes: readonly string[];
  /** Anchor per site, on anchor scaffolds (same length as sites when given). */
  readonly anchors?: readonly SiteAnchor[];
  /** Metric values by name (snake_case, as in METRIC_NAMES). */
  readonly metrics?: Readonly<Record<string, number>>;
  readonly score?: number;
  readonly provenance?: Provenance;
}

export type Role = 'donor' | 'trap';

/** The role of each site: 'trap' for the listed trap indices, 'donor' otherwise. */
export function siteRoles(d: Design): Role[] {
  const traps = new Set(d.traps);
  return d.sites.map((_, i) => (traps.has(i) ? 'trap' : 'donor'));
}
