import { InputError } from './errors.js';

/**
 * Merge a user's options object over documented defaults, rejecting keys that are not documented.
 * `what` names the routine in the error message.
 */
export function withDefaults<T extends object>(what: string, defaults: T, given: Partial<T> | undefined): T {
  if (given === undefined || given === null) return { ...defaults };
  if (typeof given !== 'object') throw new InputError(`${what}: options must be an object`);
  const out = { ...defaults } as Record<string, unknown>;
  // (runs on every transport evaluation: one pass, no key lists built unless a key is unknown)
  for (const k in given) {
    if (!Object.hasOwn(given, k)) continue;
    if (!Object.hasOwn(defaults, k)) throw new InputError(`${what}: unknown option '${k}' (known: ${Object.keys(defaults).join(', ')})`);
    const v = (given as Record<string, unknown>)[k];
    if (v !== undefined) out[k] = v;
  }
  return out as T;
}

/** Throw an InputError unless x is a finite number (and, optionally, not negative / positive). */
export function requireNumber(name: string, x: unknown, rule: 'any' | 'nonnegative' | 'positive' = 'any'): number {
  if (typeof x !== 'number' || !Number.isFinite(x)) throw new InputError(`${name} must be a finite number, got ${String(x)}`);
  if (rule === 'nonnegative' && x < 0) throw new InputError(`${name} must not be negative, got ${x}`);
  if (rule === 'positive' && !(x > 0)) throw new InputError(`${name} must be positive, got ${x}`);
  return x;
}
