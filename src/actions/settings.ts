import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEnsemble } from '../metrics/disorder.js';
import type { MetricSettings } from '../metrics/evaluate.js';
import { scoreMetricNames, type ScoreRule } from '../metrics/score.js';
import type { Start } from '../physics/models/common.js';
import type { TransportOptions } from '../physics/transport.js';

/** The transport options an objective recipe asks for. */
export function transportFrom(o: Objective): Partial<TransportOptions> {
  const m = o.model;
  const start: Start = o.excitation.kind === 'site' ? { kind: 'site', site: o.excitation.site }
    : o.excitation.kind === 'light' ? { kind: 'light', temperature: o.excitation.temperature } : { kind: 'donors' };
  switch (m.kind) {
    case 'hsr': return { model: 'hsr', dephasing: m.dephasing, trapRate: m.trap_rate, start };
    case 'redfield': return { model: 'redfield', temperature: m.temperature, cutoff: m.bath.cutoff, trapRate: m.trap_rate, start };
    case 'forster': return { model: 'forster', temperature: m.temperature, trapRate: m.trap_rate, start };
  }
}

/** Metric settings of an objective recipe for arrays of at most maxSites dyes (disorder draws made here, once). */
export function metricSettingsFrom(o: Objective, maxSites: number): MetricSettings {
  const needsDisorder = scoreMetricNames(scoreRuleFrom(o)).some((m) => m.startsWith('robust_'));
  return {
    transport: transportFrom(o),
    system: {
      couplingMethod: o.coupling.dipole === 'point' ? 'point-dipole' : 'auto',
      screening: { kind: 'constant', refractiveIndex: o.coupling.refractive_index },
    },
    lossRate: o.model.loss.kind === 'rate' ? o.model.loss.rate : undefined,
    reorganization: o.model.kind === 'redfield' ? o.model.bath.reorganization : undefined,
    disorder: needsDisorder
      ? makeEnsemble({ energySigma: o.disorder.energy_sigma, positionJitter: o.disorder.position_jitter, orientationJitter: o.disorder.orientation_jitter, samples: o.disorder.samples, seed: o.disorder.seed }, maxSites)
      : undefined,
    shareThreshold: o.disorder.share_threshold,
    uphill: { step: o.uphill.step, threshold: o.uphill.threshold, limit: o.uphill.limit },
    baselineTemperature: 295,
  };
}

/** The score rule of an objective recipe. */
export function scoreRuleFrom(o: Objective): ScoreRule {
  return o.score.kind === 'weighted_sum'
    ? { kind: 'weighted_sum', terms: o.score.terms }
    : { kind: 'pareto', metrics: o.score.metrics };
}

/** Largest number of dyes of a constraint set. */
export function maxSites(c: ConstraintSet): number {
  return c.dyes.count.max;
}
