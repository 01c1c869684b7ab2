import { InputError } from '../errors.js';
import { withDefaults } from '../options.js';
import { propagate, type PopulationTraces } from './dynamics.js';
import { excitons, type Excitons } from './excitons.js';
import type { LinearModel, Start } from './models/common.js';
import { forsterModel } from './models/forster.js';
import { hsrModel } from './models/hsr.js';
import { redfieldModel } from './models/redfield.js';
import { trappingObservables, type TransportResult } from './observables.js';
import type { ExcitonSystem } from './types.js';

export type ModelName = 'hsr' | 'redfield' | 'forster';

/** Options of a transport evaluation. Defaults in TRANSPORT_DEFAULTS. */
export interface TransportOptions {
  /** 'hsr', 'redfield' or 'forster' (CONVENTIONS.md). */
  model: ModelName;
  /** Trap rate k_trap, ps^-1, one value or one per trap. Default 1. */
  trapRate: number | readonly number[];
  /** hsr: pure dephasing rate gamma_phi, ps^-1. Default 10 (order of room-temperature dye dephasing: common practice). */
  dephasing: number;
  /** redfield, forster: bath temperature, K. Default 300. */
  temperature: number;
  /** redfield: Drude-Lorentz cutoff gamma_c, cm^-1. Default 100. */
  cutoff: number;
  /**
   * redfield: secular approximation threshold as a fraction of the smallest non-zero exciton spacing: tensor
   * elements coupling coherences whose Bohr frequencies differ by less are kept. Default 0.1 (QuTiP 4.7's rule).
   */
  secularFraction: number;
  /** Initial excitation. Default: uniform over the donor (non-trap) sites. */
  start: Start;
}

export const TRANSPORT_DEFAULTS: TransportOptions = {
  model: 'hsr',
  trapRate: 1,
  dephasing: 10,
  temperature: 300,
  cutoff: 100,
  secularFraction: 0.1,
  start: { kind: 'donors' },
};

type Builder = (sys: ExcitonSystem, o: TransportOptions, ex: () => Excitons) => LinearModel;

/** The transport models by name. */
export const MODELS: Readonly<Record<ModelName, { readonly summary: string; readonly finiteTemperature: boolean; readonly build: Builder }>> = {
  hsr: { summary: 'Haken-Strobl-Reineker pure dephasing (infinite temperature)', finiteTemperature: false, build: hsrModel },
  redfield: { summary: 'secular Bloch-Redfield theory, Drude-Lorentz site baths', finiteTemperature: true, build: redfieldModel },
  forster: { summary: 'incoherent Foerster hopping (classical baseline)', finiteTemperature: true, build: forsterModel },
};

/** Merge options over defaults and check the model name. */
export function transportOptions(given?: Partial<TransportOptions>): TransportOptions {
  const o = withDefaults('transport', TRANSPORT_DEFAULTS, given);
  if (!Object.hasOwn(MODELS, o.model)) {
    throw new InputError(`unknown transport model '${String(o.model)}' (available: ${Object.keys(MODELS).join(', ')})`);
  }
  return o;
}

/** Build the linear model (generator, initial state, readouts) of a system. */
export function buildModel(sys: ExcitonSystem, given?: Partial<TransportOptions>): LinearModel {
  const o = transportOptions(given);
  let ex: Excitons | undefined;
  const lazy = () => (ex ??= excitons(sys));
  return MODELS[o.model].build(sys, o, lazy);
}

/** Trapping efficiency, loss fraction and mean transfer time of a system under a model. */
export function evaluateTransport(sys: ExcitonSystem, given?: Partial<TransportOptions>): TransportResult {
  if (sys.traps.length === 0) throw new InputError('trapping efficiency needs at least one trap site');
  return trappingObservables(buildModel(sys, given));
}

/** Population traces at the given times (ps) by exact propagation. */
export function populationTraces(sys: ExcitonSystem, times: readonly number[], given?: Partial<TransportOptions>): PopulationTraces {
  return propagate(buildModel(sys, given), times);
}
