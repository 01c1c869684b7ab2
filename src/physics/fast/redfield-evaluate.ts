import { requireNumber } from '../../options.js';
import type { Excitons } from '../excitons.js';
import { Workspace } from '../linalg/workspace.js';
import { checkExcitationCanLeave, initialDensity, trapRates } from '../models/common.js';
import type { RedfieldOptions } from '../models/redfield.js';
import type { ExcitonSystem } from '../types.js';
import { structuredRedfield } from './redfield-structured.js';

/** The initial state and sink rates of the last call (each worker thread has its own module instance). */
const ws = new Workspace();

/**
 * The structured redfield solve of a system, with the input checks of the dense redfield model
 * (models/redfield.ts): temperature, cutoff, secular fraction, trap rates, the initial state, an
 * excitation that can leave.
 */
export function evaluateRedfieldStructured(sys: ExcitonSystem, o: RedfieldOptions, ex: () => Excitons) {
  const { n } = sys;
  const temperature = requireNumber('temperature', o.temperature, 'positive');
  const cutoff = requireNumber('bath cutoff', o.cutoff, 'positive');
  const secularFraction = requireNumber('secular fraction', o.secularFraction, 'nonnegative');
  const kTrap = trapRates(sys, o.trapRate);
  const rho0 = initialDensity(sys, o.start, ex, ws.take('rho0', n * n)), sink = ws.take('sink', n), H = sys.hamiltonian;
  for (let m = 0; m < n; m++) sink[m] = sys.lossRates[m] + kTrap[m];
  checkExcitationCanLeave(n, (i, j) => H[i * n + j] !== 0, rho0, sink);
  return structuredRedfield({ ex: ex(), reorganization: sys.reorganization, trapRates: kTrap, lossRates: sys.lossRates, temperature, cutoff, secularFraction, rho0 });
}
