/** Shaping run data into the rows the charts plot (no numerics beyond picking fields). */
import type { PopulationTraces } from '../physics/dynamics.js';
import type { DesignRecord } from '../output/record.js';
import type { DynamicsData, FrontData } from './charts.js';

/** One line of history.jsonl: the candidate's index, its score (a number, a vector for Pareto runs, or null) and metrics. */
export interface HistoryRow {
  readonly i: number;
  readonly score: number | readonly number[] | null;
  readonly [metric: string]: unknown;
}

/** Front data of a multi-objective run from the first two Pareto metrics of every candidate and of the ranked designs. */
export function frontData(axes: FrontData['axes'], history: readonly HistoryRow[], ranked: readonly DesignRecord[]): FrontData {
  const [a, b] = [axes[0].metric, axes[1].metric];
  const finite = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);
  return {
    axes,
    candidates: history.filter((h) => finite(h[a]) && finite(h[b])).map((h) => ({ a: h[a] as number, b: h[b] as number })),
    ranked: ranked
      .map((r, k) => ({ rank: k + 1, name: r.name, a: r.metrics?.[a], b: r.metrics?.[b] }))
      .filter((r): r is { rank: number; name: string; a: number; b: number } => finite(r.a) && finite(r.b)),
  };
}

/** Arrays with more dyes than this show the donors summed into one trace. */
export const MAX_SITE_TRACES = 12;

/** Rows for the population chart: every site (or the donors summed, for large arrays), each trap, and the sink. */
export function dynamicsData(traces: PopulationTraces, record: DesignRecord): DynamicsData {
  const traps = new Set(record.traps);
  const n = record.sites.length;
  const perSite = n <= MAX_SITE_TRACES;
  const name = (m: number) => `${traps.has(m) ? 'trap' : 'site'} ${m + 1}${record.dyes[m] ? ` (${record.dyes[m]})` : ''}`;
  const series: string[] = [];
  const rows: DynamicsData['rows'][number][] = [];
  const push = (s: string, kind: 'site' | 'trap' | 'sink', values: readonly number[]) => {
    series.push(s);
    values.forEach((population, t) => rows.push({ time: traces.times[t], population, series: s, kind }));
  };
  for (let m = 0; m < n; m++) {
    if (perSite || traps.has(m)) push(name(m), traps.has(m) ? 'trap' : 'site', traces.sites.map((p) => p[m]));
  }
  if (!perSite) push(`donors (${n - traps.size} sites, summed)`, 'site', traces.sites.map((p) => p.reduce((s, x, m) => s + (traps.has(m) ? 0 : x), 0)));
  push('sink (trapped)', 'sink', traces.sink);
  return { rows, series };
}
