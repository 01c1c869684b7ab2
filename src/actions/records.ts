import type { DesignRecord } from '../output/record.js';
import type { ScoredDesign } from './optimize-core.js';

/** The design record (for files) of a scored design. */
export function toRecord(s: ScoredDesign, name: string, provenance: DesignRecord['provenance']): DesignRecord {
  const metrics: Record<string, number> = {};
  for (const [k, v] of Object.entries(s.metrics)) if (v !== undefined && Number.isFinite(v)) metrics[k] = v;
  metrics.spacing_margin_nm = s.feasibility.spacing;
  for (const [k, v] of [['step_margin_cm', s.feasibility.step], ['span_margin_cm', s.feasibility.span], ['trap_offset_margin_cm', s.feasibility.trapOffset]] as const) {
    if (Number.isFinite(v)) metrics[k] = v;
  }
  return {
    name,
    sites: s.design.sites,
    traps: s.design.traps,
    dyes: s.design.dyes,
    anchors: s.design.anchors?.map((a) => ({ index: a.index, helix: a.helix, step: a.step })),
    metrics,
    score: s.score !== undefined && Number.isFinite(s.score) ? s.score : undefined,
    provenance,
  };
}
