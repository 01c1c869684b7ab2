import { InputError, ModelError } from '../../errors.js';
import { requireNumber } from '../../options.js';
import { KB_CM_PER_K } from '../constants.js';
import type { Excitons } from '../excitons.js';
import type { ExcitonSystem } from '../types.js';

/** The initial excitation. Sites and exciton states are 0-based here. */
export type Start =
  | { readonly kind: 'site'; readonly site: number }
  | { readonly kind: 'donors' }
  | { readonly kind: 'exciton'; readonly state: number }
  | { readonly kind: 'light'; readonly temperature?: number };

/** Default blackbody temperature of the illumination, K (the solar photosphere, about 5800 K: common practice). */
export const DEFAULT_LIGHT_TEMPERATURE = 5800;

/**
 * A transport model reduced to linear algebra: d v/dt = G v on a real vector v (the density matrix in the
 * layout of liouville/layout.ts, or site populations for forster). Readouts give rates into the sink and the
 * loss channel and the site populations as dot products with v.
 */
export interface LinearModel {
  readonly model: 'hsr' | 'redfield' | 'forster';
  readonly n: number;
  readonly dim: number;
  /** Generator, row-major dim x dim, ps^-1. */
  readonly generator: Float64Array;
  readonly initial: Float64Array;
  /** trapReadout . v = total rate of flow into the sink(s). */
  readonly trapReadout: Float64Array;
  /** lossReadout . v = total rate of loss. */
  readonly lossReadout: Float64Array;
  /** populationReadout[m] . v = population of site m. */
  readonly populationReadout: readonly Float64Array[];
  /** Throws a ModelError when part of the initial excitation can never reach a trap or decay. */
  readonly checkCanLeave: () => void;
}

/** Per-site trap rate (ps^-1), zero off the traps; into `out` (n entries, overwritten) when given. */
export function trapRates(sys: ExcitonSystem, trapRate: number | readonly number[], out?: Float64Array): Float64Array {
  const k = out ?? new Float64Array(sys.n);
  if (out) for (let m = 0; m < sys.n; m++) k[m] = 0;
  const { traps } = sys;
  for (let i = 0; i < traps.length; i++) {
    const t = traps[i];
    const r = typeof trapRate === 'number' ? trapRate : trapRate[i];
    if (r === undefined) throw new InputError(`trap rate: one value per trap expected (${traps.length}), got ${(trapRate as readonly number[]).length}`);
    k[t] = requireNumber(`trap rate of site ${t + 1}`, r, 'nonnegative');
  }
  return k;
}

/** Site-basis initial density matrix (real symmetric, row-major N x N, trace 1), into `out` when given (it is zeroed). */
export function initialDensity(sys: ExcitonSystem, start: Start, ex: () => Excitons, out?: Float64Array): Float64Array {
  const { n } = sys;
  const rho = out ? out.fill(0) : new Float64Array(n * n);
  switch (start.kind) {
    case 'site': {
      if (!Number.isInteger(start.site) || start.site < 0 || start.site >= n) {
        throw new InputError(`start site ${start.site + 1} is out of range: sites are numbered 1 to ${n}`);
      }
      rho[start.site * n + start.site] = 1;
      return rho;
    }
    case 'donors': {
      const donors = [...Array(n).keys()].filter((m) => !sys.traps.includes(m));
      if (donors.length === 0) throw new InputError('start "donors": every site is a trap, there is no donor to excite');
      for (const m of donors) rho[m * n + m] = 1 / donors.length;
      return rho;
    }
    case 'exciton': {
      const e = ex();
      if (!Number.isInteger(start.state) || start.state < 0 || start.state >= n) {
        throw new InputError(`start exciton ${start.state + 1} is out of range: states are numbered 1 to ${n}`);
      }
      return excitonMixture(e, Float64Array.from({ length: n }, (_, a) => (a === start.state ? 1 : 0)), rho);
    }
    case 'light': {
      const e = ex();
      if (!e.dipoleStrengths) throw new InputError('start "light" needs transition dipoles; this system was given as a bare Hamiltonian');
      const T = requireNumber('light temperature', start.temperature ?? DEFAULT_LIGHT_TEMPERATURE, 'positive');
      // Einstein B coefficient times Planck's spectral energy density per wavenumber, u ~ E^3 / (exp(E/kT) - 1).
      const w = Float64Array.from(e.energies, (E, a) => {
        if (!(E > 0)) throw new InputError('start "light" needs absolute exciton energies above zero (site energies in cm^-1, not relative ones)');
        return (e.dipoleStrengths![a] * E ** 3) / Math.expm1(E / (KB_CM_PER_K * T));
      });
      const total = w.reduce((s, x) => s + x, 0);
      if (!(total > 0)) throw new ModelError('start "light": no exciton state absorbs (all dipole strengths are zero)');
      return excitonMixture(e, w.map((x) => x / total), rho);
    }
  }
}

/** rho = sum_a w_a |a><a| in the site basis, added into `rho` (zeros). */
function excitonMixture(e: Excitons, w: Float64Array, rho: Float64Array): Float64Array {
  const { n, coefficients: C } = e;
  for (let a = 0; a < n; a++) {
    if (w[a] === 0) continue;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) rho[i * n + j] += w[a] * C[i * n + a] * C[j * n + a];
  }
  return rho;
}

/**
 * Throw a ModelError when some part of the initial excitation can never leave the array: a set of sites
 * connected by non-zero couplings (or rates) that holds initial population but neither a trap nor a loss.
 */
export function checkExcitationCanLeave(n: number, connected: (i: number, j: number) => boolean, rho0: Float64Array, sinkRate: Float64Array): void {
  // every site loses population (a loss common to all sites, the usual case): every component can leave
  let all = true;
  for (let m = 0; m < n && all; m++) all = sinkRate[m] > 0;
  if (all) return;
  const comp = new Int32Array(n).fill(-1);
  const stack = new Int32Array(n);
  let c = 0;
  for (let s = 0; s < n; s++) {
    if (comp[s] >= 0) continue;
    let top = 0;
    stack[top++] = s;
    comp[s] = c;
    while (top > 0) {
      const i = stack[--top];
      for (let j = 0; j < n; j++) if (comp[j] < 0 && connected(i, j)) { comp[j] = c; stack[top++] = j; }
    }
    c++;
  }
  // per component: does it hold initial population, and can it lose it?
  const excited = new Uint8Array(c), leaves = new Uint8Array(c);
  for (let m = 0; m < n; m++) {
    if (rho0[m * n + m] > 1e-15) excited[comp[m]] = 1;
    if (sinkRate[m] > 0) leaves[comp[m]] = 1;
  }
  for (let k = 0; k < c; k++) {
    if (excited[k] && !leaves[k]) {
      const members = [...Array(n).keys()].filter((m) => comp[m] === k);
      throw new ModelError(`the excitation can never leave: sites ${members.map((m) => m + 1).join(', ')} hold initial population but are not connected to a trap and have no loss`, 'trapped-excitation');
    }
  }
}
