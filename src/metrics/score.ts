import type { MetricName } from './evaluate.js';

export type Sense = 'maximize' | 'minimize';

/** A weighted-sum score: sum of weight * (+-metric / scale), + for maximize; higher is better. */
export interface WeightedScore {
  kind: 'weighted_sum';
  terms: readonly { metric: MetricName; sense: Sense; weight: number; scale: number }[];
}
/** A Pareto set of up to four metrics. */
export interface ParetoScore {
  kind: 'pareto';
  metrics: readonly { metric: MetricName; sense: Sense }[];
}
export type ScoreRule = WeightedScore | ParetoScore;

export function scoreMetricNames(rule: ScoreRule): MetricName[] {
  return rule.kind === 'weighted_sum' ? rule.terms.map((t) => t.metric) : rule.metrics.map((m) => m.metric);
}

/** A metric as a finite number to maximize (infinite transfer times and NaN become the worst value). */
function signed(v: number | undefined, sense: Sense): number {
  if (v === undefined || Number.isNaN(v)) return -Infinity;
  const x = sense === 'maximize' ? v : -v;
  return Number.isFinite(x) ? x : x > 0 ? Number.MAX_VALUE : -Infinity;
}

/** Weighted-sum score (higher is better), -Infinity when a metric is missing. */
export function weightedScore(rule: WeightedScore, values: Partial<Record<MetricName, number>>): number {
  let s = 0;
  for (const t of rule.terms) s += (t.weight * signed(values[t.metric], t.sense)) / t.scale;
  return Number.isNaN(s) ? -Infinity : s;
}

/** Objective vector to minimize for multi-objective search (each entry: -metric for maximize). */
export function paretoVector(rule: ParetoScore, values: Partial<Record<MetricName, number>>): number[] {
  return rule.metrics.map((m) => -signed(values[m.metric], m.sense));
}
