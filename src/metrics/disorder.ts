import { InputError } from '../errors.js';
import { requireNumber } from '../options.js';
import { degToRad } from '../physics/constants.js';
import type { Site } from '../physics/types.js';
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

/**
 * The array as disorder sample k sees it. Runs for every sample of every candidate, so it makes one object and
 * two arrays per site, with Site's keys in the order the design space decodes them (one object shape for the
 * code that reads both). A dipole is tilted by adding a Gaussian component perpendicular to its unit direction
 * and renormalizing.
 */
export function applyDisorder(sites: readonly Site[], ens: DisorderEnsemble, k: number): Site[] {
  if (sites.length > ens.maxSites) throw new InputError(`the disorder ensemble was made for ${ens.maxSites} sites, the array has ${sites.length}`);
  const g = ens.draws[k];
  const { energySigma, positionJitter, orientationJitter } = ens.model;
  const sr = degToRad(orientationJitter);
  const out: Site[] = new Array(sites.length);
  for (let m = 0; m < sites.length; m++) {
    const s = sites[m], o = 7 * m, p = s.position;
    let direction = s.direction;
    if (sr > 0) {
      const u = s.direction, len = norm3(u[0], u[1], u[2]);
      const e0 = u[0] / len, e1 = u[1] / len, e2 = u[2] / len;
      const d0 = g[o + 4] * sr, d1 = g[o + 5] * sr, d2 = g[o + 6] * sr;
      const along = d0 * e0 + d1 * e1 + d2 * e2;
      const v0 = e0 + d0 - along * e0, v1 = e1 + d1 - along * e1, v2 = e2 + d2 - along * e2;
      const n = norm3(v0, v1, v2);
      direction = [v0 / n, v1 / n, v2 / n];
    }
    out[m] = {
      position: [p[0] + positionJitter * g[o + 1], p[1] + positionJitter * g[o + 2], p[2] + positionJitter * g[o + 3]],
      direction,
      energy: s.energy + energySigma * g[o],
      dipole: s.dipole,
      reorganization: s.reorganization,
      lifetime: s.lifetime,
      length: s.length,
      label: s.label,
    };
  }
  return out;
}
