/**
 * Population dynamics of one design under one transport model: the model's parameters (each taken from
 * the run's objective where it sets them, else the stated default) and the site and sink populations on
 * a uniform time grid reaching about three mean transfer times.
 */
import { LumenfoldError } from '../errors.js';
import { designSystem, type Design, type MetricSettings } from '../metrics/evaluate.js';
import type { PopulationTraces } from '../physics/dynamics.js';
import { evaluateTransport, MODELS, populationTraces, transportOptions, type ModelName, type TransportOptions } from '../physics/transport.js';
import { label } from './svg.js';
import { niceStep } from './ticks.js';

export interface ModelParameter {
  readonly name: string;
  readonly value: string;
  /** Where the value comes from: the run's objective, the model's default, or each dye's own data. */
  readonly source: 'objective' | 'default' | 'dyes';
}

export interface ModelDynamics {
  readonly model: ModelName;
  readonly summary: string;
  readonly parameters: readonly ModelParameter[];
  readonly efficiency?: number;
  readonly transferTime?: number;
  readonly traces?: PopulationTraces;
  /** Why there are no traces (the model has no answer for this design, or the array is too large). */
  readonly error?: string;
}

/** Points of the time grid. */
export const DYNAMICS_POINTS = 161;

/** The parameters a model uses, with their values and sources. */
export function modelParameters(model: ModelName, settings: MetricSettings, design: Design): ModelParameter[] {
  const given = settings.transport;
  const o = transportOptions({ ...given, model });
  const from = (k: keyof TransportOptions): ModelParameter['source'] => (given[k] !== undefined ? 'objective' : 'default');
  const trap = Array.isArray(o.trapRate) ? o.trapRate.join(', ') : String(o.trapRate);
  const range = (xs: readonly (number | undefined)[], unit: string) => {
    const v = xs.filter((x): x is number => x !== undefined);
    return v.length ? `${label(Math.min(...v))} to ${label(Math.max(...v))} ${unit} (per dye)` : 'system default';
  };
  const out: ModelParameter[] = [{ name: 'trap rate k_trap', value: `${trap} ps^-1`, source: from('trapRate') }];
  if (model === 'hsr') out.push({ name: 'pure dephasing rate', value: `${o.dephasing} ps^-1`, source: from('dephasing') });
  if (model !== 'hsr') out.push({ name: 'temperature', value: `${o.temperature} K`, source: from('temperature') });
  if (model === 'redfield') {
    out.push({ name: 'bath cutoff (Drude-Lorentz)', value: `${o.cutoff} cm^-1`, source: from('cutoff') });
    out.push({ name: 'secular threshold', value: `${o.secularFraction} of the smallest exciton spacing`, source: from('secularFraction') });
  }
  if (model !== 'hsr') {
    out.push(settings.reorganization !== undefined
      ? { name: 'reorganization energy', value: `${settings.reorganization} cm^-1 (every site)`, source: 'objective' }
      : { name: 'reorganization energy', value: range(design.sites.map((s) => s.reorganization), 'cm^-1'), source: 'dyes' });
  }
  out.push(settings.lossRate !== undefined
    ? { name: 'loss rate', value: `${settings.lossRate} ps^-1 (every site)`, source: 'objective' }
    : { name: 'excited-state lifetime', value: range(design.sites.map((s) => s.lifetime), 'ps'), source: 'dyes' });
  const s = o.start;
  const start = s.kind === 'site' ? `site ${s.site + 1}` : s.kind === 'light' ? `blackbody light at ${s.temperature ?? 'the default'} K` : s.kind === 'exciton' ? `exciton ${s.state + 1}` : 'uniform over the donors';
  out.push({ name: 'initial excitation', value: start, source: from('start') });
  return out;
}

/** Efficiency, mean transfer time and population traces of a design under a model. */
export function modelDynamics(design: Design, settings: MetricSettings, model: ModelName, points = DYNAMICS_POINTS): ModelDynamics {
  const base = { model, summary: MODELS[model].summary, parameters: modelParameters(model, settings, design) };
  const options = { ...settings.transport, model };
  try {
    const sys = designSystem(design, settings);
    const r = evaluateTransport(sys, options);
    const reach = Number.isFinite(r.transferTime) && r.transferTime > 0 ? 3 * r.transferTime : 1000;
    const step = niceStep(reach, 10);
    const tEnd = Math.min(1e5, Math.max(1, Math.ceil(reach / step) * step));
    const times = Array.from({ length: points }, (_, k) => (tEnd * k) / (points - 1));
    return { ...base, efficiency: r.efficiency, transferTime: r.transferTime, traces: populationTraces(sys, times, options) };
  } catch (e) {
    if (!(e instanceof LumenfoldError)) throw e;
    return { ...base, error: e.message };
  }
}
