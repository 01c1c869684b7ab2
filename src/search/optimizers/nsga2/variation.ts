/**
 * Variation operators of NSGA-II on the standardized box [0, 1]:
 * simulated binary crossover with bounds (Deb and Agrawal, Complex Systems 9, 1995; the bounded form
 * of Deb's NSGA-II reference code) and polynomial mutation (Deb and Goyal 1996, same code; both
 * described here from memory). Categorical blocks are exchanged whole (uniform crossover) and mutated
 * by drawing a new option.
 */
import type { Rng } from '../../rng.js';
import type { StandardSpace } from '../../core/types.js';

const EPS = 1e-14;

function clip(v: number): number {
  return v < 0 ? 0 : v > 1 ? 1 : v;
}

/** Bounded SBX of one coordinate; returns the two children values. */
export function sbxPair(a: number, b: number, eta: number, rng: Rng): [number, number] {
  if (Math.abs(a - b) <= EPS) return [a, b];
  const y1 = Math.min(a, b);
  const y2 = Math.max(a, b);
  const spread = (beta: number, u: number): number => {
    const alpha = 2 - Math.pow(beta, -(eta + 1));
    return u <= 1 / alpha ? Math.pow(u * alpha, 1 / (eta + 1)) : Math.pow(1 / (2 - u * alpha), 1 / (eta + 1));
  };
  const u = rng.uniform();
  const bq1 = spread(1 + (2 * y1) / (y2 - y1), u);
  const bq2 = spread(1 + (2 * (1 - y2)) / (y2 - y1), u);
  let c1 = clip(0.5 * (y1 + y2 - bq1 * (y2 - y1)));
  let c2 = clip(0.5 * (y1 + y2 + bq2 * (y2 - y1)));
  if (rng.uniform() < 0.5) [c1, c2] = [c2, c1];
  return [c1, c2];
}

/** Bounded polynomial mutation of one coordinate. */
export function polynomialMutation(y: number, eta: number, rng: Rng): number {
  const d1 = y;
  const d2 = 1 - y;
  const u = rng.uniform();
  const pow = 1 / (eta + 1);
  let dq: number;
  if (u < 0.5) {
    const v = 2 * u + (1 - 2 * u) * Math.pow(1 - d1, eta + 1);
    dq = Math.pow(v, pow) - 1;
  } else {
    const v = 2 * (1 - u) + 2 * (u - 0.5) * Math.pow(1 - d2, eta + 1);
    dq = 1 - Math.pow(v, pow);
  }
  return clip(y + dq);
}

export interface VariationSettings {
  crossoverRate: number;
  etaC: number;
  etaM: number;
  /** Probability to mutate each unit (real coordinate or categorical block). */
  mutationRate: number;
}

/** Two children of parents p and q. */
export function vary(p: Float64Array, q: Float64Array, space: StandardSpace, s: VariationSettings, rng: Rng): [Float64Array, Float64Array] {
  const c1 = p.slice();
  const c2 = q.slice();
  const inBlock = new Int32Array(space.dim).fill(-1);
  space.categorical.forEach((b, k) => inBlock.fill(k, b.offset, b.offset + b.width));
  const cross = rng.uniform() < s.crossoverRate;
  if (cross) {
    for (let j = 0; j < space.dim; j++) {
      if (inBlock[j] >= 0 || rng.uniform() >= 0.5) continue;
      [c1[j], c2[j]] = sbxPair(p[j], q[j], s.etaC, rng);
    }
    space.categorical.forEach((b) => {
      if (rng.uniform() < 0.5) {
        c1.set(q.subarray(b.offset, b.offset + b.width), b.offset);
        c2.set(p.subarray(b.offset, b.offset + b.width), b.offset);
      }
    });
  }
  for (const c of [c1, c2]) {
    for (let j = 0; j < space.dim; j++) {
      if (inBlock[j] < 0 && rng.uniform() < s.mutationRate) c[j] = polynomialMutation(c[j], s.etaM, rng);
    }
    space.categorical.forEach((b, k) => {
      if (rng.uniform() < s.mutationRate) space.setCategory(c, k, rng.int(b.width));
    });
  }
  return [c1, c2];
}
