import { InputError } from '../errors.js';
import type { Start } from '../physics/models/common.js';

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A finite decimal number from an option value, or an InputError naming the option. */
export function parseNumber(option: string, text: string, rule: 'any' | 'nonnegative' | 'positive' = 'any'): number {
  const t = text.trim();
  if (!NUMBER.test(t)) throw new InputError(`${option}: '${text}' is not a finite number`);
  const v = Number(t);
  if (rule === 'nonnegative' && v < 0) throw new InputError(`${option}: must not be negative, got ${v}`);
  if (rule === 'positive' && !(v > 0)) throw new InputError(`${option}: must be positive, got ${v}`);
  return v;
}

/** A positive whole number (1, 2, ...); `what` names it in the error: a count unless said otherwise. */
export function parseCount(option: string, text: string, what = 'a positive whole number'): number {
  const t = text.trim();
  if (!/^\d+$/.test(t) || Number(t) < 1) throw new InputError(`${option}: '${text}' is not ${what} (1, 2, ...)`);
  return Number(t);
}

/** A 1-based site number. */
export function parseIndex(option: string, text: string): number {
  return parseCount(option, text, 'a site number');
}

/** Comma-separated 1-based site numbers, returned 0-based. */
export function parseSiteList(option: string, text: string): number[] {
  return text.split(',').map((s) => parseIndex(option, s) - 1);
}

/** --start: site:N, exciton:K, donors, or light[:T]. Returned 0-based. */
export function parseStart(text: string): Start {
  const [kind, arg] = text.split(':', 2);
  switch (kind) {
    case 'site': return { kind: 'site', site: parseIndex('--start site', arg ?? '') - 1 };
    case 'exciton': return { kind: 'exciton', state: parseCount('--start exciton', arg ?? '', 'an exciton number') - 1 };
    case 'donors':
      if (arg !== undefined) break;
      return { kind: 'donors' };
    case 'light': return arg === undefined ? { kind: 'light' } : { kind: 'light', temperature: parseNumber('--start light', arg, 'positive') };
  }
  throw new InputError(`--start: '${text}' is not one of site:N, exciton:K, donors, light[:T]`);
}

/** Most time points accepted by --times. */
export const MAX_TIME_POINTS = 100_000;

/** --times: END:COUNT (COUNT evenly spaced points from 0 to END ps) or a comma list of times in ps. */
export function parseTimes(text: string): number[] {
  if (text.includes(':')) {
    const [endText, countText] = text.split(':');
    const end = parseNumber('--times end', endText, 'positive');
    const count = parseCount('--times count', countText);
    if (count < 2 || count > MAX_TIME_POINTS) throw new InputError(`--times: count must be between 2 and ${MAX_TIME_POINTS}, got ${count}`);
    return Array.from({ length: count }, (_, i) => (end * i) / (count - 1));
  }
  const list = text.split(',').map((s) => parseNumber('--times', s, 'nonnegative'));
  if (list.length > MAX_TIME_POINTS) throw new InputError(`--times: at most ${MAX_TIME_POINTS} points`);
  for (let i = 1; i < list.length; i++) if (list[i] < list[i - 1]) throw new InputError('--times: times must be in increasing order');
  return list;
}
