/** Saving and restoring evaluated points in plain-JSON state. */
import { InputError } from '../../errors.js';
import { f64 } from './state.js';
import type { Evaluated } from './types.js';

export interface SavedEvaluated {
  id: number;
  x: number[];
  f: number[];
  violation: number;
}

export function saveEvaluated(e: Evaluated): SavedEvaluated {
  return { id: e.id, x: Array.from(e.x), f: Array.from(e.f), violation: e.violation };
}

export function loadEvaluated(v: unknown): Evaluated {
  const rec = v as Partial<SavedEvaluated> | null;
  if (!rec || typeof rec.id !== 'number' || typeof rec.violation !== 'number') {
    throw new InputError('saved search state is damaged: an evaluated point lacks id or violation', 'bad-state');
  }
  return { id: rec.id, x: f64(rec.x, 'x'), f: f64(rec.f, 'f'), violation: rec.violation };
}

/** The evaluated point without optimizer bookkeeping (drops a Told's tag). */
export function plain(e: Evaluated): Evaluated {
  return { id: e.id, x: e.x, f: e.f, violation: e.violation };
}
