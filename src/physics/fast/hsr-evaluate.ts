import { requireNumber } from '../../options.js';
import type { Excitons } from '../excitons.js';
import { checkExcitationCanLeave, initialDensity, trapRates } from '../models/common.js';
import type { HsrOptions } from '../models/hsr.js';
import type { ExcitonSystem } from '../types.js';
import { structuredHsr, type StructuredHsrResult } from './hsr-structured.js';

/**
 * The structured hsr solve of a system, with the input checks of the dense hsr model (models/hsr.ts):
 * dephasing and trap rates, the initial state, an excitation that can leave.
 */
export function evaluateHsrStructured(sys: ExcitonSystem, o: HsrOptions, ex: () => Excitons): StructuredHsrResult {
  const { n } = sys;
  const dephasing = requireNumber('dephasing rate', o.dephasing, 'nonnegative');
  const kTrap = trapRates(sys, o.trapRate);
  const rho0 = initialDensity(sys, o.start, ex);
  const sink = Float64Array.from(sys.lossRates, (k, m) => k + kTrap[m]);
  checkExcitationCanLeave(n, (i, j) => sys.hamiltonian[i * n + j] !== 0, rho0, sink);
  return structuredHsr({ n, hamiltonian: sys.hamiltonian, trapRates: kTrap, lossRates: sys.lossRates, dephasing, rho0 });
}
