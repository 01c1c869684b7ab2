import { InputError, ModelError } from '../errors.js';
import { buildSystem, type SystemOptions } from '../physics/hamiltonian.js';
import { evaluateTransport, MODELS, transportOptions, type TransportOptions } from '../physics/transport.js';
import type { ExcitonSystem, Site } from '../physics/types.js';
import { applyDisorder, type DisorderEnsemble } from './disorder.js';
import { mean, quantile } from './stats.js';
import { uphillEfficiency, uphillMaxStep } from './uphill.js';

/** The metrics of a candidate, in snake_case as they appear in files. */
export const METRIC_NAMES = [
  'efficiency', 'transfer_time', 'robust_mean', 'robust_p10', 'robust_share', 'uphill_efficiency', 'uphill_max_step', 'coherence_gain',
] as const;
export type MetricName = (typeof METRIC_NAMES)[number];

/** A candidate array: its dyes and which of them are traps (0-based). */
export interface Design {
  readonly sites: readonly Site[];
  readonly traps: readonly number[];
}

export interface MetricSettings {
  transport: Partial<TransportOptions>;
  /** How couplings are built (traps come from the design). */
  system: Partial<Omit<SystemOptions, 'traps'>>;
  /** Loss rate of every site, ps^-1; when absent each dye's lifetime sets its own. */
  lossRate?: number;
  /** Reorganization energy of every site's bath, cm^-1; when absent each dye's own. */
  reorganization?: number;
  /** The shared disorder draws (common random numbers); needed for the robust_* metrics. */
  disorder?: DisorderEnsemble;
  /** robust_share counts samples with efficiency at or above this. */
  shareThreshold: number;
  /** uphill_efficiency: trap this far above the donors' lowest exciton (cm^-1); uphill_max_step searches [0, limit]. */
  uphill: { step: number; threshold: number; limit: number };
  /** Temperature of the forster baseline of coherence_gain when the chosen model has none (hsr), K. */
  baselineTemperature: number;
}

export interface MetricValues {
  readonly values: Partial<Record<MetricName, number>>;
  /** Disorder samples that could not be scored (dyes pushed onto each other), counted, never NaN. */
  readonly skippedSamples: number;
  readonly warnings: readonly string[];
}

/** Build the excitonic system of a design under the settings. */
export function designSystem(d: Design, s: MetricSettings, sites: readonly Site[] = d.sites): ExcitonSystem {
  const sys = buildSystem(sites, { ...s.system, traps: d.traps });
  return {
    ...sys,
    lossRates: s.lossRate === undefined ? sys.lossRates : new Float64Array(sys.n).fill(s.lossRate),
    reorganization: s.reorganization === undefined ? sys.reorganization : new Float64Array(sys.n).fill(s.reorganization),
  };
}

/** The warning for disorder samples left out. */
export function skippedWarning(skipped: number, total: number): string {
  return `${skipped} of ${total} disorder samples put two dyes on top of each other and were left out`;
}

/** robust_mean, robust_p10 (type 7 quantile) and robust_share of the sample efficiencies; ModelError when none. */
export function robustStats(etas: readonly number[], shareThreshold: number): { robust_mean: number; robust_p10: number; robust_share: number } {
  if (etas.length === 0) throw new ModelError('no disorder sample could be scored: the jitter pushes dyes onto each other every time');
  return {
    robust_mean: mean(etas),
    robust_p10: quantile(etas, 0.1),
    robust_share: etas.filter((e) => e >= shareThreshold).length / etas.length,
  };
}

/** Efficiencies of the disorder samples [from, to) of the ensemble, and how many were left out. */
export interface EnsembleEfficiencies {
  etas: number[];
  skipped: number;
}

/**
 * Efficiency of a design in each disorder sample from `from` to `to` (default: all), in sample order. Samples
 * that push two dyes onto each other are left out and counted. Chunks computed apart (on worker threads) and
 * concatenated in order give the same list as one call.
 */
export function ensembleEfficiencies(d: Design, s: MetricSettings, t: TransportOptions = transportOptions(s.transport), from = 0, to?: number): EnsembleEfficiencies {
  if (!s.disorder) throw new InputError('robust metrics need a disorder ensemble');
  const end = Math.min(to ?? s.disorder.draws.length, s.disorder.draws.length);
  const etas: number[] = [];
  let skipped = 0;
  for (let k = from; k < end; k++) {
    try {
      etas.push(evaluateTransport(designSystem(d, s, applyDisorder(d.sites, s.disorder, k)), t).efficiency);
    } catch (e) {
      if (!(e instanceof InputError)) throw e;
      skipped++;
    }
  }
  return { etas, skipped };
}

/**
 * Compute the named metrics of one design; only what is asked is computed. `precomputed` supplies the disorder
 * efficiencies when they were computed elsewhere (for example in parallel).
 */
export function computeMetrics(d: Design, s: MetricSettings, wanted: readonly MetricName[], precomputed?: EnsembleEfficiencies): MetricValues {
  const t = transportOptions(s.transport);
  const values: Partial<Record<MetricName, number>> = {};
  const warnings: string[] = [];
  let skipped = 0;
  const want = new Set(wanted);
  const sys = designSystem(d, s);
  if (want.has('efficiency') || want.has('transfer_time') || want.has('coherence_gain')) {
    const r = evaluateTransport(sys, t);
    values.efficiency = r.efficiency;
    values.transfer_time = r.transferTime;
    if (want.has('coherence_gain')) {
      const base = evaluateTransport(sys, { ...t, model: 'forster', temperature: MODELS[t.model].finiteTemperature ? t.temperature : s.baselineTemperature });
      values.coherence_gain = r.efficiency - base.efficiency;
    }
  }
  if (want.has('robust_mean') || want.has('robust_p10') || want.has('robust_share')) {
    const ens = precomputed ?? ensembleEfficiencies(d, s, t);
    const etas = ens.etas;
    skipped = ens.skipped;
    if (skipped) warnings.push(skippedWarning(skipped, etas.length + skipped));
    Object.assign(values, robustStats(etas, s.shareThreshold));
  }
  if (want.has('uphill_efficiency') || want.has('uphill_max_step')) {
    if (!MODELS[t.model].finiteTemperature) {
      throw new InputError(`uphill metrics need a finite-temperature model (redfield or forster); ${t.model} treats uphill and downhill steps alike`);
    }
    if (want.has('uphill_efficiency')) values.uphill_efficiency = uphillEfficiency(sys, t, s.uphill.step);
    if (want.has('uphill_max_step')) values.uphill_max_step = uphillMaxStep(sys, t, s.uphill.threshold, s.uphill.limit);
  }
  return { values, skippedSamples: skipped, warnings };
}
