/** A list of evaluated points that saves to and loads from plain-JSON state. */
import { loadEvaluated, saveEvaluated } from './evaluated.js';
import type { Evaluated } from './types.js';

export class EvaluatedList {
  protected items: Evaluated[] = [];

  all(): Evaluated[] {
    return [...this.items];
  }

  save(): unknown {
    return this.items.map(saveEvaluated);
  }

  load(v: unknown): void {
    this.items = (v as unknown[]).map(loadEvaluated);
  }
}
