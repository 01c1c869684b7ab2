import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { InputError, LumenfoldError } from '../errors.js';
import { computeMetrics, ensembleEfficiencies, robustStats, type Design, type EnsembleEfficiencies, type MetricName } from '../metrics/evaluate.js';
import { paretoVector, scoreMetricNames, weightedScore } from '../metrics/score.js';
import { transportOptions } from '../physics/transport.js';
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

/** The metrics of a point that do not need the disorder ensemble, or the model failure. */
export interface NominalPart { values?: Partial<Record<MetricName, number>>; error?: string }
/** Efficiencies of a contiguous chunk of a point's disorder samples, or the model failure. */
export interface EnsemblePart { ens?: EnsembleEfficiencies; error?: string }

/**
 * The search objective of a job split in parts that can run on different threads: the nominal metrics of a
 * point, chunks of its disorder ensemble, and their combination into a score to minimize (minus the weighted
 * sum, or the Pareto vector). Model failures on one candidate give NaN (treated as worst by the search) and the
 * message; configuration errors are thrown. Every thread uses these same parts, so results do not depend on
 * how the work is shared out.
 */
export function makeEvaluatorParts(c: ConstraintSet, o: Objective) {
  const ds = designSpace(c);
  const settings = metricSettingsFrom(o, ds.maxSites);
  const rule = scoreRuleFrom(o);
  const wanted = scoreMetricNames(rule);
  const robust = wanted.some((m) => m.startsWith('robust_'));
  const plain = wanted.filter((m) => !m.startsWith('robust_'));
  const t = transportOptions(settings.transport);
  const samples = robust && settings.disorder ? settings.disorder.draws.length : 0;
  const guard = <T>(f: () => T): T | { error: string } => {
    try {
      return f();
    } catch (e) {
      if (!(e instanceof LumenfoldError) || (e instanceof InputError && /finite-temperature/.test(e.message))) throw e;
      return { error: e.message };
    }
  };
  /** The design of a point, or the failure to decode it. */
  const design = (p: Record<string, unknown>): Design | { error: string } => guard(() => {
    const d = ds.decode(p);
    return { sites: d.sites, traps: d.traps };
  });
  const nominalOf = (d: Design | { error: string }): NominalPart => ('error' in d ? d : guard(() => ({ values: computeMetrics(d, settings, plain).values })));
  const ensembleOf = (d: Design | { error: string }, from: number, to: number): EnsemblePart => ('error' in d ? d : guard(() => ({ ens: ensembleEfficiencies(d, settings, t, from, to) })));
  const fail = (error: string): Evaluation => ({ score: rule.kind === 'weighted_sum' ? NaN : rule.metrics.map(() => NaN), metrics: {}, error });
  const combine = (n: NominalPart, chunks: readonly EnsemblePart[]): Evaluation => {
    if (n.error !== undefined) return fail(n.error);
    const values = { ...n.values };
    let skipped = 0;
    if (robust) {
      const bad = chunks.find((ch) => ch.error !== undefined);
      if (bad) return fail(bad.error!);
      const etas = chunks.flatMap((ch) => ch.ens!.etas);
      skipped = chunks.reduce((k, ch) => k + ch.ens!.skipped, 0);
      const stats = guard(() => robustStats(etas, settings.shareThreshold));
      if ('error' in stats) return fail(stats.error);
      Object.assign(values, stats);
    }
    const score = rule.kind === 'weighted_sum' ? -weightedScore(rule, values) : paretoVector(rule, values);
    return { score, metrics: values, ...(skipped ? { skippedSamples: skipped } : {}) };
  };
  return { design, nominalOf, ensembleOf, combine, robust, samples };
}

/** The whole evaluation of one point on this thread. */
export function makeEvaluator(c: ConstraintSet, o: Objective): (p: Record<string, unknown>) => Evaluation {
  const parts = makeEvaluatorParts(c, o);
  return (p) => {
    // decoded once for the nominal metrics and the ensemble
    const d = parts.design(p);
    const n = parts.nominalOf(d);
    return parts.combine(n, parts.robust && n.error === undefined ? [parts.ensembleOf(d, 0, parts.samples)] : []);
  };
}
