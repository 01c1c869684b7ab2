import { describe, expect, it } from 'vitest';
import { CM_TO_RAD_PER_PS, DIPOLE_PREFACTOR_CM, HBAR_CM_PS, KB_CM_PER_K, cmToEv, cmToNm, thermalEnergyCm } from '../../src/physics/constants.js';

describe('constants and units (CODATA 2018 / 2019 SI)', () => {
  it('derives the point-dipole prefactor 5.034 cm^-1 nm^3 D^-2 (literature rounds to 5.04)', () => {
    // CONVENTIONS.md; e.g. May and Kuehn, Charge and Energy Transfer Dynamics in Molecular Systems, quote 5.04.
    expect(DIPOLE_PREFACTOR_CM).toBeCloseTo(5.0341, 4);
  });
  it('k_B/(hc) = 0.695 034 800 cm^-1/K, k_B T(300 K) = 208.51 cm^-1 (CODATA 2018)', () => {
    expect(KB_CM_PER_K).toBeCloseTo(0.6950348, 7);
    expect(thermalEnergyCm(300)).toBeCloseTo(208.51, 2);
  });
  it('2 pi c = 0.188 365 157 rad/ps per cm^-1 and hbar = 5.308 837 459 cm^-1 ps', () => {
    expect(CM_TO_RAD_PER_PS).toBeCloseTo(0.188365157, 9);
    expect(HBAR_CM_PS).toBeCloseTo(5.308837459, 8);
  });
  it('converts 8065.544 cm^-1 to 1 eV and 12500 cm^-1 to 800 nm (CODATA 2018 hc/e)', () => {
    expect(cmToEv(8065.543937)).toBeCloseTo(1, 8);
    expect(cmToNm(12500)).toBeCloseTo(800, 10);
  });
});
