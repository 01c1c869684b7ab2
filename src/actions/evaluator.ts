import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { InputError, LumenfoldError } from '../errors.js';
import { computeMetrics, type MetricName } from '../metrics/evaluate.js';
import { paretoVector, scoreMetricNames, weightedScore } from '../metrics/score.js';
import { designSpace } from '../space/design-space.js';
import { metricSettingsFrom, scoreRuleFrom } from './settings.js';

/** What one evaluation returns: the minimized score (NaN on a model failure) and the metrics. */
export interface Evaluation {
  score: number | number[];
  metrics: Partial<Record<MetricName, number>>;
  /** Disorder samples left out (dyes pushed onto each other). */
  skippedSamples?: number;
  error?: string;
}

/**
 * The search objective of a job: a decoded point of its design space to a score to minimize (minus the
 * weighted sum, or the Pareto vector). Model failures on one candidate give NaN (treated as worst by the
 * search) and the message; configuration errors are thrown.
 */
export function makeEvaluator(c: ConstraintSet, o: Objective): (p: Record<string, unknown>) => Evaluation {
  const ds = designSpace(c);
  const settings = metricSettingsFrom(o, ds.maxSites);
  const rule = scoreRuleFrom(o);
  const metrics = scoreMetricNames(rule);
  return (p) => {
    const d = ds.decode(p);
    try {
      const m = computeMetrics({ sites: d.sites, traps: d.traps }, settings, metrics);
      const score = rule.kind === 'weighted_sum' ? -weightedScore(rule, m.values) : paretoVector(rule, m.values);
      return { score, metrics: m.values, ...(m.skippedSamples ? { skippedSamples: m.skippedSamples } : {}) };
    } catch (e) {
      if (!(e instanceof LumenfoldError) || (e instanceof InputError && /finite-temperature/.test(e.message))) throw e;
      return { score: rule.kind === 'weighted_sum' ? NaN : rule.metrics.map(() => NaN), metrics: {}, error: e.message };
    }
  };
}
