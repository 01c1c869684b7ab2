/** Plain data types of the physics layer. Units follow CONVENTIONS.md (cm^-1, nm, D, ps, K). */

export type Vec3 = readonly [number, number, number];

/** One dye (chromophore) of an array. */
export interface Site {
  /** Centre position, nm. */
  readonly position: Vec3;
  /** Transition dipole direction (normalized on use; must not be zero). */
  readonly direction: Vec3;
  /** Transition dipole strength, debye. */
  readonly dipole: number;
  /** Site (transition) energy, cm^-1. */
  readonly energy: number;
  /** Reorganization energy of its bath, cm^-1 (used by redfield and forster). */
  readonly reorganization?: number;
  /** Excited-state lifetime, ps; its inverse is the site's loss rate. */
  readonly lifetime?: number;
  /** Physical length of the transition dipole, nm (for the extended-dipole coupling). */
  readonly length?: number;
  readonly label?: string;
}

/** Dielectric screening of the Coulomb coupling. */
export type Screening =
  | { readonly kind: 'none' }
  | { readonly kind: 'constant'; readonly refractiveIndex: number }
  | { readonly kind: 'exponential'; readonly amplitude: number; readonly decayPerNm: number; readonly offset: number };

/** How couplings between dyes are computed. */
export type CouplingMethod = 'point-dipole' | 'extended-dipole' | 'auto';

/**
 * The excitonic system handed to the transport models: an N x N Hamiltonian and the data the models need.
 * All arrays are per site, length N; `hamiltonian` is row-major N x N, cm^-1.
 */
export interface ExcitonSystem {
  readonly n: number;
  readonly hamiltonian: Float64Array;
  /** Trap (acceptor) site indices, 0-based. */
  readonly traps: readonly number[];
  /** Reorganization energy per site, cm^-1. */
  readonly reorganization: Float64Array;
  /** Loss (decay) rate per site, ps^-1. */
  readonly lossRates: Float64Array;
  /** Transition dipole vectors (D), row-major N x 3; absent when only a Hamiltonian was given. */
  readonly dipoles?: Float64Array;
}
