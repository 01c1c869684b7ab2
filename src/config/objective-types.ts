/**
 * Typed view of a lumenfold.objective/1 document after loading, defaults filled in.
 * Units: energies cm^-1, distances nm, time ps, rates ps^-1, temperature K, angles degrees.
 */

export const METRICS = [
  'efficiency',
  'transfer_time',
  'robust_mean',
  'robust_p10',
  'robust_share',
  'uphill_efficiency',
  'uphill_max_step',
  'coherence_gain',
] as const;
export type MetricName = (typeof METRICS)[number];

/** Metrics that score transfer against an energy step; they need a model with a finite temperature. */
export const UPHILL_METRICS: readonly MetricName[] = ['uphill_efficiency', 'uphill_max_step'];
/** Metrics computed over the disorder samples. */
export const ROBUST_METRICS: readonly MetricName[] = ['robust_mean', 'robust_p10', 'robust_share'];

export type Sense = 'maximize' | 'minimize';

export interface WeightedTerm {
  metric: MetricName;
  sense: Sense;
  weight: number;
  /** The metric is divided by this, in its own unit, before weighting. */
  scale: number;
}

export type Score =
  | { kind: 'weighted_sum'; terms: WeightedTerm[] }
  | { kind: 'pareto'; metrics: { metric: MetricName; sense: Sense }[] };

export type Loss = { kind: 'lifetimes' } | { kind: 'rate'; rate: number };

export interface HsrModel {
  kind: 'hsr';
  dephasing: number;
  trap_rate: number;
  loss: Loss;
}
export interface RedfieldModel {
  kind: 'redfield';
  temperature: number;
  bath: { reorganization: number; cutoff: number };
  trap_rate: number;
  loss: Loss;
}
export interface ForsterModel {
  kind: 'forster';
  temperature: number;
  trap_rate: number;
  loss: Loss;
}
export type TransportModel = HsrModel | RedfieldModel | ForsterModel;

export type Excitation = { kind: 'site'; site: number } | { kind: 'donors' } | { kind: 'light'; temperature: number };

export interface Disorder {
  energy_sigma: number;
  position_jitter: number;
  orientation_jitter: number;
  samples: number;
  seed: number;
  share_threshold: number;
}

export interface Objective {
  format: 'lumenfold.objective/1';
  $schema?: string;
  name?: string;
  description?: string;
  score: Score;
  model: TransportModel;
  coupling: { dipole: 'extended' | 'point'; refractive_index: number };
  excitation: Excitation;
  disorder: Disorder;
  uphill: { step: number; threshold: number; limit: number };
  optimizer?: { name: string; budget: number; batch: number; seed: number };
}

/** Every metric the score uses, in order of appearance. */
export function scoreMetrics(score: Score): MetricName[] {
  return score.kind === 'weighted_sum' ? score.terms.map((t) => t.metric) : score.metrics.map((m) => m.metric);
}
