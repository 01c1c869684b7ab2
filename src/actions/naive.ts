import type { DesignPoint, DesignSpace } from '../space/design-space.js';

/**
 * A naive design to beat: dyes on evenly spread anchors (or evenly along x in a free region), dipoles on the
 * cone axis (or along z), the first allowed dye of each site and the middle of each energy range.
 */
export function naiveDesign(ds: DesignSpace): DesignPoint {
  const N = ds.maxSites;
  const p: Record<string, unknown> = {};
  const A = ds.anchors?.length ?? 0;
  for (const v of ds.space.variables) {
    const m = /^(\w+?)_(\d+)$/.exec(v.name);
    if (!m) { if (v.name === 'count') p.count = N; continue; }
    const i = Number(m[2]);
    const spread = N > 1 ? i / (N - 1) : 0.5;
    switch (m[1]) {
      case 'anchor': p[v.name] = Math.round(spread * (A - 1)); break;
      case 'offset': p[v.name] = [0, 0, 0]; break;
      case 'pos': p[v.name] = [spread, 0.5, 0.5]; break;
      case 'dir': p[v.name] = [0, 0, 1]; break;
      case 'cos': p[v.name] = 1; break;
      case 'phi': p[v.name] = 0; break;
      case 'dye': p[v.name] = (v as unknown as { options: string[] }).options[0]; break;
      case 'energy': { const r = v as unknown as { lower: number; upper: number }; p[v.name] = (r.lower + r.upper) / 2; break; }
    }
  }
  return ds.decode(p);
}
