import { requireNumber } from '../../options.js';
import type { Excitons } from '../excitons.js';
import type { RedfieldOptions } from '../models/redfield.js';
import type { ExcitonSystem } from '../types.js';
import { structuredInputs } from './inputs.js';
import { structuredRedfield } from './redfield-structured.js';

/**
 * The structured redfield solve of a system, with the input checks of the dense redfield model
 * (models/redfield.ts): temperature, cutoff, secular fraction, trap rates, the initial state, an
 * excitation that can leave.
 */
export function evaluateRedfieldStructured(sys: ExcitonSystem, o: RedfieldOptions, ex: () => Excitons) {
  const temperature = requireNumber('temperature', o.temperature, 'positive');
  const cutoff = requireNumber('bath cutoff', o.cutoff, 'positive');
  const secularFraction = requireNumber('secular fraction', o.secularFraction, 'nonnegative');
  const { kTrap, rho0 } = structuredInputs(sys, o.trapRate, o.start, ex);
  return structuredRedfield({ ex: ex(), reorganization: sys.reorganization, trapRates: kTrap, lossRates: sys.lossRates, temperature, cutoff, secularFraction, rho0 });
}
