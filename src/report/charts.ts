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
  legend: { labelColor: '#333', titleColor: '#222', titleFontWeight: 'bold' },
  title: { anchor: 'start', fontSize: 14, color: '#1d1d1f' },
  view: { stroke: '#d5dae1' },
} as const;

function spec(body: Record<string, unknown>): TopLevelSpec {
  return { $schema: SCHEMA, width: 560, height: 260, config: CONFIG, ...body } as TopLevelSpec;
}

export interface ConvergenceData {
  /** Best objective so far after each batch. */
  convergence: readonly { evaluations: number; best: number | null }[];
  /** The objective of every scored candidate, by evaluation number (1-based). */
  candidates: readonly { evaluation: number; value: number }[];
}

/** Best objective (weighted score, higher is better) against the number of evaluations, over every candidate. */
export function convergenceSpec(d: ConvergenceData, title = 'Convergence of the search'): TopLevelSpec {
  const best = d.convergence.filter((c) => c.best !== null && Number.isFinite(c.best));
  return spec({
    title,
    layer: [
      {
        data: { values: d.candidates },
        mark: { type: 'circle', size: 14, opacity: 0.35, color: CHART_COLOURS.muted },
        encoding: { x: { field: 'evaluation', type: 'quantitative', title: 'evaluations' }, y: { field: 'value', type: 'quantitative', title: 'objective (weighted score)', scale: { zero: false } }, tooltip: [{ field: 'evaluation' }, { field: 'value', format: '.4f' }] },
      },
      {
        data: { values: best },
        mark: { type: 'line', interpolate: 'step-after', strokeWidth: 2.5, color: CHART_COLOURS.accent, point: { filled: true, size: 30, color: CHART_COLOURS.accent } },
        encoding: { x: { field: 'evaluations', type: 'quantitative' }, y: { field: 'best', type: 'quantitative' }, tooltip: [{ field: 'evaluations' }, { field: 'best', title: 'best so far', format: '.4f' }] },
      },
    ],
  });
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
export function robustnessSpec(d: RobustnessData, title = 'Robustness of the best design under static disorder'): TopLevelSpec {
  const marks = [{ value: d.nominal, what: 'without disorder' }, { value: d.p10, what: '10th percentile' }];
  const xs = [...d.efficiencies, d.nominal];
  const x = { field: 'efficiency', type: 'quantitative', title: 'trapping efficiency', bin: { maxbins: 24, extent: [Math.max(0, Math.min(...xs) - 0.01), Math.min(1, Math.max(...xs) + 0.01)] } };
  return spec({
    title,
    layer: [
      { data: { values: d.efficiencies.map((efficiency) => ({ efficiency })) }, mark: { type: 'bar', color: CHART_COLOURS.second, opacity: 0.85, binSpacing: 1 }, encoding: { x, y: { aggregate: 'count', type: 'quantitative', title: 'disorder samples' } } },
      {
        data: { values: marks },
        mark: { type: 'rule', strokeWidth: 2.5 },
        encoding: {
          x: { field: 'value', type: 'quantitative' },
          color: { field: 'what', type: 'nominal', title: null, scale: { domain: marks.map((m) => m.what), range: [CHART_COLOURS.accent, CHART_COLOURS.ink] }, legend: { orient: 'top-left' } },
          strokeDash: { field: 'what', type: 'nominal', scale: { domain: marks.map((m) => m.what), range: [[1, 0], [5, 3]] }, legend: null },
          tooltip: [{ field: 'what', title: 'line' }, { field: 'value', title: 'efficiency', format: '.4f' }],
        },
      },
    ],
  });
}

export interface FrontData {
  /** The first two objectives: metric names and senses. */
  axes: readonly [{ metric: string; sense: string }, { metric: string; sense: string }];
  candidates: readonly { a: number; b: number }[];
  ranked: readonly { rank: number; name: string; a: number; b: number }[];
}

/** The trade-off of a multi-objective run: every candidate and the ranked (non-dominated) designs. */
export function frontSpec(d: FrontData, title = 'Trade-off front of the first two objectives'): TopLevelSpec {
  const [ax, bx] = d.axes.map((m) => `${m.metric} (${m.sense === 'minimize' ? 'lower' : 'higher'} is better)`);
  const enc = { x: { field: 'a', type: 'quantitative', title: ax, scale: { zero: false } }, y: { field: 'b', type: 'quantitative', title: bx, scale: { zero: false } } };
  return spec({
    title,
    layer: [
      { data: { values: d.candidates }, mark: { type: 'circle', size: 14, opacity: 0.35, color: CHART_COLOURS.muted }, encoding: enc },
      {
        data: { values: d.ranked },
        mark: { type: 'point', filled: true, size: 70, color: CHART_COLOURS.accent, stroke: CHART_COLOURS.ink, strokeWidth: 0.8 },
        encoding: { ...enc, tooltip: [{ field: 'rank' }, { field: 'name' }, { field: 'a', title: d.axes[0].metric, format: '.4g' }, { field: 'b', title: d.axes[1].metric, format: '.4g' }] },
      },
    ],
  });
}

export interface DynamicsData {
  /** Rows of the traces: time (ps), population, series name and kind ('site', 'trap' or 'sink'). */
  rows: readonly { time: number; population: number; series: string; kind: 'site' | 'trap' | 'sink' }[];
  /** Series names in legend order. */
  series: readonly string[];
}

/** Site populations and the sink against time under one model. */
export function dynamicsSpec(d: DynamicsData, title: string): TopLevelSpec {
  const colours = d.series.map((s, i) => (s.startsWith('sink') ? '#111111' : SERIES_COLOURS[i % SERIES_COLOURS.length]));
  return spec({
    title,
    height: 240,
    data: { values: d.rows },
    mark: { type: 'line', strokeWidth: 2 },
    encoding: {
      x: { field: 'time', type: 'quantitative', title: 'time (ps)' },
      y: { field: 'population', type: 'quantitative', title: 'population', scale: { domain: [0, 1] } },
      color: { field: 'series', type: 'nominal', title: 'population of', scale: { domain: d.series, range: colours }, sort: d.series },
      strokeDash: { field: 'kind', type: 'nominal', scale: { domain: ['site', 'trap', 'sink'], range: [[1, 0], [6, 2], [2, 2]] }, legend: null },
      strokeWidth: { field: 'kind', type: 'nominal', scale: { domain: ['site', 'trap', 'sink'], range: [1.8, 2.6, 3] }, legend: null },
      tooltip: [{ field: 'series' }, { field: 'time', title: 'time (ps)', format: '.4g' }, { field: 'population', format: '.4f' }],
    },
  });
}
