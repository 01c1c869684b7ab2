/**
 * Physical constants and unit conversions (CONVENTIONS.md "Units" and "Constants").
 * Exact values of the 2019 SI (CODATA 2018) unless marked otherwise.
 */
export const SPEED_OF_LIGHT = 299_792_458; // m/s, exact
export const PLANCK = 6.626_070_15e-34; // J s, exact
export const BOLTZMANN = 1.380_649e-23; // J/K, exact
export const ELEMENTARY_CHARGE = 1.602_176_634e-19; // C, exact
/** Vacuum permittivity, CODATA 2018 recommended value (measured, not exact in the 2019 SI). */
export const VACUUM_PERMITTIVITY = 8.854_187_812_8e-12; // F/m
/** One debye: 1e-21 / c coulomb metre (definition of the unit). */
export const DEBYE = 1e-21 / SPEED_OF_LIGHT; // C m

/** hc in J cm (an energy of 1 cm^-1 in joules). */
export const HC_J_CM = PLANCK * SPEED_OF_LIGHT * 100;
/** k_B / (hc) in cm^-1 per kelvin: 0.695 034 800. */
export const KB_CM_PER_K = BOLTZMANN / HC_J_CM;
/** 2 pi c in rad ps^-1 per cm^-1: an energy E (cm^-1) is the angular frequency E * this. */
export const CM_TO_RAD_PER_PS = 2 * Math.PI * SPEED_OF_LIGHT * 100 * 1e-12;
/** hbar in cm^-1 ps (1 / CM_TO_RAD_PER_PS). */
export const HBAR_CM_PS = 1 / CM_TO_RAD_PER_PS;

/**
 * Point-dipole prefactor (1 D)^2 / (4 pi eps0 (1 nm)^3) in cm^-1: 5.0341 (the literature rounds to 5.04).
 */
export const DIPOLE_PREFACTOR_CM =
  (DEBYE * DEBYE) / (4 * Math.PI * VACUUM_PERMITTIVITY * 1e-27) / HC_J_CM;

/** Thermal energy k_B T in cm^-1. */
export function thermalEnergyCm(temperatureK: number): number {
  return KB_CM_PER_K * temperatureK;
}

/** Energy in cm^-1 to angular frequency in rad/ps. */
export function cmToRadPerPs(energyCm: number): number {
  return energyCm * CM_TO_RAD_PER_PS;
}

/** Angular frequency in rad/ps to energy in cm^-1. */
export function radPerPsToCm(omega: number): number {
  return omega / CM_TO_RAD_PER_PS;
}

/** Energy in cm^-1 to electronvolt. */
export function cmToEv(energyCm: number): number {
  return (energyCm * HC_J_CM) / ELEMENTARY_CHARGE;
}

/** Energy in cm^-1 to a vacuum wavelength in nm. */
export function cmToNm(energyCm: number): number {
  return 1e7 / energyCm;
}

/** Vacuum wavelength in nm to an energy in cm^-1. */
export function nmToCm(wavelengthNm: number): number {
  return 1e7 / wavelengthNm;
}

/** Dipole moment in debye to coulomb metre. */
export function debyeToCoulombMetre(mu: number): number {
  return mu * DEBYE;
}

/** Degrees to radians. */
export function degToRad(deg: number): number {
  return (deg * Math.PI) / 180;
}
