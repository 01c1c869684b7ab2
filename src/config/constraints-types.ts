/**
 * Typed view of a lumenfold.constraints/1 document after loading: defaults filled in, the palette
 * resolved inline and dyes.count given as a range. The object is still a valid document of its format.
 * Units: energies cm^-1, dipoles D, lifetimes ps, distances nm, angles degrees.
 */

export interface Vector3 {
  x: number;
  y: number;
  z: number;
}

/** One palette entry. */
export interface Dye {
  name: string;
  description?: string;
  /** Transition energy, cm^-1. */
  energy: number;
  /** Transition dipole strength, D. */
  dipole: number;
  /** Reorganization energy, cm^-1. */
  reorganization: number;
  /** Excited-state lifetime, ps. */
  lifetime: number;
  /** Length of the transition dipole for the extended-dipole coupling, nm (0: point dipole). */
  length: number;
}

export interface Palette {
  format: 'lumenfold.palette/1';
  $schema?: string;
  name?: string;
  description?: string;
  dyes: Dye[];
}

export type FrameAxis = 'axial' | 'radial' | 'tangent';

export type DipoleFree = { kind: 'free' };
/** Dipole inside a cone of half_angle degrees around axis (the dipole's sign does not matter). */
export type DipoleCone<Axis> = { kind: 'cone'; axis: Axis; half_angle: number };
export type DipoleRule = DipoleFree | DipoleCone<Vector3>;
export type HelixDipoleRule = DipoleFree | DipoleCone<Vector3 | FrameAxis>;

export interface Linker {
  /** Largest distance of a dye's centre from its anchor, nm. */
  length: number;
}

export interface BoxRegion {
  kind: 'box';
  size: Vector3;
  dipole: DipoleRule;
}
export interface CylinderRegion {
  kind: 'cylinder';
  radius: number;
  length: number;
  dipole: DipoleRule;
}
export interface SphereRegion {
  kind: 'sphere';
  radius: number;
  dipole: DipoleRule;
}
export interface SlabRegion {
  kind: 'slab';
  thickness: number;
  size: { x: number; y: number };
  dipole: DipoleRule;
}
export interface AnchorList {
  kind: 'anchors';
  anchors: Vector3[];
  linker: Linker;
  dipole: DipoleRule;
}
export interface HelixLattice {
  kind: 'helix_lattice';
  rise: number;
  twist: number;
  radius: number;
  steps: number;
  helices: number;
  spacing: number;
  phase: number;
  helix_phase: number;
  linker: Linker;
  dipole: HelixDipoleRule;
}

export type RegionScaffold = BoxRegion | CylinderRegion | SphereRegion | SlabRegion;
export type AnchorScaffold = AnchorList | HelixLattice;
export type Scaffold = RegionScaffold | AnchorScaffold;

export function isAnchorScaffold(scaffold: Scaffold): scaffold is AnchorScaffold {
  return scaffold.kind === 'anchors' || scaffold.kind === 'helix_lattice';
}

export interface FixedSite {
  site: number;
  anchor?: number;
  position?: Vector3;
  direction?: Vector3;
  dye?: string;
}

export type SiteSelector = 'all' | 'donors' | 'traps' | number[];

export interface PaletteRule {
  sites: SiteSelector;
  dyes: 'all' | string[];
}
export interface RangeRule {
  sites: SiteSelector;
  /** Continuous energy range in cm^-1; the other dye properties are those of `like`. */
  range: { min: number; max: number; like: string };
}
export type EnergyRule = PaletteRule | RangeRule;

export interface Energetics {
  rules: EnergyRule[];
  /** Largest |E(i) - E(i+1)| for consecutive sites, cm^-1. */
  max_step?: number;
  /** Largest highest-minus-lowest site energy, cm^-1. */
  max_span?: number;
  /** Bounds on E(trap) - E(donor) for every trap and donor, cm^-1. */
  trap_offset?: { min?: number; max?: number };
}

export interface ConstraintSet {
  format: 'lumenfold.constraints/1';
  $schema?: string;
  name?: string;
  description?: string;
  palette: Dye[];
  dyes: { count: { min: number; max: number }; traps: number[] };
  scaffold: Scaffold;
  spacing: { min: number };
  fixed: FixedSite[];
  energetics: Energetics;
}
