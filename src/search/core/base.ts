/**
 * Shared machinery of every optimizer: candidate ids, asked-but-untold bookkeeping, score checks,
 * the archive, progress reports and plain-JSON dump/load. A family implements four hooks:
 * propose (new points), absorb (scored points), saveSearch / loadSearch (its own state).
 */
import { InputError } from '../../errors.js';
import { Rng, type RngState } from '../rng.js';
import { hypervolume } from '../multi/hypervolume.js';
import type { ResolvedOptions } from '../options.js';
import { BestArchive } from './bestArchive.js';
import { plain } from './evaluated.js';
import { sanitizeScore, sanitizeViolation } from './compare.js';
import { ParetoArchive } from './paretoArchive.js';
import { f64, fromJson, toJson } from './state.js';
import type { Candidate, Evaluated, Optimizer, OptimizerContext, OptimizerState, Progress, Score } from './types.js';

/** A scored point handed back to the family, with the tag it gave when proposing it. */
export interface Told extends Evaluated {
  readonly tag: number;
}

export interface Proposal {
  x: Float64Array;
  /** Family-defined slot number (for example the index within a generation). */
  tag: number;
}

interface Pending {
  id: number;
  x: Float64Array;
  tag: number;
}

/** Evaluations used to fix the hypervolume reference point when none is given. */
export const REFERENCE_PROBE = 20;

export abstract class BaseOptimizer implements Optimizer {
  abstract readonly family: string;
  protected readonly space;
  protected readonly rng: Rng;
  protected readonly multi: boolean;
  /** Number of objectives: 1, or learned from the first scores when several. */
  protected m: number;
  private nextId = 0;
  private evaluations = 0;
  private outstanding = new Map<number, Pending>();
  private requeue: Pending[] = [];
  private best = new BestArchive();
  private front = new ParetoArchive();
  private reference: number[] | undefined;
  private probe: Float64Array[] = [];
  private hvCache = { version: -1, value: 0 };

  constructor(
    readonly name: string,
    protected readonly ctx: OptimizerContext,
    protected readonly options: ResolvedOptions,
    private readonly given: Record<string, unknown>,
  ) {
    this.space = ctx.space;
    this.rng = ctx.rng;
    this.multi = ctx.objectives === 'multi';
    this.m = this.multi ? 0 : 1;
    this.reference = ctx.reference ? [...ctx.reference] : undefined;
  }

  protected abstract propose(n: number): Proposal[];
  protected abstract absorb(results: Told[]): void;
  protected abstract saveSearch(): unknown;
  protected abstract loadSearch(data: unknown): void;
  protected detail(): Record<string, number | string> {
    return {};
  }

  get evaluationCount(): number {
    return this.evaluations;
  }

  ask(n = 1): Candidate[] {
    if (!Number.isInteger(n) || n < 1) throw new InputError(`ask(n) needs a positive integer, got ${n}`);
    const out: Pending[] = this.requeue.splice(0, n);
    if (out.length < n) {
      for (const p of this.propose(n - out.length)) out.push({ id: this.nextId++, x: p.x, tag: p.tag });
    }
    for (const p of out) this.outstanding.set(p.id, p);
    // The caller gets copies (views of one block), so changing them cannot disturb the optimizer.
    const dim = this.space.dim;
    const copies = new Float64Array(out.length * dim);
    return out.map((p, k) => {
      const x = copies.subarray(k * dim, (k + 1) * dim);
      x.set(p.x);
      return { id: p.id, x };
    });
  }

  tell(candidates: readonly Candidate[], scores: readonly Score[], violations?: readonly number[]): void {
    if (candidates.length !== scores.length) {
      throw new InputError(`tell: ${candidates.length} candidates but ${scores.length} scores`);
    }
    if (violations && violations.length !== candidates.length) {
      throw new InputError(`tell: ${candidates.length} candidates but ${violations.length} violations`);
    }
    if (this.m === 0) {
      const s = scores.find((v) => v !== null);
      if (typeof s === 'number') throw new InputError('tell: this run has several objectives, so each score must be an array');
      if (s) this.m = s.length;
    }
    const seen = new Set<number>();
    for (const c of candidates) {
      if (!this.outstanding.has(c.id) || seen.has(c.id)) {
        throw new InputError(`tell: candidate ${c.id} was not asked, or was already told`);
      }
      seen.add(c.id);
    }
    const told: Told[] = candidates.map((c, i) => {
      const p = this.outstanding.get(c.id)!;
      return { id: c.id, x: p.x, tag: p.tag, f: sanitizeScore(scores[i], this.m), violation: sanitizeViolation(violations?.[i]) };
    });
    for (const t of told) {
      this.outstanding.delete(t.id);
      this.evaluations++;
      // A Told is an Evaluated (plus its tag): archived as it is, no copy.
      if (this.multi) {
        this.front.insert(t);
        this.watchReference(t);
      } else this.best.insert(t);
    }
    if (this.multi) this.front.prune();
    this.absorb(told);
    this.ctx.onProgress?.(this.progress());
  }

  private watchReference(e: Evaluated): void {
    if (this.reference || this.probe.length >= REFERENCE_PROBE) return;
    if (e.violation === 0 && e.f.every(Number.isFinite)) this.probe.push(e.f);
    if (this.probe.length === REFERENCE_PROBE) {
      this.reference = Array.from({ length: this.m }, (_, k) => Math.max(...this.probe.map((f) => f[k])));
      this.hvCache.version = -1;
    }
  }

  recommend(): Evaluated | undefined {
    if (!this.multi) {
      const b = this.best.best();
      return b && plain(b);
    }
    const front = this.front.all();
    if (front.length === 0) return undefined;
    // A compromise point: smallest sum of objectives scaled to the front's ranges.
    const lo = Array.from({ length: this.m }, (_, k) => Math.min(...front.map((e) => e.f[k])));
    const hi = Array.from({ length: this.m }, (_, k) => Math.max(...front.map((e) => e.f[k])));
    const cost = (e: Evaluated) => e.f.reduce((s, v, k) => s + (hi[k] > lo[k] ? (v - lo[k]) / (hi[k] - lo[k]) : 0), 0);
    return plain(front.reduce((a, b) => (cost(b) < cost(a) ? b : a)));
  }

  archive(): Evaluated[] {
    return (this.multi ? this.front.all() : this.best.all()).map(plain);
  }

  progress(): Progress {
    const p: Progress = { optimizer: this.name, evaluations: this.evaluations, detail: this.detail() };
    if (!this.multi) {
      const b = this.best.best();
      if (b) p.best = b.f[0];
    } else if (this.reference) {
      if (this.hvCache.version !== this.front.version) {
        const feasible = this.front.all().filter((e) => e.violation === 0);
        this.hvCache = { version: this.front.version, value: hypervolume(feasible.map((e) => e.f), this.reference) };
      }
      p.hypervolume = this.hvCache.value;
      p.reference = [...this.reference];
    }
    return p;
  }

  dump(): OptimizerState {
    const pending = [...this.outstanding.values(), ...this.requeue].sort((a, b) => a.id - b.id);
    const data = {
      nextId: this.nextId,
      evaluations: this.evaluations,
      m: this.m,
      pending: pending.map((p) => ({ id: p.id, x: p.x, tag: p.tag })),
      archive: this.multi ? this.front.save() : this.best.save(),
      reference: this.reference ?? null,
      probe: this.probe,
      rng: this.rng.dump(),
      search: this.saveSearch(),
    };
    return { format: 'lumenfold-optimizer', version: 1, name: this.name, options: toJson(this.given) as Record<string, unknown>, data: toJson(data) };
  }

  load(state: OptimizerState): void {
    if (!state || state.format !== 'lumenfold-optimizer' || state.version !== 1) {
      throw new InputError('not a saved optimizer state (format lumenfold-optimizer, version 1)', 'bad-state');
    }
    if (state.name !== this.name) throw new InputError(`saved state belongs to optimizer "${state.name}", not "${this.name}"`, 'bad-state');
    const d = fromJson(state.data) as Record<string, unknown>;
    this.nextId = d.nextId as number;
    this.evaluations = d.evaluations as number;
    this.m = d.m as number;
    this.outstanding.clear();
    this.requeue = (d.pending as Pending[]).map((p) => ({ id: p.id, x: f64(p.x, 'pending x'), tag: p.tag }));
    this.hvCache.version = -1;
    if (this.multi) this.front.load(d.archive);
    else this.best.load(d.archive);
    this.reference = d.reference ? [...(d.reference as number[])] : undefined;
    this.probe = (d.probe as unknown[]).map((f) => f64(f, 'probe'));
    this.rng.restore(d.rng as RngState);
    this.loadSearch(d.search);
  }
}
