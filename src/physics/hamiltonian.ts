import { InputError } from '../errors.js';
import { requireNumber, withDefaults } from '../options.js';
import { coupling, unit, validateScreening } from './couplings.js';
import type { CouplingMethod, ExcitonSystem, Screening, Site, Vec3 } from './types.js';
import { norm3 } from './norm3.js';

export interface SystemOptions {
  /** Trap (acceptor) site indices, 0-based. Default: none. */
  traps: readonly number[];
  /** Coupling method. Default 'auto' (extended dipole at close range when lengths are known). */
  couplingMethod: CouplingMethod;
  /** Screening. Default: none (vacuum). */
  screening: Screening;
  /** Explicit couplings (cm^-1) that override computed ones: [i, j, J] with 0-based i != j. */
  couplingOverrides: readonly (readonly [number, number, number])[];
  /** Loss rate (ps^-1) of a site without a lifetime. Default 0.001 (1 ns lifetime, common practice). */
  defaultLossRate: number;
  /** Reorganization energy (cm^-1) of a site without one. Default 0. */
  defaultReorganization: number;
  /** Smallest allowed centre-to-centre distance, nm. Default 0.05 (two dyes "at the same place"). */
  minDistance: number;
}

export const SYSTEM_DEFAULTS: SystemOptions = {
  traps: [],
  couplingMethod: 'auto',
  screening: { kind: 'none' },
  couplingOverrides: [],
  defaultLossRate: 0.001,
  defaultReorganization: 0,
  minDistance: 0.05,
};

/** Site i's `what`, as error messages name it. */
const siteField = (i: number, what: string) => `site ${i + 1} ${what}`;

const isFiniteNumber = (x: unknown): x is number => typeof x === 'number' && Number.isFinite(x);

function checkVec(i: number, what: string, v: Vec3): void {
  if (!Array.isArray(v) || v.length !== 3) throw new InputError(`${siteField(i, what)} must have three components`);
  for (let k = 0; k < 3; k++) if (!isFiniteNumber(v[k])) requireNumber(`${siteField(i, what)}[${k}]`, v[k]);
}

/**
 * requireNumber with the name built only when the check fails: buildSystem runs for every disorder sample,
 * and building seven names per site took a tenth of its time.
 */
function checkNumber(i: number, what: string, x: unknown, rule: 'any' | 'nonnegative' | 'positive' = 'any'): void {
  if (isFiniteNumber(x) && (rule === 'any' || (rule === 'positive' ? x > 0 : x >= 0))) return;
  requireNumber(siteField(i, what), x, rule);
}

/** Check trap indices against the number of sites. */
export function checkTraps(traps: readonly number[], n: number): void {
  const seen = new Set<number>();
  for (const t of traps) {
    if (!Number.isInteger(t) || t < 0 || t >= n) {
      throw new InputError(`trap site ${Number.isInteger(t) ? t + 1 : t} is out of range: sites are numbered 1 to ${n}`);
    }
    if (seen.has(t)) throw new InputError(`trap site ${t + 1} is listed twice`);
    seen.add(t);
  }
}

/** Build the excitonic system (Hamiltonian, traps, baths, loss, dipoles) of an array of dyes. */
export function buildSystem(sites: readonly Site[], options?: Partial<SystemOptions>): ExcitonSystem {
  const o = withDefaults('buildSystem', SYSTEM_DEFAULTS, options);
  const n = sites.length;
  if (n < 1) throw new InputError('an array needs at least one dye');
  validateScreening(o.screening);
  checkTraps(o.traps, n);
  const specs = sites.map((s, i) => {
    checkVec(i, 'position', s.position);
    checkVec(i, 'direction', s.direction);
    checkNumber(i, 'dipole strength', s.dipole, 'positive');
    checkNumber(i, 'energy', s.energy);
    if (s.reorganization !== undefined) checkNumber(i, 'reorganization energy', s.reorganization, 'nonnegative');
    if (s.lifetime !== undefined) checkNumber(i, 'lifetime', s.lifetime, 'positive');
    if (s.length !== undefined) checkNumber(i, 'length', s.length, 'positive');
    return { position: s.position, direction: unit(s.direction, i), dipole: s.dipole, length: s.length };
  });
  // one backing store for the Hamiltonian and the dipoles (typed arrays of more than 64 bytes are allocated off the heap)
  const store = new Float64Array(n * n + 3 * n);
  const H = store.subarray(0, n * n), dipoles = store.subarray(n * n);
  for (let i = 0; i < n; i++) {
    H[i * n + i] = sites[i].energy;
    for (let j = i + 1; j < n; j++) {
      const a = specs[i].position, b = specs[j].position;
      const R = norm3(a[0] - b[0], a[1] - b[1], a[2] - b[2]);
      if (R < o.minDistance) {
        throw new InputError(`sites ${i + 1} and ${j + 1} are ${R.toPrecision(3)} nm apart, closer than ${o.minDistance} nm: two dyes cannot share a place`);
      }
      const J = coupling(specs[i], specs[j], o.couplingMethod, o.screening);
      H[i * n + j] = J;
      H[j * n + i] = J;
    }
  }
  for (const [i, j, J] of o.couplingOverrides) {
    if (!Number.isInteger(i) || !Number.isInteger(j) || i < 0 || j < 0 || i >= n || j >= n || i === j) {
      throw new InputError(`coupling override [${i + 1}, ${j + 1}] must name two different sites between 1 and ${n}`);
    }
    requireNumber(`coupling override [${i + 1}, ${j + 1}]`, J);
    H[i * n + j] = J;
    H[j * n + i] = J;
  }
  const reorganization = new Float64Array(n), lossRates = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const s = specs[i], site = sites[i];
    for (let k = 0; k < 3; k++) dipoles[i * 3 + k] = s.dipole * s.direction[k];
    reorganization[i] = site.reorganization ?? o.defaultReorganization;
    lossRates[i] = site.lifetime !== undefined ? 1 / site.lifetime : o.defaultLossRate;
  }
  return { n, hamiltonian: H, traps: [...o.traps], reorganization, lossRates, dipoles };
}

/**
 * An excitonic system from an explicit Hamiltonian (cm^-1, row-major or nested rows), for users who bring
 * their own. Checks symmetry and finiteness.
 */
export function systemFromHamiltonian(
  h: readonly (readonly number[])[] | Float64Array,
  opts: { traps: readonly number[]; lossRate?: number | readonly number[]; reorganization?: number | readonly number[]; symmetryTolerance?: number },
): ExcitonSystem {
  let n: number;
  let H: Float64Array;
  if (h instanceof Float64Array) {
    n = Math.round(Math.sqrt(h.length));
    if (n * n !== h.length) throw new InputError(`a Hamiltonian must be square, got ${h.length} entries`);
    H = Float64Array.from(h);
  } else {
    n = h.length;
    if (n < 1) throw new InputError('the Hamiltonian is empty');
    H = new Float64Array(n * n);
    h.forEach((row, i) => {
      if (row.length !== n) throw new InputError(`the Hamiltonian must be square: row ${i + 1} has ${row.length} entries, expected ${n}`);
      row.forEach((v, j) => { H[i * n + j] = requireNumber(`Hamiltonian entry (${i + 1}, ${j + 1})`, v); });
    });
  }
  for (let i = 0; i < n * n; i++) requireNumber(`Hamiltonian entry (${Math.floor(i / n) + 1}, ${(i % n) + 1})`, H[i]);
  const tol = opts.symmetryTolerance ?? 1e-9;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const a = H[i * n + j], b = H[j * n + i];
      if (Math.abs(a - b) > tol * Math.max(1, Math.abs(a), Math.abs(b))) {
        throw new InputError(`the Hamiltonian is not symmetric: entry (${i + 1}, ${j + 1}) is ${a} but (${j + 1}, ${i + 1}) is ${b}`);
      }
      const m = (a + b) / 2;
      H[i * n + j] = m;
      H[j * n + i] = m;
    }
  }
  checkTraps(opts.traps, n);
  return {
    n,
    hamiltonian: H,
    traps: [...opts.traps],
    reorganization: perSite('reorganization energy', opts.reorganization ?? 0, n, 'nonnegative'),
    lossRates: perSite('loss rate', opts.lossRate ?? 0.001, n, 'nonnegative'),
  };
}

/** Expand a number or a per-site list into a checked Float64Array of length n. */
export function perSite(name: string, v: number | readonly number[], n: number, rule: 'any' | 'nonnegative' | 'positive'): Float64Array {
  if (typeof v === 'number') {
    requireNumber(name, v, rule);
    return new Float64Array(n).fill(v);
  }
  if (v.length !== n) throw new InputError(`${name}: expected one value per site (${n}), got ${v.length}`);
  return Float64Array.from(v, (x, i) => requireNumber(`${name} of site ${i + 1}`, x, rule));
}
