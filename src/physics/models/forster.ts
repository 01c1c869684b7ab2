import { ModelError } from '../../errors.js';
import { requireNumber } from '../../options.js';
import { HBAR_CM_PS, KB_CM_PER_K } from '../constants.js';
import type { Excitons } from '../excitons.js';
import type { ExcitonSystem } from '../types.js';
import { checkExcitationCanLeave, initialDensity, type LinearModel, type Start, trapRates } from './common.js';

export interface ForsterOptions {
  temperature: number;
  trapRate: number | readonly number[];
  start: Start;
}

/**
 * Foerster hopping rate from site m to site n, ps^-1 (CONVENTIONS.md): with Lambda = lambda_m + lambda_n,
 *   k = (2 pi / hbar) J^2 (4 pi Lambda kT)^-1/2 exp(-(E_n - E_m + Lambda)^2 / (4 Lambda kT)).
 * High-temperature Gaussian line-shape overlap (Marcus form); detailed balance holds exactly.
 */
export function forsterRate(J: number, dE: number, Lambda: number, kT: number): number {
  const var4 = 4 * Lambda * kT;
  return ((2 * Math.PI) / HBAR_CM_PS) * J * J * Math.exp(-((dE + Lambda) ** 2) / var4) / Math.sqrt(Math.PI * var4);
}

/** Incoherent hopping between sites: a Pauli master equation on the N site populations. */
export function forsterModel(sys: ExcitonSystem, o: ForsterOptions, ex: () => Excitons): LinearModel {
  const { n, hamiltonian: H, reorganization: lam } = sys;
  const T = requireNumber('temperature', o.temperature, 'positive');
  const kT = KB_CM_PER_K * T;
  const kTrap = trapRates(sys, o.trapRate);
  const sink = Float64Array.from(sys.lossRates, (k, m) => k + kTrap[m]);
  const G = new Float64Array(n * n);
  for (let m = 0; m < n; m++) {
    for (let k = 0; k < n; k++) {
      if (k === m || H[m * n + k] === 0) continue;
      const Lambda = lam[m] + lam[k];
      if (!(Lambda > 0)) {
        throw new ModelError(`forster needs a reorganization energy above zero: sites ${m + 1} and ${k + 1} have lambda_m + lambda_n = 0`, 'no-reorganization');
      }
      // rate m -> k goes into column m, row k
      const r = forsterRate(H[m * n + k], H[k * n + k] - H[m * n + m], Lambda, kT);
      G[k * n + m] += r;
      G[m * n + m] -= r;
    }
    G[m * n + m] -= sink[m];
  }
  const rho0 = initialDensity(sys, o.start, ex);
  const unitRow = (m: number) => Float64Array.from({ length: n }, (_, i) => (i === m ? 1 : 0));
  return {
    model: 'forster',
    n,
    dim: n,
    generator: G,
    initial: Float64Array.from({ length: n }, (_, m) => rho0[m * n + m]),
    trapReadout: kTrap,
    lossReadout: Float64Array.from(sys.lossRates),
    checkCanLeave: () => checkExcitationCanLeave(n, (i, j) => G[i * n + j] > 0 || G[j * n + i] > 0, rho0, sink),
    populationReadout: [...Array(n).keys()].map(unitRow),
  };
}
