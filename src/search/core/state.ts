/**
 * Plain-JSON state: typed arrays become plain arrays and non-finite numbers, which JSON cannot
 * hold, become {"$num": "Infinity" | "-Infinity" | "NaN"}. `toJson` output survives
 * JSON.stringify / JSON.parse unchanged, and `fromJson` restores the numbers.
 */
import { InputError } from '../../errors.js';

type Json = null | boolean | number | string | Json[] | { [key: string]: Json };

export function toJson(value: unknown): Json {
  if (typeof value === 'number') return Number.isFinite(value) ? value : { $num: String(value) };
  if (value === null || value === undefined) return null;
  if (typeof value === 'boolean' || typeof value === 'string') return value;
  if (ArrayBuffer.isView(value)) return Array.from(value as unknown as ArrayLike<number>, (v) => toJson(v));
  if (Array.isArray(value)) return value.map((v) => toJson(v));
  if (typeof value === 'object') {
    const out: { [key: string]: Json } = {};
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) if (v !== undefined) out[k] = toJson(v);
    return out;
  }
  throw new InputError(`cannot save a value of type ${typeof value} in a search state`);
}

export function fromJson(value: unknown): unknown {
  if (Array.isArray(value)) return value.map((v) => fromJson(v));
  if (value !== null && typeof value === 'object') {
    const rec = value as Record<string, unknown>;
    if (Object.keys(rec).length === 1 && typeof rec.$num === 'string') return Number(rec.$num);
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(rec)) out[k] = fromJson(v);
    return out;
  }
  return value;
}

/** Reads a saved numeric array back into a Float64Array (after fromJson). */
export function f64(value: unknown, what = 'array'): Float64Array {
  if (!Array.isArray(value) || !value.every((v) => typeof v === 'number')) {
    throw new InputError(`saved search state is damaged: ${what} is not a list of numbers`, 'bad-state');
  }
  return Float64Array.from(value as number[]);
}

/** Reads a saved matrix (list of rows) back. */
export function f64Rows(value: unknown, what = 'matrix'): Float64Array[] {
  if (!Array.isArray(value)) throw new InputError(`saved search state is damaged: ${what} is not a list`, 'bad-state');
  return value.map((row, i) => f64(row, `${what}[${i}]`));
}
