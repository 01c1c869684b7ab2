import { InputError } from '../errors.js';
import { requireNumber } from '../options.js';
import { degToRad } from '../physics/constants.js';
import type { Site, Vec3 } from '../physics/types.js';
import { Rng } from '../search/rng.js';
import { norm3 } from '../physics/norm3.js';

/**
 * Static disorder: Gaussian site-energy offsets (sigma, cm^-1), isotropic Gaussian position jitter (sigma per
 * axis, nm) and dipole tilts (sigma of the tilt angle, degrees). Defaults are common practice for dyes on DNA
 * or peptide scaffolds: 100 cm^-1 inhomogeneous width, 0.1 nm, 10 degrees.
 */
export interface DisorderModel {
  energySigma: number;
  positionJitter: number;
  orientationJitter: number;
  samples: number;
  seed: number;
}

export const DISORDER_DEFAULTS: DisorderModel = { energySigma: 100, positionJitter: 0.1, orientationJitter: 10, samples: 32, seed: 1 };

/** Most disorder samples per candidate. */
export const MAX_DISORDER_SAMPLES = 10_000;

/**
 * The standard-normal draws of an ensemble, made once per run and reused for every candidate (common random
 * numbers), so that differences between candidates are not sampling noise. Each sample has, per site, one
 * energy draw, three position draws and three orientation draws.
 */
export interface DisorderEnsemble {
  readonly model: DisorderModel;
  readonly maxSites: number;
  /** draws[k][7 * m + j]. */
  readonly draws: readonly Float64Array[];
}

export function makeEnsemble(model: DisorderModel, maxSites: number): DisorderEnsemble {
  requireNumber('disorder energy sigma', model.energySigma, 'nonnegative');
  requireNumber('disorder position jitter', model.positionJitter, 'nonnegative');
  requireNumber('disorder orientation jitter', model.orientationJitter, 'nonnegative');
  if (!Number.isInteger(model.samples) || model.samples < 1 || model.samples > MAX_DISORDER_SAMPLES) {
    throw new InputError(`disorder samples must be an integer from 1 to ${MAX_DISORDER_SAMPLES}, got ${model.samples}`);
  }
  const rng = Rng.fromSeed(model.seed);
  const draws = Array.from({ length: model.samples }, () => Float64Array.from({ length: 7 * maxSites }, () => rng.normal()));
  return { model, maxSites, draws };
}

/** Rotate unit u by a small random tilt: add a Gaussian perpendicular component and renormalize. */
function tilt(u: Vec3, g: ArrayLike<number>, offset: number, sigmaRad: number): Vec3 {
  const len = norm3(u[0], u[1], u[2]);
  const e: Vec3 = [u[0] / len, u[1] / len, u[2] / len];
  const d = [g[offset] * sigmaRad, g[offset + 1] * sigmaRad, g[offset + 2] * sigmaRad];
  const along = d[0] * e[0] + d[1] * e[1] + d[2] * e[2];
  const v: Vec3 = [e[0] + d[0] - along * e[0], e[1] + d[1] - along * e[1], e[2] + d[2] - along * e[2]];
  const n = norm3(v[0], v[1], v[2]);
  return [v[0] / n, v[1] / n, v[2] / n];
}

/** The array as disorder sample k sees it. */
export function applyDisorder(sites: readonly Site[], ens: DisorderEnsemble, k: number): Site[] {
  if (sites.length > ens.maxSites) throw new InputError(`the disorder ensemble was made for ${ens.maxSites} sites, the array has ${sites.length}`);
  const g = ens.draws[k];
  const { energySigma, positionJitter, orientationJitter } = ens.model;
  const sr = degToRad(orientationJitter);
  return sites.map((s, m) => {
    const o = 7 * m;
    return {
      ...s,
      energy: s.energy + energySigma * g[o],
      position: [s.position[0] + positionJitter * g[o + 1], s.position[1] + positionJitter * g[o + 2], s.position[2] + positionJitter * g[o + 3]],
      direction: sr > 0 ? tilt(s.direction, g, o + 4, sr) : s.direction,
    };
  });
}
