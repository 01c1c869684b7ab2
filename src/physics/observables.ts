import { NumericalError } from '../errors.js';
import { luFactor, luSolve } from './linalg/lu.js';
import type { LinearModel } from './models/common.js';

/** Trapping observables of one array under one model. */
export interface TransportResult {
  /** eta = sum_t k_trap integral rho_tt dt. */
  readonly efficiency: number;
  /** Share of the excitation lost to decay: 1 - eta up to rounding. */
  readonly lossFraction: number;
  /** Mean transfer time to the trap, ps: sum k_trap [L^-2 rho0]_tt / eta (NaN-free: Infinity when eta = 0). */
  readonly transferTime: number;
  /** |eta + loss - 1|, the invariant's residual (a check of the solve). */
  readonly balanceResidual: number;
  /**
   * Which solver produced the numbers: 'dense' (LU of the assembled generator: N^2 x N^2 for hsr and redfield,
   * the N x N rate matrix for forster) or 'structured' (the O(N^4) hsr solver of physics/fast/).
   */
  readonly solver: 'dense' | 'structured';
  /** Why the dense solver ran although TransportOptions.solver was 'auto' (the structured check that failed). */
  readonly fallbackReason?: string;
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}

/**
 * Efficiency, loss and mean transfer time from one LU factorization of the generator and two solves
 * (CONVENTIONS.md "Observables"): X = -L^-1 rho0 = integral rho dt, Y = L^-2 rho0 = integral t rho dt.
 */
export function trappingObservables(m: LinearModel): TransportResult {
  m.checkCanLeave();
  const f = luFactor(m.generator, m.dim);
  const neg = m.initial.map((x) => -x);
  const X = luSolve(f, neg);
  const efficiency = dot(m.trapReadout, X);
  const lossFraction = dot(m.lossReadout, X);
  const Y = luSolve(f, X.map((x) => -x));
  const eta = efficiency;
  const transferTime = eta > 0 ? dot(m.trapReadout, Y) / eta : Infinity;
  const balanceResidual = Math.abs(efficiency + lossFraction - 1);
  if (!Number.isFinite(efficiency) || !Number.isFinite(lossFraction) || balanceResidual > 1e-6) {
    throw new NumericalError(
      `the transport solve is not trustworthy (efficiency ${efficiency}, loss ${lossFraction}, their sum misses 1 by ${balanceResidual.toExponential(2)}; smallest pivot ratio ${f.pivotRatio.toExponential(2)}): the rates may span too many orders of magnitude`,
      'ill-conditioned',
    );
  }
  return { efficiency, lossFraction, transferTime, balanceResidual, solver: 'dense' };
}
