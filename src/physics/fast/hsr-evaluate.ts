import { requireNumber } from '../../options.js';
import type { Excitons } from '../excitons.js';
import { Workspace } from '../linalg/workspace.js';
import { checkExcitationCanLeave, initialDensity, trapRates } from '../models/common.js';
import type { HsrOptions } from '../models/hsr.js';
import type { ExcitonSystem } from '../types.js';
import { structuredHsr, type StructuredHsrResult } from './hsr-structured.js';

/** The initial state and sink rates of the last call (each worker thread has its own module instance). */
const INPUT = new Workspace();

/**
 * The structured hsr solve of a system, with the input checks of the dense hsr model (models/hsr.ts):
 * dephasing and trap rates, the initial state, an excitation that can leave.
 */
export function evaluateHsrStructured(sys: ExcitonSystem, o: HsrOptions, ex: () => Excitons): StructuredHsrResult {
  const { n } = sys;
  const dephasing = requireNumber('dephasing rate', o.dephasing, 'nonnegative');
  const kTrap = trapRates(sys, o.trapRate);
  const rho0 = initialDensity(sys, o.start, ex, INPUT.take('rho0', n * n));
  const sink = INPUT.take('sink', n);
  for (let m = 0; m < n; m++) sink[m] = sys.lossRates[m] + kTrap[m];
  const h = sys.hamiltonian;
  checkExcitationCanLeave(n, (i, j) => h[i * n + j] !== 0, rho0, sink);
  return structuredHsr({ n, hamiltonian: h, trapRates: kTrap, lossRates: sys.lossRates, dephasing, rho0 });
}
