import { Worker } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts, type EnsemblePart, type Evaluation, type NominalPart } from './evaluator.js';

type Parts = ReturnType<typeof makeEvaluatorParts>;

/**
 * A batch as every thread receives it. `control` is shared: entry 0 counts the tasks taken, entry 1 + j is set
 * when point j's nominal evaluation failed. Task t < P is point t's nominal metrics, task P + j S + k is
 * sample k of point j's disorder ensemble (P points, S samples each).
 */
export interface BatchMessage { id: number; points: Record<string, unknown>[]; samples: number; control: SharedArrayBuffer }
/** What one thread computed: nominal parts by point, one-sample ensemble parts by j S + k. */
export interface BatchReply { id: number; nominal: [number, NominalPart][]; samples: [number, EnsemblePart][] }

/** Take tasks of a batch from its shared counter until none is left (on any thread). */
export function runTasks(parts: Parts, m: BatchMessage): BatchReply {
  const ctl = new Int32Array(m.control);
  const P = m.points.length, S = m.samples, total = P * (1 + S);
  const designs: ReturnType<Parts['design']>[] = [];
  const designOf = (j: number) => (designs[j] ??= parts.design(m.points[j]));
  const reply: BatchReply = { id: m.id, nominal: [], samples: [] };
  for (let task = Atomics.add(ctl, 0, 1); task < total; task = Atomics.add(ctl, 0, 1)) {
    if (task < P) {
      const n = parts.nominalOf(designOf(task));
      // a point whose nominal evaluation failed is scored as failed: its samples are not needed
      if (n.error !== undefined) Atomics.store(ctl, 1 + task, 1);
      reply.nominal.push([task, n]);
      continue;
    }
    const j = Math.floor((task - P) / S), k = task - P - j * S;
    if (Atomics.load(ctl, 1 + j) === 1) continue;
    reply.samples.push([task - P, parts.ensembleOf(designOf(j), k, k + 1)]);
  }
  return reply;
}

/**
 * A fixed pool of `size` threads that score batches of decoded points for one job: the main thread and size - 1
 * worker threads. The work of a batch is cut into tasks (each point's nominal metrics first, then each disorder
 * sample of each point) that the threads take one at a time from a shared counter until none is left, so that
 * a thread that drew cheap tasks takes more and none waits for another (the cost of a sample varies: some fall
 * back to the dense solver), and the main thread works instead of waiting while the workers wake up. Samples of
 * a point whose nominal evaluation already failed are skipped. The one-sample parts are put back in sample order
 * and combined exactly as a single thread would, so results do not depend on the number of threads or on which
 * took which task.
 */
export class EvaluationPool {
  private readonly workers: Worker[];
  private readonly parts: Parts;
  private next = 0;
  private readonly pending = new Map<number, (r: BatchReply) => void>();
  private failure: Error | undefined;

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    this.parts = makeEvaluatorParts(constraints, objective);
    const url = new URL('./eval-worker.js', import.meta.url);
    this.workers = Array.from({ length: Math.max(0, size - 1) }, () => {
      const w = new Worker(url, { workerData: { constraints, objective } });
      w.on('message', (m: BatchReply) => {
        const done = this.pending.get(m.id);
        this.pending.delete(m.id);
        done?.(m);
      });
      w.on('error', (e) => {
        this.failure = e;
        for (const done of this.pending.values()) done({ id: -1, nominal: [], samples: [] });
        this.pending.clear();
      });
      return w;
    });
  }

  async evaluate(points: Record<string, unknown>[]): Promise<Evaluation[]> {
    const P = points.length;
    if (P === 0) return [];
    const S = this.parts.robust ? this.parts.samples : 0;
    const control = new SharedArrayBuffer(4 * (1 + P));
    const message = (id: number): BatchMessage => ({ id, points, samples: S, control });
    const waiting = this.workers.map((w) => {
      const id = this.next++;
      return new Promise<BatchReply>((resolve) => {
        this.pending.set(id, resolve);
        w.postMessage(message(id));
      });
    });
    const own = runTasks(this.parts, message(-1));
    const replies = [own, ...(await Promise.all(waiting))];
    if (this.failure) throw this.failure;
    const nominal: NominalPart[] = new Array(P);
    const samples: EnsemblePart[] = new Array(P * S);
    for (const r of replies) {
      for (const [j, n] of r.nominal) nominal[j] = n;
      for (const [i, e] of r.samples) samples[i] = e;
    }
    return points.map((_, j) => this.parts.combine(nominal[j], this.parts.robust && nominal[j].error === undefined ? samples.slice(j * S, (j + 1) * S) : []));
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
