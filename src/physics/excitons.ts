import { InputError } from '../errors.js';
import { symmetricEigen } from './linalg/symmetric-eigen.js';
import type { ExcitonSystem } from './types.js';

/** Exciton states of a system: energies (cm^-1), coefficients c_ma, transition dipoles and strengths. */
export interface Excitons {
  readonly n: number;
  /** Exciton energies, ascending, cm^-1. */
  readonly energies: Float64Array;
  /** Coefficients, row-major: coefficients[m * n + a] = c_ma. */
  readonly coefficients: Float64Array;
  /** Exciton transition dipoles mu_a = sum_m c_ma mu_m (D), row-major n x 3; absent without dipoles. */
  readonly dipoles?: Float64Array;
  /** Dipole strengths |mu_a|^2 (D^2); absent without dipoles. */
  readonly dipoleStrengths?: Float64Array;
  /** Oscillator strength of each state relative to the mean monomer strength (sums to N). */
  readonly relativeStrengths?: Float64Array;
}

/** Diagonalize the Hamiltonian and compute the exciton transition dipoles. */
export function excitons(sys: ExcitonSystem): Excitons {
  const { n } = sys;
  const { values, vectors } = symmetricEigen(sys.hamiltonian, n);
  if (!sys.dipoles) return { n, energies: values, coefficients: vectors };
  const mu = sys.dipoles;
  // one backing store for the three arrays (typed arrays of more than 64 bytes are allocated off the heap)
  const buf = new Float64Array(5 * n);
  const dip = buf.subarray(0, 3 * n), strength = buf.subarray(3 * n, 4 * n), relative = buf.subarray(4 * n);
  let monomer = 0;
  for (let m = 0; m < n; m++) monomer += mu[m * 3] ** 2 + mu[m * 3 + 1] ** 2 + mu[m * 3 + 2] ** 2;
  monomer /= n;
  for (let a = 0; a < n; a++) {
    for (let m = 0; m < n; m++) {
      const c = vectors[m * n + a];
      for (let k = 0; k < 3; k++) dip[a * 3 + k] += c * mu[m * 3 + k];
    }
    strength[a] = dip[a * 3] ** 2 + dip[a * 3 + 1] ** 2 + dip[a * 3 + 2] ** 2;
    relative[a] = strength[a] / monomer;
  }
  return {
    n,
    energies: values,
    coefficients: vectors,
    dipoles: dip,
    dipoleStrengths: strength,
    relativeStrengths: relative,
  };
}

export interface AbsorptionOptions {
  /** Line shape of each exciton line. */
  shape: 'gaussian' | 'lorentzian';
  /** Full width at half maximum, cm^-1. */
  fwhm: number;
  /** Energy grid, cm^-1: from, to, number of points. */
  from: number;
  to: number;
  points: number;
}

/** Stick spectrum: exciton energies (cm^-1) with dipole strengths (D^2). */
export function stickSpectrum(ex: Excitons): { energy: number; strength: number }[] {
  if (!ex.dipoleStrengths) throw new InputError('an absorption spectrum needs transition dipoles; this system was given as a bare Hamiltonian');
  return Array.from(ex.energies, (e, a) => ({ energy: e, strength: ex.dipoleStrengths![a] }));
}

/**
 * Broadened absorption: sum_a |mu_a|^2 g(E - E_a) with unit-area Gaussian or Lorentzian lines of the given
 * FWHM (D^2 per cm^-1). Integrates to the dipole-strength sum rule sum_m |mu_m|^2.
 */
export function absorptionSpectrum(ex: Excitons, o: AbsorptionOptions): { energy: Float64Array; absorbance: Float64Array } {
  const sticks = stickSpectrum(ex);
  if (!(o.fwhm > 0) || !(o.points >= 2) || !(o.to > o.from)) throw new InputError('absorption grid needs fwhm > 0, points >= 2 and to > from');
  const energy = new Float64Array(o.points);
  const absorbance = new Float64Array(o.points);
  const sigma = o.fwhm / (2 * Math.sqrt(2 * Math.log(2)));
  const halfWidth = o.fwhm / 2;
  for (let i = 0; i < o.points; i++) {
    const E = o.from + ((o.to - o.from) * i) / (o.points - 1);
    energy[i] = E;
    let s = 0;
    for (const st of sticks) {
      const d = E - st.energy;
      s += st.strength * (o.shape === 'gaussian'
        ? Math.exp((-d * d) / (2 * sigma * sigma)) / (sigma * Math.sqrt(2 * Math.PI))
        : halfWidth / (Math.PI * (d * d + halfWidth * halfWidth)));
    }
    absorbance[i] = s;
  }
  return { energy, absorbance };
}
