import { InputError, NumericalError } from '../errors.js';
import { withDefaults } from '../options.js';
import { propagate, type PopulationTraces } from './dynamics.js';
import { excitons, type Excitons } from './excitons.js';
import { evaluateHsrStructured } from './fast/hsr-evaluate.js';
import { evaluateRedfieldStructured } from './fast/redfield-evaluate.js';
import { STRUCTURED_NOT_APPLICABLE, STRUCTURED_UNAVAILABLE } from './fast/structured-errors.js';
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
  /**
   * How efficiency and transfer time are solved. Default 'auto'.
   * - 'dense': LU of the assembled generator (O(N^6) time, O(N^4) memory for hsr and redfield).
   * - 'structured': the solvers of physics/fast/: hsr in O(N^4) time and O(N^3) memory (any rates), redfield
   *   in O(N^3) when the sink (loss + trap) is common to all but at most four sites and the loss is non-zero.
   *   A NumericalError when they do not apply (code 'structured-not-applicable') or their checks fail
   *   (code 'structured-unavailable': ill-conditioned eigenvectors, residual, eta + loss = 1).
   * - 'auto': structured where the model has it and it applies and passes its checks, otherwise dense; the
   *   result says which ran (TransportResult.solver) and why it fell back (fallbackReason). A fallback after a
   *   failed check is refused above MAX_DENSE_FALLBACK_SITES sites, where the dense solve would take minutes
   *   and gigabytes; a problem the structured solver does not apply to runs dense at any size.
   * forster is an N x N rate problem: its dense solve is already O(N^3) and it has no other.
   */
  solver: SolverChoice;
}

export type SolverChoice = 'auto' | 'dense' | 'structured';
const SOLVERS: readonly SolverChoice[] = ['auto', 'dense', 'structured'];

/** Largest array the 'auto' solver falls back to the dense solve for (a 1600 x 1600 generator, about 2 s). */
export const MAX_DENSE_FALLBACK_SITES = 40;

export const TRANSPORT_DEFAULTS: TransportOptions = {
  model: 'hsr',
  trapRate: 1,
  dephasing: 10,
  temperature: 300,
  cutoff: 100,
  secularFraction: 0.1,
  start: { kind: 'donors' },
  solver: 'auto',
};

type Builder = (sys: ExcitonSystem, o: TransportOptions, ex: () => Excitons) => LinearModel;
type Structured = (sys: ExcitonSystem, o: TransportOptions, ex: () => Excitons) => Omit<TransportResult, 'solver' | 'fallbackReason'>;

interface ModelEntry {
  readonly summary: string;
  readonly finiteTemperature: boolean;
  readonly build: Builder;
  /** The structured solver of efficiency and transfer time, where the model has one. */
  readonly structured?: Structured;
}

/** The transport models by name. */
export const MODELS: Readonly<Record<ModelName, ModelEntry>> = {
  hsr: { summary: 'Haken-Strobl-Reineker pure dephasing (infinite temperature)', finiteTemperature: false, build: hsrModel, structured: evaluateHsrStructured },
  redfield: { summary: 'secular Bloch-Redfield theory, Drude-Lorentz site baths', finiteTemperature: true, build: redfieldModel, structured: evaluateRedfieldStructured },
  forster: { summary: 'incoherent Foerster hopping (classical baseline)', finiteTemperature: true, build: forsterModel },
};

/** Merge options over defaults and check the model name. */
export function transportOptions(given?: Partial<TransportOptions>): TransportOptions {
  const o = withDefaults('transport', TRANSPORT_DEFAULTS, given);
  if (!Object.hasOwn(MODELS, o.model)) {
    throw new InputError(`unknown transport model '${String(o.model)}' (available: ${Object.keys(MODELS).join(', ')})`);
  }
  if (!SOLVERS.includes(o.solver)) throw new InputError(`unknown transport solver '${String(o.solver)}' (available: ${SOLVERS.join(', ')})`);
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
  const o = transportOptions(given);
  let ex: Excitons | undefined;
  const lazy = () => (ex ??= excitons(sys));
  const entry = MODELS[o.model];
  let fallbackReason: string | undefined;
  if (o.solver !== 'dense' && entry.structured) {
    try {
      const r = entry.structured(sys, o, lazy);
      return { efficiency: r.efficiency, lossFraction: r.lossFraction, transferTime: r.transferTime, balanceResidual: r.balanceResidual, solver: 'structured' };
    } catch (e) {
      if (!(e instanceof NumericalError && (e.code === STRUCTURED_UNAVAILABLE || e.code === STRUCTURED_NOT_APPLICABLE))) throw e;
      if (o.solver === 'structured') throw new NumericalError(`structured ${o.model} solver: ${e.message}`, e.code);
      fallbackReason = e.message;
      // a failed check on a large array is refused; an array without the structure runs dense as it always did
      if (e.code === STRUCTURED_UNAVAILABLE && sys.n > MAX_DENSE_FALLBACK_SITES) {
        throw new NumericalError(`the structured ${o.model} solver gave no answer for this ${sys.n}-site array (${fallbackReason}), and the dense fallback is limited to ${MAX_DENSE_FALLBACK_SITES} sites; pass solver 'dense' to force it`, 'ill-conditioned');
      }
    }
  } else if (o.solver === 'structured') {
    throw new InputError(`the ${o.model} model has no structured solver (hsr and redfield have one); use solver 'auto' or 'dense'`);
  }
  const r = trappingObservables(entry.build(sys, o, lazy));
  return fallbackReason === undefined ? r : { ...r, fallbackReason };
}

/** Population traces at the given times (ps) by exact propagation. */
export function populationTraces(sys: ExcitonSystem, times: readonly number[], given?: Partial<TransportOptions>): PopulationTraces {
  return propagate(buildModel(sys, given), times);
}
