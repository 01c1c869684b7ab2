import { requireNumber } from '../../options.js';
import type { Excitons } from '../excitons.js';
import type { HsrOptions } from '../models/hsr.js';
import type { ExcitonSystem } from '../types.js';
import { structuredHsr, type StructuredHsrResult } from './hsr-structured.js';
import { structuredInputs } from './inputs.js';

/**
 * The structured hsr solve of a system, with the input checks of the dense hsr model (models/hsr.ts):
 * dephasing and trap rates, the initial state, an excitation that can leave.
 */
export function evaluateHsrStructured(sys: ExcitonSystem, o: HsrOptions, ex: () => Excitons): StructuredHsrResult {
  const { n } = sys;
  const dephasing = requireNumber('dephasing rate', o.dephasing, 'nonnegative');
  const { kTrap, rho0 } = structuredInputs(sys, o.trapRate, o.start, ex);
  return structuredHsr({ n, hamiltonian: sys.hamiltonian, trapRates: kTrap, lossRates: sys.lossRates, dephasing, rho0 });
}
