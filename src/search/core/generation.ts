/**
 * One generation of a population method: its candidates are handed out in slot order, in batches of
 * any size, and the scores are stored by slot, so the result does not depend on how the caller
 * chunks ask() and tell(). `complete` turns true when every slot has its score.
 */
import { InputError } from '../../errors.js';
import type { Proposal, Told } from './base.js';
import { loadEvaluated, saveEvaluated } from './evaluated.js';
import { f64Rows } from './state.js';

export class Generation {
  private nextSlot = 0;
  private received = 0;
  readonly results: (Told | undefined)[];

  constructor(readonly xs: Float64Array[]) {
    this.results = new Array(xs.length).fill(undefined);
  }

  get size(): number {
    return this.xs.length;
  }

  /** Up to n not-yet-handed-out candidates of this generation. */
  take(n: number): Proposal[] {
    const out: Proposal[] = [];
    while (out.length < n && this.nextSlot < this.xs.length) {
      out.push({ x: this.xs[this.nextSlot], tag: this.nextSlot });
      this.nextSlot++;
    }
    return out;
  }

  put(t: Told): void {
    if (t.tag < 0 || t.tag >= this.xs.length || this.results[t.tag]) {
      throw new InputError(`internal: score for slot ${t.tag} does not fit the current generation`);
    }
    this.results[t.tag] = t;
    this.received++;
  }

  get complete(): boolean {
    return this.received === this.xs.length;
  }

  /** The scored points in slot order (call when complete). */
  scored(): Told[] {
    return this.results as Told[];
  }

  save(): unknown {
    return {
      xs: this.xs,
      nextSlot: this.nextSlot,
      results: this.results.map((r) => (r ? { ...saveEvaluated(r), tag: r.tag } : null)),
    };
  }

  static load(v: unknown): Generation {
    const rec = v as { xs: unknown; nextSlot: number; results: unknown[] };
    const g = new Generation(f64Rows(rec.xs, 'generation'));
    g.nextSlot = rec.nextSlot;
    rec.results.forEach((r, i) => {
      if (r) {
        g.results[i] = { ...loadEvaluated(r), tag: (r as { tag: number }).tag };
        g.received++;
      }
    });
    return g;
  }
}
