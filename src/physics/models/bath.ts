import { KB_CM_PER_K } from '../constants.js';

/**
 * Bath spectrum of a Drude-Lorentz spectral density per unit reorganization energy (CONVENTIONS.md):
 *   J(w) = 2 lambda gamma_c w / (w^2 + gamma_c^2),   S(w) = 2 J(w) (n(w) + 1),   J(-w) = -J(w),
 * n the Bose-Einstein occupation at T. Everything in cm^-1; S(0) = 4 lambda k_B T / gamma_c.
 * Returns S(w) / lambda, so a site with reorganization energy lambda has S = lambda * drudeSpectrum(...).
 */
export function drudeSpectrum(omegaCm: number, cutoffCm: number, temperatureK: number): number {
  const kT = KB_CM_PER_K * temperatureK;
  const g = cutoffCm;
  const x = omegaCm / kT;
  // w (n(w) + 1) = w / (1 - exp(-w/kT)), written to stay accurate at small |w|.
  const wBose = Math.abs(x) < 1e-8 ? kT * (1 + x / 2) : omegaCm / -Math.expm1(-x);
  return (4 * g * wBose) / (omegaCm * omegaCm + g * g);
}
