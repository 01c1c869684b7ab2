/**
 * Documented option objects: every optimizer family lists its options with a default and a
 * description; unknown keys and values of the wrong type are rejected with an InputError.
 */
import { InputError } from '../errors.js';

export type OptionType = 'number' | 'integer' | 'boolean' | 'string';

export interface OptionField {
  type: OptionType;
  /** The default value, or undefined when the family computes it (then `defaultText` says how). */
  default?: number | boolean | string;
  defaultText?: string;
  description: string;
  min?: number;
  max?: number;
  /** For strings: the accepted values. */
  choices?: readonly string[];
  /** True when the lower bound is exclusive. */
  minExclusive?: boolean;
}

export type OptionSpec = Readonly<Record<string, OptionField>>;

export type ResolvedOptions = Record<string, number | boolean | string | undefined>;

function checkValue(owner: string, key: string, field: OptionField, value: unknown): void {
  const where = `option "${key}" of ${owner}`;
  if (field.type === 'boolean') {
    if (typeof value !== 'boolean') throw new InputError(`${where} must be true or false, got ${JSON.stringify(value)}`);
    return;
  }
  if (field.type === 'string') {
    if (typeof value !== 'string' || (field.choices && !field.choices.includes(value))) {
      const allowed = field.choices ? `one of ${field.choices.join(', ')}` : 'a string';
      throw new InputError(`${where} must be ${allowed}, got ${JSON.stringify(value)}`);
    }
    return;
  }
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new InputError(`${where} must be a finite number, got ${JSON.stringify(value)}`);
  }
  if (field.type === 'integer' && !Number.isInteger(value)) throw new InputError(`${where} must be an integer, got ${value}`);
  if (field.min !== undefined && (value < field.min || (field.minExclusive && value === field.min))) {
    throw new InputError(`${where} must be ${field.minExclusive ? 'above' : 'at least'} ${field.min}, got ${value}`);
  }
  if (field.max !== undefined && value > field.max) throw new InputError(`${where} must be at most ${field.max}, got ${value}`);
}

/** Merges `given` over the defaults of `spec`; throws InputError on unknown keys or bad values. */
export function resolveOptions(owner: string, spec: OptionSpec, given: Readonly<Record<string, unknown>> = {}): ResolvedOptions {
  if (given === null || typeof given !== 'object' || Array.isArray(given)) {
    throw new InputError(`options of ${owner} must be an object`);
  }
  const known = Object.keys(spec);
  const out: ResolvedOptions = {};
  for (const key of known) out[key] = spec[key].default;
  for (const [key, value] of Object.entries(given)) {
    if (!(key in spec)) {
      const list = known.length > 0 ? known.join(', ') : '(none)';
      throw new InputError(`unknown option "${key}" for ${owner}; known options: ${list}`, 'unknown-option');
    }
    if (value === undefined) continue;
    checkValue(owner, key, spec[key], value);
    out[key] = value as number | boolean | string;
  }
  return out;
}

/** A plain-text table of the options of a spec, for help texts and the README. */
export function describeOptions(spec: OptionSpec): string {
  return Object.entries(spec)
    .map(([key, f]) => `${key} (${f.type}, default ${f.default !== undefined ? JSON.stringify(f.default) : f.defaultText ?? 'none'}): ${f.description}`)
    .join('\n');
}
