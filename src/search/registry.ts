/**
 * The optimizer registry: a name maps to a family plus a preset of its options. Variants are
 * named presets of a family ('de-rand1bin' and 'de-current-to-best1' are both the 'de' family),
 * not subclasses. Built-in optimizers are registered in builtins.ts.
 */
import { InputError } from '../errors.js';
import type { Family } from './core/family.js';
import type { Optimizer, OptimizerContext, OptimizerState } from './core/types.js';
import { resolveOptions, type OptionSpec } from './options.js';

interface Entry {
  name: string;
  family: Family;
  preset: Record<string, unknown>;
  description: string;
}

const entries = new Map<string, Entry>();

/** Registers `name` as `family` with fixed `preset` options. Throws if the name is taken. */
export function registerOptimizer(name: string, family: Family, preset: Record<string, unknown> = {}, description?: string): void {
  if (entries.has(name)) throw new InputError(`optimizer "${name}" is already registered`);
  resolveOptions(`optimizer "${name}"`, family.options, preset); // the preset itself must be valid
  entries.set(name, { name, family, preset, description: description ?? family.description });
}

export function optimizerNames(): string[] {
  return [...entries.keys()].sort();
}

export interface OptimizerInfo {
  name: string;
  family: string;
  description: string;
  multiObjective: boolean;
  /** Options fixed by this variant. */
  preset: Record<string, unknown>;
  /** Options a caller may set, with defaults. */
  options: OptionSpec;
}

function entry(name: string): Entry {
  const e = entries.get(name);
  if (!e) throw new InputError(`unknown optimizer "${name}"; available: ${optimizerNames().join(', ')}`, 'unknown-optimizer');
  return e;
}

export function describeOptimizer(name: string): OptimizerInfo {
  const e = entry(name);
  const options = Object.fromEntries(Object.entries(e.family.options).filter(([k]) => !(k in e.preset)));
  return { name, family: e.family.family, description: e.description, multiObjective: e.family.multiObjective, preset: { ...e.preset }, options };
}

/** Creates optimizer `name`; `options` are checked against the family's documented options. */
export function createOptimizer(name: string, ctx: OptimizerContext, options: Record<string, unknown> = {}): Optimizer {
  const e = entry(name);
  if (ctx.objectives === 'multi' && !e.family.multiObjective) {
    const multi = optimizerNames().filter((n) => entries.get(n)!.family.multiObjective);
    throw new InputError(`optimizer "${name}" handles one objective; for several use one of: ${multi.join(', ')}`, 'single-objective-only');
  }
  for (const key of Object.keys(options)) {
    if (key in e.preset) throw new InputError(`option "${key}" is fixed by optimizer "${name}"; pick another variant instead`);
  }
  const resolved = resolveOptions(`optimizer "${name}"`, e.family.options, { ...e.preset, ...options });
  return e.family.create(name, ctx, resolved, { ...options });
}

/** Re-creates an optimizer from a dump() and loads its state. */
export function restoreOptimizer(state: OptimizerState, ctx: OptimizerContext): Optimizer {
  if (!state || state.format !== 'lumenfold-optimizer') throw new InputError('not a saved optimizer state', 'bad-state');
  const opt = createOptimizer(state.name, ctx, state.options ?? {});
  opt.load(state);
  return opt;
}
