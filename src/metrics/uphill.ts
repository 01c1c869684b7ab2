import { InputError } from '../errors.js';
import { symmetricEigen } from '../physics/linalg/symmetric-eigen.js';
import { evaluateTransport, type TransportOptions } from '../physics/transport.js';
import type { ExcitonSystem } from '../physics/types.js';

/** Lowest exciton energy of the donors alone (the Hamiltonian without the trap sites), cm^-1. */
export function lowestDonorExciton(sys: ExcitonSystem): number {
  const donors = [...Array(sys.n).keys()].filter((m) => !sys.traps.includes(m));
  if (donors.length === 0) throw new InputError('uphill metrics need at least one donor site');
  const k = donors.length;
  const H = new Float64Array(k * k);
  donors.forEach((i, a) => donors.forEach((j, b) => { H[a * k + b] = sys.hamiltonian[i * sys.n + j]; }));
  return symmetricEigen(H, k).values[0];
}

/** The system with every trap's site energy set to (donors' lowest exciton + step). */
export function withTrapStep(sys: ExcitonSystem, step: number): ExcitonSystem {
  const base = lowestDonorExciton(sys);
  const H = Float64Array.from(sys.hamiltonian);
  for (const t of sys.traps) H[t * sys.n + t] = base + step;
  return { ...sys, hamiltonian: H };
}

/** Efficiency when the trap sits `step` cm^-1 above the donors' lowest exciton. */
export function uphillEfficiency(sys: ExcitonSystem, t: TransportOptions, step: number): number {
  return evaluateTransport(withTrapStep(sys, step), t).efficiency;
}

/**
 * Largest step in [0, limit] (cm^-1) that keeps the efficiency at or above `threshold`, by bisection to
 * 0.5 cm^-1 (assumes the efficiency falls as the step grows, as it does at finite temperature). 0 when even a
 * level trap misses the threshold.
 */
export function uphillMaxStep(sys: ExcitonSystem, t: TransportOptions, threshold: number, limit: number): number {
  const ok = (s: number) => uphillEfficiency(sys, t, s) >= threshold;
  if (!ok(0)) return 0;
  if (ok(limit)) return limit;
  let lo = 0, hi = limit;
  while (hi - lo > 0.5) {
    const mid = (lo + hi) / 2;
    if (ok(mid)) lo = mid; else hi = mid;
  }
  return lo;
}
