import { receiveMessageOnPort } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts, type EnsemblePart, type Evaluation, type NominalPart } from './evaluator.js';
import { packPoints, type PackedPoints } from './point-pack.js';
import { batchTasks, type TaskTable } from './tasks.js';
import { orderWorker, releaseWorkers, takeWorkers, type PoolWorker } from './threads.js';

export { startWorkers } from './threads.js';

type Parts = ReturnType<typeof makeEvaluatorParts>;

/**
 * A batch as a worker receives it: the points packed (point-pack.ts), the rest as the main thread's own share of
 * the work sees it. `control` is shared: entry 0 counts the tasks taken, entry 1 + j is set
 * when point j's nominal evaluation failed. `tasks` is the batch's task table (tasks.ts). `done` is the entry the
 * worker sets (and notifies) once its reply is posted.
 */
export interface BatchMessage { id: number; points: PackedPoints; tasks: Int32Array; control: SharedArrayBuffer; done: number }
/** What a worker finds on its batch port: the job it scores (first, and again when another pool takes it), or a batch. */
export type WorkerOrder = { job: { constraints: ConstraintSet; objective: Objective } } | BatchMessage;
/**
 * Batch numbers, unique in the process: a worker given back by a pool that failed mid-batch may still send that
 * batch's reply, which the next pool must not take for one of its own.
 */
let nextBatch = 0;
/** How long the main thread blocks for a worker's reply before it waits on the event loop instead, ms. */
const BLOCK_MS = 200;

/** What one thread computed: nominal parts by point, ensemble chunks by task index. */
export interface BatchReply { id: number; nominal: [number, NominalPart][]; samples: [number, EnsemblePart][] }

/** Take tasks of a batch of `points` from its shared counter until none is left (on any thread). */
export function runTasks(parts: Parts, m: Omit<BatchMessage, 'points'>, points: Record<string, unknown>[]): BatchReply {
  const ctl = new Int32Array(m.control);
  const { tasks } = m;
  const total = tasks.length / 3;
  const designs: ReturnType<Parts['design']>[] = [];
  const designOf = (j: number) => (designs[j] ??= parts.design(points[j]));
  const reply: BatchReply = { id: m.id, nominal: [], samples: [] };
  for (let task = Atomics.add(ctl, 0, 1); task < total; task = Atomics.add(ctl, 0, 1)) {
    const j = tasks[3 * task], from = tasks[3 * task + 1], to = tasks[3 * task + 2];
    if (from < 0) {
      const n = parts.nominalOf(designOf(j));
      // a point whose nominal evaluation failed is scored as failed: its samples are not needed
      if (n.error !== undefined) Atomics.store(ctl, 1 + j, 1);
      reply.nominal.push([j, n]);
      continue;
    }
    if (Atomics.load(ctl, 1 + j) === 1) continue;
    reply.samples.push([task, parts.ensembleOf(designOf(j), from, to)]);
  }
  return reply;
}

/**
 * A fixed pool of `size` threads that score batches of decoded points for one job: the main thread and size - 1
 * worker threads. The work of a batch is cut into tasks (each point's nominal metrics first, then contiguous
 * chunks of each point's disorder samples, smaller towards the end: tasks.ts) that the threads take one at a time
 * from a shared counter until none is left, so that a thread that drew cheap tasks takes more and none waits
 * long for another (the cost of a sample varies: some fall back to the dense solver), and the main thread works
 * instead of waiting while the workers wake up. Samples of a point whose nominal evaluation already failed are
 * skipped. The chunks are put back in sample order and combined exactly as a single thread would, so results
 * do not depend on the number of threads or on which took which task.
 * Between batches a worker sleeps in Atomics.wait on its signal word and reads its orders with
 * receiveMessageOnPort, so that no batch waits for a turn of its event loop. (Polling shared memory for a
 * few ms before sleeping, on either side, was tried: it gained nothing measurable here, and on a busy machine
 * a polling thread takes the core from one that computes.)
 */
export class EvaluationPool {
  private readonly workers: PoolWorker[];
  private readonly parts: Parts;
  private readonly pending = new Map<number, (r: BatchReply) => void>();
  private failure: Error | undefined;
  private readonly tables = new Map<string, TaskTable>();

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    this.parts = makeEvaluatorParts(constraints, objective);
    this.workers = takeWorkers(Math.max(0, size - 1));
    for (const w of this.workers) {
      w.replies.on('message', (m: BatchReply) => this.settle(m));
      w.onFailure = (e) => {
        this.failure = e;
        for (const done of this.pending.values()) done({ id: -1, nominal: [], samples: [] });
        this.pending.clear();
      };
      if (w.failure) this.failure = w.failure;
      orderWorker(w, { job: { constraints, objective } });
    }
  }

  private settle(m: BatchReply): void {
    const done = this.pending.get(m.id);
    this.pending.delete(m.id);
    done?.(m);
  }

  /**
   * Worker i's reply to batch `id`: once the main thread has run out of tasks the worker is at most one task
   * from done, so the main thread blocks on the shared flag (Atomics.wait) and reads the reply synchronously,
   * instead of paying an event-loop round trip (0.4 to 1.3 ms measured here) on every batch. A worker that takes
   * longer than BLOCK_MS (or has failed) is waited for on the event loop.
   */
  private async replyOf(i: number, id: number, ctl: Int32Array, done: number, waiting: Promise<BatchReply>): Promise<BatchReply> {
    if (Atomics.wait(ctl, done, 0, BLOCK_MS) !== 'timed-out') {
      const got = receiveMessageOnPort(this.workers[i].replies);
      if (got) {
        const m = got.message as BatchReply;
        this.pending.delete(m.id);
        if (m.id === id) return m;
        this.settle(m);
      }
    }
    return waiting;
  }

  private tableFor(P: number, S: number): TaskTable {
    const key = `${P}/${S}`;
    let t = this.tables.get(key);
    if (!t) this.tables.set(key, (t = batchTasks(P, S, this.workers.length + 1)));
    return t;
  }

  async evaluate(points: Record<string, unknown>[]): Promise<Evaluation[]> {
    const P = points.length;
    if (P === 0) return [];
    const S = this.parts.robust ? this.parts.samples : 0;
    const k = this.workers.length;
    const table = this.tableFor(P, S);
    // entries: the task counter, one failure flag per point, one reply flag per worker
    const control = new SharedArrayBuffer(4 * (1 + P + k));
    const ctl = new Int32Array(control);
    const packed = k > 0 ? packPoints(points) : { records: points };
    const message = (id: number, done: number): BatchMessage => ({ id, points: packed, tasks: table.tasks, control, done });
    const ids = this.workers.map(() => nextBatch++);
    const waiting = this.workers.map((w, i) => new Promise<BatchReply>((resolve) => {
      this.pending.set(ids[i], resolve);
      orderWorker(w, message(ids[i], 1 + P + i));
    }));
    const own = runTasks(this.parts, message(-1, -1), points);
    const replies = [own];
    for (let i = 0; i < k; i++) replies.push(await this.replyOf(i, ids[i], ctl, 1 + P + i, waiting[i]));
    if (this.failure) throw this.failure;
    const nominal: NominalPart[] = new Array(P);
    const samples: EnsemblePart[] = new Array(table.tasks.length / 3);
    for (const r of replies) {
      for (const [j, n] of r.nominal) nominal[j] = n;
      for (const [t, e] of r.samples) samples[t] = e;
    }
    const { first } = table;
    return points.map((_, j) => this.parts.combine(nominal[j], this.parts.robust && nominal[j].error === undefined ? samples.slice(first[j], first[j + 1]) : []));
  }

  /** Give the workers back for the next pool (threads.ts): they keep their compiled code. */
  async close(): Promise<void> {
    await releaseWorkers(this.workers);
  }
}
