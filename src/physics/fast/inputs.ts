import type { Excitons } from '../excitons.js';
import { Workspace } from '../linalg/workspace.js';
import { checkExcitationCanLeave, initialDensity, type Start, trapRates } from '../models/common.js';
import type { ExcitonSystem } from '../types.js';

/** The trap rates, initial state and sink rates of the last call (each worker thread has its own module instance). */
const ws = new Workspace();

/**
 * What both structured solvers take from a system besides their model's options, with the dense models' checks:
 * per-site trap rates, the initial density matrix (site basis) and the sink rate (loss + trap) of every site;
 * throws when part of the excitation can never leave. kTrap, rho0 and sink live in this module's workspace until the
 * next call.
 */
export function structuredInputs(sys: ExcitonSystem, trapRate: number | readonly number[], start: Start, ex: () => Excitons): { kTrap: Float64Array; rho0: Float64Array; sink: Float64Array } {
  const { n } = sys;
  const kTrap = trapRates(sys, trapRate, ws.take('kTrap', n));
  const rho0 = initialDensity(sys, start, ex, ws.take('rho0', n * n)), sink = ws.take('sink', n), H = sys.hamiltonian;
  for (let m = 0; m < n; m++) sink[m] = sys.lossRates[m] + kTrap[m];
  checkExcitationCanLeave(n, (i, j) => H[i * n + j] !== 0, rho0, sink);
  return { kTrap, rho0, sink };
}
