/**
 * Ranking of evaluated points.
 * Scores: NaN and infinities (either sign) are replaced by +Infinity, the worst value, so a broken
 * evaluation never wins and never crashes a run.
 * Constraints: Deb's feasibility rules (Deb, "An efficient constraint handling method for genetic
 * algorithms", Comput. Methods Appl. Mech. Eng. 186, 2000): a feasible point beats an infeasible one,
 * two infeasible points compare by total violation, two feasible points by objective.
 * Several objectives: constrained domination (Deb et al., IEEE TEC 6(2), 2002, section VI).
 */
import { InputError } from '../../errors.js';
import type { Evaluated, Score } from './types.js';

function clean(v: number): number {
  return Number.isFinite(v) ? v : Infinity;
}

/**
 * Validates one score and returns it as a vector of `m` sanitized values (m = 1 for one objective).
 * A null score (not evaluated) is worst in every objective; while m is still unknown (0) it is a
 * single Infinity, which compares as Infinity in every objective (see objective()).
 */
export function sanitizeScore(score: Score, m: number): Float64Array {
  if (score === null) return new Float64Array(Math.max(1, m)).fill(Infinity);
  if (typeof score === 'number') {
    if (m !== 1) throw new InputError(`expected ${m} objective values, got a single number`, 'bad-score');
    const f = new Float64Array(1);
    f[0] = clean(score);
    return f;
  }
  if (!Array.isArray(score) && !ArrayBuffer.isView(score)) {
    throw new InputError(`a score must be a number or an array of numbers, got ${JSON.stringify(score)}`, 'bad-score');
  }
  const values = score as ArrayLike<unknown>;
  if (values.length !== m) throw new InputError(`expected ${m} objective value(s), got ${values.length}`, 'bad-score');
  const out = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const v = values[i];
    if (typeof v !== 'number') throw new InputError(`objective value ${i} is not a number: ${JSON.stringify(v)}`, 'bad-score');
    out[i] = clean(v);
  }
  // A vector with any broken component is worst in every component.
  if (out.some((v) => v === Infinity)) out.fill(Infinity);
  return out;
}

/** Sanitizes a violation: negative or NaN means "not given" (0), non-finite positive is Infinity. */
export function sanitizeViolation(v: number | undefined): number {
  if (v === undefined || Number.isNaN(v) || v <= 0) return 0;
  return v;
}

/** Negative when a is better than b (single objective, Deb's rules); 0 for a tie. */
export function compareSingle(a: Evaluated, b: Evaluated): number {
  if (a.violation > 0 || b.violation > 0) {
    if (a.violation !== b.violation) return a.violation < b.violation ? -1 : 1;
  }
  const fa = a.f[0];
  const fb = b.f[0];
  return fa < fb ? -1 : fa > fb ? 1 : 0;
}

/** Objective k of e; a missing component (an unevaluated point) counts as Infinity. */
export function objective(e: Evaluated, k: number): number {
  return k < e.f.length ? e.f[k] : Infinity;
}

/** True when a Pareto-dominates b (all objectives <=, one <), with constrained domination. */
export function dominates(a: Evaluated, b: Evaluated): boolean {
  if (a.violation > 0 || b.violation > 0) {
    if (a.violation !== b.violation) return a.violation < b.violation;
  }
  let strictly = false;
  const m = Math.max(a.f.length, b.f.length);
  for (let i = 0; i < m; i++) {
    const fa = objective(a, i);
    const fb = objective(b, i);
    if (fa > fb) return false;
    if (fa < fb) strictly = true;
  }
  return strictly;
}
