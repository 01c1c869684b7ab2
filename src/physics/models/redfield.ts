import { requireNumber } from '../../options.js';
import { CM_TO_RAD_PER_PS } from '../constants.js';
import type { Excitons } from '../excitons.js';
import { anticommutatorTerm, assemble, commutatorTerm, type Term } from '../liouville/assemble.js';
import { layout, traceReadout, vectorizeSymmetric } from '../liouville/layout.js';
import type { ExcitonSystem } from '../types.js';
import { drudeSpectrum } from './bath.js';
import { checkExcitationCanLeave, initialDensity, type LinearModel, type Start, trapRates } from './common.js';
import { diagonal } from './hsr.js';

export interface RedfieldOptions {
  temperature: number;
  /** Drude-Lorentz cutoff gamma_c, cm^-1. Reorganization energies come from the system, per site. */
  cutoff: number;
  /**
   * Secular approximation: keep R_abcd only where |w_ab - w_cd| < secularFraction * (smallest non-zero exciton
   * spacing); population-to-population elements and each element's own decay are always kept. This is the rule
   * of QuTiP 4.7's bloch_redfield_tensor (sec_cutoff, default 0.1).
   */
  secularFraction: number;
  trapRate: number | readonly number[];
  start: Start;
}

/** A sparse Redfield tensor: for each input element (c, d), the outputs (a, b) and coefficients (ps^-1). */
export interface RedfieldTensor {
  readonly n: number;
  readonly targets: Int32Array[];
  readonly values: Float64Array[];
}

/**
 * Secular Bloch-Redfield tensor in the exciton basis for independent site baths coupled through |m><m|
 * (Breuer and Petruccione, The Theory of Open Quantum Systems, sec. 3.3; same construction as QuTiP's
 * bloch_redfield_tensor without the imaginary, Lamb-shift part):
 *   R_abcd = 1/2 W_acdb [S(w_ca) + S(w_db)] - 1/2 delta_bd T_ac - 1/2 delta_ac T_bd,
 *   W_acdb = sum_m lambda_m c_ma c_mc c_md c_mb,  T_xy = sum_n W_xnny S(w_yn),  w_ij = E_i - E_j.
 */
export function redfieldTensor(ex: Excitons, reorganization: Float64Array, o: Pick<RedfieldOptions, 'temperature' | 'cutoff' | 'secularFraction'>): RedfieldTensor {
  const { n, energies: E, coefficients: C } = ex;
  const T = requireNumber('temperature', o.temperature, 'positive');
  const gc = requireNumber('bath cutoff', o.cutoff, 'positive');
  const sec = requireNumber('secular fraction', o.secularFraction, 'nonnegative') * smallestSpacing(E);
  const S = new Float64Array(n * n); // S(w_ij) in ps^-1 per unit lambda
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) S[i * n + j] = drudeSpectrum(E[i] - E[j], gc, T) * CM_TO_RAD_PER_PS;
  const W4 = (a: number, c: number, d: number, b: number) => {
    let s = 0;
    for (let m = 0; m < n; m++) {
      const r = m * n;
      s += reorganization[m] * C[r + a] * C[r + c] * C[r + d] * C[r + b];
    }
    return s;
  };
  // T_xy = sum_n W_xnny S(w_yn), with P_xn,y = sum_m lambda_m c_mx c_mn^2 c_my computed once.
  const Tm = new Float64Array(n * n);
  const cc = new Float64Array(n * n); // lambda_m c_mn^2
  for (let m = 0; m < n; m++) for (let k = 0; k < n; k++) cc[m * n + k] = reorganization[m] * C[m * n + k] ** 2;
  for (let x = 0; x < n; x++) {
    for (let y = x; y < n; y++) {
      let sxy = 0, syx = 0;
      for (let k = 0; k < n; k++) {
        let w = 0; // W_xkky, symmetric in x and y
        for (let m = 0; m < n; m++) w += C[m * n + x] * cc[m * n + k] * C[m * n + y];
        sxy += w * S[y * n + k];
        syx += w * S[x * n + k];
      }
      Tm[x * n + y] = sxy;
      Tm[y * n + x] = syx;
    }
  }
  const targets: Int32Array[] = [];
  const values: Float64Array[] = [];
  for (let c = 0; c < n; c++) {
    for (let d = 0; d < n; d++) {
      const wcd = E[c] - E[d];
      const tg: number[] = [];
      const vs: number[] = [];
      for (let a = 0; a < n; a++) {
        for (let b = 0; b < n; b++) {
          const keep = (a === b && c === d) || (a === c && b === d) || Math.abs(E[a] - E[b] - wcd) < sec;
          if (!keep) continue;
          let r = 0.5 * W4(a, c, d, b) * (S[c * n + a] + S[d * n + b]);
          if (b === d) r -= 0.5 * Tm[a * n + c];
          if (a === c) r -= 0.5 * Tm[b * n + d];
          if (r !== 0) { tg.push(a * n + b); vs.push(r); }
        }
      }
      targets.push(Int32Array.from(tg));
      values.push(Float64Array.from(vs));
    }
  }
  return { n, targets, values };
}

/** Smallest non-zero |E_a - E_b| of a sorted spectrum (0 for a single level). */
export function smallestSpacing(E: Float64Array): number {
  let best = Infinity;
  for (let a = 1; a < E.length; a++) {
    const d = E[a] - E[a - 1];
    if (d > 0 && d < best) best = d;
  }
  return Number.isFinite(best) ? best : 0;
}

function tensorTerm(R: RedfieldTensor): Term {
  const { n, targets, values } = R;
  return (c, d, re, im, outRe, outIm) => {
    const tg = targets[c * n + d], vs = values[c * n + d];
    for (let k = 0; k < tg.length; k++) {
      outRe[tg[k]] += vs[k] * re;
      outIm[tg[k]] += vs[k] * im;
    }
  };
}

/** C^T A C for a row-major N x N A and exciton coefficients C; `out` and `tmp` (n * n entries) may be given to be reused. */
export function toExcitonBasis(n: number, A: Float64Array, C: Float64Array, out: Float64Array = new Float64Array(n * n), tmp: Float64Array = new Float64Array(n * n)): Float64Array {
  tmp.fill(0, 0, n * n);
  out.fill(0, 0, n * n);
  for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) {
    const a = A[i * n + k];
    if (a === 0) continue;
    for (let b = 0; b < n; b++) tmp[i * n + b] += a * C[k * n + b];
  }
  for (let i = 0; i < n; i++) for (let a = 0; a < n; a++) {
    const c = C[i * n + a];
    if (c === 0) continue;
    for (let b = 0; b < n; b++) out[a * n + b] += c * tmp[i * n + b];
  }
  return out;
}

/**
 * Secular Redfield transport in the exciton basis (CONVENTIONS.md): coherent H, the secular Bloch-Redfield
 * tensor of per-site Drude-Lorentz baths at temperature T, trap and loss as Lindblad decay.
 */
export function redfieldModel(sys: ExcitonSystem, o: RedfieldOptions, exf: () => Excitons): LinearModel {
  const { n } = sys;
  const ex = exf();
  const C = ex.coefficients;
  const kTrap = trapRates(sys, o.trapRate);
  const sink = Float64Array.from(sys.lossRates, (k, m) => k + kTrap[m]);
  const rho0 = initialDensity(sys, o.start, exf);
  const L = layout(n);
  const R = redfieldTensor(ex, sys.reorganization, o);
  const Hd = diagonal(n, ex.energies.map((e) => e * CM_TO_RAD_PER_PS));
  const generator = assemble(L, [commutatorTerm(n, Hd), anticommutatorTerm(n, toExcitonBasis(n, diagonal(n, sink), C)), tensorTerm(R)]);
  const site = (v: ArrayLike<number>) => traceReadout(L, toExcitonBasis(n, diagonal(n, v), C));
  return {
    model: 'redfield',
    n,
    dim: L.dim,
    generator,
    initial: vectorizeSymmetric(L, toExcitonBasis(n, rho0, C)),
    trapReadout: site(kTrap),
    lossReadout: site(sys.lossRates),
    checkCanLeave: () => checkExcitationCanLeave(n, (i, j) => sys.hamiltonian[i * n + j] !== 0, rho0, sink),
    populationReadout: [...Array(n).keys()].map((m) => site(Float64Array.from({ length: n }, (_, i) => (i === m ? 1 : 0)))),
  };
}
