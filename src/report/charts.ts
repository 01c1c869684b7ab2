/**
 * Vega-Lite specifications of the run charts: convergence, robustness histogram, trade-off front and
 * population dynamics. Pure data in, JSON specs out; rendered by vega-embed in the report, or to SVG in
 * Node by chart-svg.ts.
 */
import type { TopLevelSpec } from 'vega-lite';

const SCHEMA = 'https://vega.github.io/schema/vega-lite/v6.json';

/** Accent colours of our charts. */
export const CHART_COLOURS = { accent: '#c2412d', muted: '#9aa5b1', ink: '#1f2a44', second: '#2c66b8' } as const;

/** Categorical colours for the site traces (our own order). */
export const SERIES_COLOURS = ['#2c66b8', '#e0702a', '#3f9a5c', '#a11d33', '#7b4fa8', '#c99a1e', '#2a9d9f', '#d0558f', '#6b7a2e', '#8c5a3c', '#4c6ef5', '#e8590c'];

const CONFIG = {
  font: 'Helvetica, Arial, sans-serif',
  axis: { labelColor: '#333', titleColor: '#222', gridColor: '#e6e9ee', domainColor: '#555', tickColor: '#555', titleFontWeight: 'normal' },
  legend: { labelColor: '#333', titleColor: '#222', titleFontWeight: 'bold', labelLimit: 260 },
  title: { anchor: 'start', fontSize: 14, color: '#1d1d1f' },
  view: { stroke: '#d5dae1' },
} as const;

/** Layout of a chart: a title (none by default: the report heads each chart itself) and a width in px, or 'container' to fill its box. */
export interface ChartLayout {
  title?: string;
  width?: number | 'container';
}

function spec(body: Record<string, unknown>, layout: ChartLayout): TopLevelSpec {
  const width = layout.width ?? 560;
  return {
    $schema: SCHEMA, width, height: 260, config: CONFIG, ...(layout.title ? { title: layout.title } : {}),
    ...(width === 'container' ? { autosize: { type: 'fit', contains: 'padding' } } : {}), ...body,
  } as TopLevelSpec;
}

export interface ConvergenceData {
  /** Best objective so far after each batch that improved it (null before any feasible candidate). */
  convergence: readonly { evaluations: number; best: number | null }[];
  /** Evaluations of the whole run (the curve is carried flat to here). */
  evaluations: number;
}

/** Best objective so far (weighted score, higher is better) against the number of evaluations. */
export function convergenceSpec(d: ConvergenceData, layout: ChartLayout = {}): TopLevelSpec {
  const best = d.convergence.filter((c): c is { evaluations: number; best: number } => c.best !== null && Number.isFinite(c.best));
  const last = best[best.length - 1];
  const points = best.map((c) => ({ ...c, improved: true }));
  if (last && d.evaluations > last.evaluations) points.push({ evaluations: d.evaluations, best: last.best, improved: false });
  return spec({
    data: { values: points },
    layer: [
      { mark: { type: 'line', interpolate: 'step-after', strokeWidth: 2.5, color: CHART_COLOURS.accent } },
      { transform: [{ filter: 'datum.improved' }], mark: { type: 'point', filled: true, size: 40, color: CHART_COLOURS.accent }, encoding: { tooltip: [{ field: 'evaluations' }, { field: 'best', title: 'best so far', format: '.5f' }] } },
    ],
    encoding: {
      x: { field: 'evaluations', type: 'quantitative', title: 'evaluations', scale: { domain: [0, Math.max(d.evaluations, last?.evaluations ?? 1)] } },
      y: { field: 'best', type: 'quantitative', title: 'best objective so far (weighted score)', scale: { zero: false } },
    },
  }, layout);
}

export interface RobustnessData {
  /** Trapping efficiency of each disorder sample. */
  efficiencies: readonly number[];
  /** Efficiency of the design without disorder. */
  nominal: number;
  /** 10th percentile of the sample efficiencies. */
  p10: number;
}

/** Histogram of the efficiencies of the best design's disorder samples, with the nominal value and the 10th percentile. */
export function robustnessSpec(d: RobustnessData, layout: ChartLayout = {}): TopLevelSpec {
  const marks = [{ value: d.nominal, what: 'without disorder' }, { value: d.p10, what: '10th percentile' }];
  const xs = [...d.efficiencies, d.nominal];
  const x = { field: 'efficiency', type: 'quantitative', title: 'trapping efficiency', bin: { maxbins: 24, extent: [Math.max(0, Math.min(...xs) - 0.01), Math.min(1, Math.max(...xs) + 0.01)] } };
  return spec({
    layer: [
      { data: { values: d.efficiencies.map((efficiency) => ({ efficiency })) }, mark: { type: 'bar', color: CHART_COLOURS.second, opacity: 0.85, binSpacing: 1 }, encoding: { x, y: { aggregate: 'count', type: 'quantitative', title: 'disorder samples' } } },
      {
        data: { values: marks },
        mark: { type: 'rule', strokeWidth: 2.5 },
        encoding: {
          x: { field: 'value', type: 'quantitative' },
          color: { field: 'what', type: 'nominal', title: null, scale: { domain: marks.map((m) => m.what), range: [CHART_COLOURS.accent, CHART_COLOURS.ink] }, legend: { orient: 'top-left' } },
          tooltip: [{ field: 'what', title: 'line' }, { field: 'value', title: 'efficiency', format: '.4f' }],
        },
      },
    ],
  }, layout);
}

export interface FrontData {
  /** The first two objectives: metric names and senses. */
  axes: readonly [{ metric: string; sense: string }, { metric: string; sense: string }];
  candidates: readonly { a: number; b: number }[];
  ranked: readonly { rank: number; name: string; a: number; b: number }[];
}

/** The trade-off of a multi-objective run: every candidate and the ranked (non-dominated) designs. */
export function frontSpec(d: FrontData, layout: ChartLayout = {}): TopLevelSpec {
  const [ax, bx] = d.axes.map((m) => `${m.metric} (${m.sense === 'minimize' ? 'lower' : 'higher'} is better)`);
  const enc = { x: { field: 'a', type: 'quantitative', title: ax, scale: { zero: false } }, y: { field: 'b', type: 'quantitative', title: bx, scale: { zero: false } } };
  return spec({
    layer: [
      { data: { values: d.candidates }, mark: { type: 'circle', size: 14, opacity: 0.35, color: CHART_COLOURS.muted }, encoding: enc },
      {
        data: { values: d.ranked },
        mark: { type: 'point', filled: true, size: 70, color: CHART_COLOURS.accent, stroke: CHART_COLOURS.ink, strokeWidth: 0.8 },
        encoding: { ...enc, tooltip: [{ field: 'rank' }, { field: 'name' }, { field: 'a', title: d.axes[0].metric, format: '.4g' }, { field: 'b', title: d.axes[1].metric, format: '.4g' }] },
      },
    ],
  }, layout);
}

export interface DynamicsData {
  /** Rows of the traces: time (ps), population, series name and kind ('site', 'trap' or 'sink'). */
  rows: readonly { time: number; population: number; series: string; kind: 'site' | 'trap' | 'sink' }[];
  /** Series names in legend order. */
  series: readonly string[];
}

/** Site populations and the sink against time under one model. */
export function dynamicsSpec(d: DynamicsData, layout: ChartLayout = {}): TopLevelSpec {
  const colours = d.series.map((s, i) => (s.startsWith('sink') ? '#111111' : SERIES_COLOURS[i % SERIES_COLOURS.length]));
  return spec({
    height: 240,
    data: { values: d.rows },
    mark: { type: 'line', strokeWidth: 2 },
    encoding: {
      x: { field: 'time', type: 'quantitative', title: 'time (ps)' },
      y: { field: 'population', type: 'quantitative', title: 'population', scale: { domain: [0, 1] } },
      color: { field: 'series', type: 'nominal', title: 'population of', scale: { domain: d.series, range: colours }, sort: d.series },
      strokeDash: { field: 'kind', type: 'nominal', scale: { domain: ['site', 'trap', 'sink'], range: [[1, 0], [6, 2], [2, 2]] }, legend: null },
      tooltip: [{ field: 'series' }, { field: 'time', title: 'time (ps)', format: '.4g' }, { field: 'population', format: '.4f' }],
    },
  }, layout);
}
