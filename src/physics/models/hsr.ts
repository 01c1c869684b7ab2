import { requireNumber } from '../../options.js';
import { CM_TO_RAD_PER_PS } from '../constants.js';
import type { Excitons } from '../excitons.js';
import { assemble, commutatorTerm, diagonalDecayTerm, pureDephasingTerm } from '../liouville/assemble.js';
import { layout, traceReadout, vectorizeSymmetric } from '../liouville/layout.js';
import type { ExcitonSystem } from '../types.js';
import { checkExcitationCanLeave, initialDensity, type LinearModel, type Start, trapRates } from './common.js';

export interface HsrOptions {
  /** Pure dephasing rate gamma_phi, ps^-1: site coherences decay at this rate. */
  dephasing: number;
  trapRate: number | readonly number[];
  start: Start;
}

/**
 * Haken-Strobl-Reineker model in the site basis (CONVENTIONS.md): coherent H, pure dephasing
 * sqrt(gamma_phi)|m><m| on every site, trap and loss as Lindblad decay into the sink and the ground state.
 * Infinite-temperature: never use it to score uphill transfer.
 */
export function hsrModel(sys: ExcitonSystem, o: HsrOptions, ex: () => Excitons): LinearModel {
  const { n } = sys;
  const gamma = requireNumber('dephasing rate', o.dephasing, 'nonnegative');
  const kTrap = trapRates(sys, o.trapRate);
  const sink = Float64Array.from(sys.lossRates, (k, m) => k + kTrap[m]);
  const rho0 = initialDensity(sys, o.start, ex);
  const L = layout(n);
  const Hrad = sys.hamiltonian.map((h) => h * CM_TO_RAD_PER_PS);
  const generator = assemble(L, [commutatorTerm(n, Hrad), diagonalDecayTerm(n, sink), pureDephasingTerm(n, gamma)]);
  return {
    model: 'hsr',
    n,
    dim: L.dim,
    generator,
    initial: vectorizeSymmetric(L, rho0),
    trapReadout: traceReadout(L, diagonal(n, kTrap)),
    lossReadout: traceReadout(L, diagonal(n, sys.lossRates)),
    checkCanLeave: () => checkExcitationCanLeave(n, (i, j) => sys.hamiltonian[i * n + j] !== 0, rho0, sink),
    populationReadout: [...Array(n).keys()].map((m) => traceReadout(L, diagonal(n, Float64Array.from({ length: n }, (_, i) => (i === m ? 1 : 0))))),
  };
}

/** Diagonal N x N matrix (row-major) of a vector. */
export function diagonal(n: number, v: ArrayLike<number>): Float64Array {
  const D = new Float64Array(n * n);
  for (let i = 0; i < n; i++) D[i * n + i] = v[i];
  return D;
}
