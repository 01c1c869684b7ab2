import { InputError } from '../errors.js';
import { DIPOLE_PREFACTOR_CM } from './constants.js';
import type { Screening, Vec3 } from './types.js';
import { norm3 } from './norm3.js';

/** Unit vector along v; throws when v is zero or not finite. `what` names v in the message (a number i: site i + 1's direction). */
export function unit(v: Vec3, what: string | number = 'direction'): Vec3 {
  const len = norm3(v[0], v[1], v[2]);
  if (!Number.isFinite(len) || len === 0) {
    const name = typeof what === 'number' ? `site ${what + 1} direction` : what;
    throw new InputError(`${name} must be a finite non-zero vector, got [${v.join(', ')}]`);
  }
  return [v[0] / len, v[1] / len, v[2] / len];
}

function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

/**
 * Orientation factor kappa = u_m . u_n - 3 (u_m . r)(u_n . r) for unit dipoles u and the unit vector r
 * between the centres (CONVENTIONS.md; -2 head-to-tail, +1 parallel side by side).
 */
export function orientationFactor(um: Vec3, un: Vec3, r: Vec3): number {
  return dot(um, un) - 3 * dot(um, r) * dot(un, r);
}

/** Screening factor f(R) for a centre-to-centre distance R (nm). */
export function screeningFactor(s: Screening, distanceNm: number): number {
  switch (s.kind) {
    case 'none':
      return 1;
    case 'constant':
      return 1 / (s.refractiveIndex * s.refractiveIndex);
    case 'exponential':
      return s.amplitude * Math.exp(-s.decayPerNm * distanceNm) + s.offset;
  }
}

/** Check a screening description and throw an InputError naming what is wrong. */
export function validateScreening(s: Screening): void {
  if (s.kind === 'constant' && !(Number.isFinite(s.refractiveIndex) && s.refractiveIndex > 0)) {
    throw new InputError(`screening refractive index must be a positive number, got ${s.refractiveIndex}`);
  }
  if (s.kind === 'exponential') {
    for (const [k, v] of Object.entries({ amplitude: s.amplitude, decayPerNm: s.decayPerNm, offset: s.offset })) {
      if (!Number.isFinite(v)) throw new InputError(`exponential screening ${k} must be finite, got ${v}`);
    }
  }
}

/** A dipole as the coupling functions need it. */
export interface DipoleSpec {
  readonly position: Vec3;
  /** Unit direction. */
  readonly direction: Vec3;
  /** Strength, D. */
  readonly dipole: number;
  /** Length between the two point charges of the extended dipole, nm. */
  readonly length?: number;
}

/** |b - a|. */
function distance(a: Vec3, b: Vec3): number {
  return norm3(b[0] - a[0], b[1] - a[1], b[2] - a[2]);
}

/** Point-dipole coupling J = 5.0341 f kappa mu_m mu_n / R^3, cm^-1 (CONVENTIONS.md). */
export function pointDipoleCoupling(m: DipoleSpec, n: DipoleSpec, screening: Screening = { kind: 'none' }): number {
  const a = m.position, b = n.position;
  const dx = b[0] - a[0], dy = b[1] - a[1], dz = b[2] - a[2];
  const R = norm3(dx, dy, dz);
  if (!(R > 0)) throw new InputError('two dyes sit at the same position; the coupling is undefined');
  const kappa = orientationFactor(m.direction, n.direction, [dx / R, dy / R, dz / R]);
  return (DIPOLE_PREFACTOR_CM * screeningFactor(screening, R) * kappa * m.dipole * n.dipole) / (R * R * R);
}

/**
 * Extended-dipole coupling: charges +q and -q at +-l/2 along each dipole with q l = mu; the four
 * charge-charge Coulomb terms, screened with f at the centre-to-centre distance. Units: D, nm -> cm^-1.
 */
export function extendedDipoleCoupling(m: DipoleSpec, n: DipoleSpec, screening: Screening = { kind: 'none' }): number {
  const lm = m.length, ln = n.length;
  if (!(lm !== undefined && lm > 0 && ln !== undefined && ln > 0)) {
    throw new InputError('the extended-dipole coupling needs a positive dye length for both dyes');
  }
  const R = distance(m.position, n.position);
  if (!(R > 0)) throw new InputError('two dyes sit at the same position; the coupling is undefined');
  const qm = m.dipole / lm, qn = n.dipole / ln; // D/nm
  const a = m.position, u = m.direction, b = n.position, v = n.direction;
  let sum = 0;
  for (let sm = 1; sm >= -1; sm -= 2) {
    const p0 = a[0] + (sm * lm * u[0]) / 2, p1 = a[1] + (sm * lm * u[1]) / 2, p2 = a[2] + (sm * lm * u[2]) / 2;
    for (let sn = 1; sn >= -1; sn -= 2) {
      const q0 = b[0] + (sn * ln * v[0]) / 2, q1 = b[1] + (sn * ln * v[1]) / 2, q2 = b[2] + (sn * ln * v[2]) / 2;
      const d = norm3(q0 - p0, q1 - p1, q2 - p2);
      if (!(d > 0)) throw new InputError('two extended-dipole charges coincide; the dyes overlap');
      sum += (sm * sn) / d;
    }
  }
  return DIPOLE_PREFACTOR_CM * screeningFactor(screening, R) * qm * qn * sum;
}

/**
 * Coupling by the chosen method. 'auto' uses the extended dipole when both lengths are known and the
 * centres are closer than twice the longer dye, the point dipole otherwise (common practice).
 */
export function coupling(m: DipoleSpec, n: DipoleSpec, method: 'point-dipole' | 'extended-dipole' | 'auto', screening: Screening): number {
  if (method === 'point-dipole') return pointDipoleCoupling(m, n, screening);
  if (method === 'extended-dipole') return extendedDipoleCoupling(m, n, screening);
  const lm = m.length ?? 0, ln = n.length ?? 0;
  const R = distance(m.position, n.position);
  if (lm > 0 && ln > 0 && R < 2 * Math.max(lm, ln)) return extendedDipoleCoupling(m, n, screening);
  return pointDipoleCoupling(m, n, screening);
}
