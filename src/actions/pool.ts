import { MessageChannel, type MessagePort, receiveMessageOnPort, Worker } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts, type EnsemblePart, type Evaluation, type NominalPart } from './evaluator.js';

type Parts = ReturnType<typeof makeEvaluatorParts>;

/**
 * A batch as every thread receives it. `control` is shared: entry 0 counts the tasks taken, entry 1 + j is set
 * when point j's nominal evaluation failed. Task t < P is point t's nominal metrics, task P + j C + c is
 * chunk c of point j's disorder ensemble (P points, S samples each, C = ceil(S / chunk) chunks of `chunk`).
 * `done` is the entry the worker sets (and notifies) once its reply is posted.
 */
export interface BatchMessage { id: number; points: Record<string, unknown>[]; samples: number; chunk: number; control: SharedArrayBuffer; done: number }
/** How long the main thread blocks for a worker's reply before it waits on the event loop instead, ms. */
const BLOCK_MS = 200;
/** What one thread computed: nominal parts by point, ensemble chunks by j C + c. */
export interface BatchReply { id: number; nominal: [number, NominalPart][]; samples: [number, EnsemblePart][] }

/**
 * Disorder samples per task for `threads` threads: each point's ensemble in about 2 x threads tasks, few enough
 * that taking and returning them costs little (one-sample tasks measured about 5% more CPU on the demo), and
 * enough that no thread waits long for another at the end of a batch.
 */
const samplesPerTask = (samples: number, threads: number): number => Math.max(1, Math.ceil(samples / (2 * threads)));
const chunksOf = (samples: number, chunk: number) => Math.ceil(samples / chunk);

/** Take tasks of a batch from its shared counter until none is left (on any thread). */
export function runTasks(parts: Parts, m: BatchMessage): BatchReply {
  const ctl = new Int32Array(m.control);
  const P = m.points.length, S = m.samples, C = chunksOf(S, m.chunk), total = P * (1 + C);
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
    const j = Math.floor((task - P) / C), c = task - P - j * C;
    if (Atomics.load(ctl, 1 + j) === 1) continue;
    reply.samples.push([task - P, parts.ensembleOf(designOf(j), c * m.chunk, Math.min(S, (c + 1) * m.chunk))]);
  }
  return reply;
}

/**
 * A fixed pool of `size` threads that score batches of decoded points for one job: the main thread and size - 1
 * worker threads. The work of a batch is cut into tasks (each point's nominal metrics first, then contiguous
 * chunks of each point's disorder samples) that the threads take one at a time from a shared counter until none
 * is left, so that a thread that drew cheap tasks takes more and none waits for another (the cost of a sample
 * varies: some fall back to the dense solver), and the main thread works instead of waiting while the workers
 * wake up. Samples of a point whose nominal evaluation already failed are skipped. The chunks are put back in
 * sample order and combined exactly as a single thread would, so results do not depend on the number of
 * threads or on which took which task.
 */
export class EvaluationPool {
  private readonly workers: { worker: Worker; replies: MessagePort }[];
  private readonly parts: Parts;
  private next = 0;
  private readonly pending = new Map<number, (r: BatchReply) => void>();
  private failure: Error | undefined;

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    this.parts = makeEvaluatorParts(constraints, objective);
    const url = new URL('./eval-worker.js', import.meta.url);
    this.workers = Array.from({ length: Math.max(0, size - 1) }, () => {
      // replies come back on a port of their own, which the main thread can read without the event loop
      const { port1, port2 } = new MessageChannel();
      const w = new Worker(url, { workerData: { constraints, objective, replies: port2 }, transferList: [port2] });
      port1.on('message', (m: BatchReply) => this.settle(m));
      w.on('error', (e) => {
        this.failure = e;
        for (const done of this.pending.values()) done({ id: -1, nominal: [], samples: [] });
        this.pending.clear();
      });
      return { worker: w, replies: port1 };
    });
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

  async evaluate(points: Record<string, unknown>[]): Promise<Evaluation[]> {
    const P = points.length;
    if (P === 0) return [];
    const S = this.parts.robust ? this.parts.samples : 0;
    const k = this.workers.length;
    // entries: the task counter, one failure flag per point, one reply flag per worker
    const control = new SharedArrayBuffer(4 * (1 + P + k));
    const ctl = new Int32Array(control);
    const chunk = samplesPerTask(S, k + 1);
    const message = (id: number, done: number): BatchMessage => ({ id, points, samples: S, chunk, control, done });
    const ids = this.workers.map(() => this.next++);
    const waiting = this.workers.map(({ worker }, i) => new Promise<BatchReply>((resolve) => {
      this.pending.set(ids[i], resolve);
      worker.postMessage(message(ids[i], 1 + P + i));
    }));
    const own = runTasks(this.parts, message(-1, -1));
    const replies = [own];
    for (let i = 0; i < k; i++) replies.push(await this.replyOf(i, ids[i], ctl, 1 + P + i, waiting[i]));
    if (this.failure) throw this.failure;
    const nominal: NominalPart[] = new Array(P);
    const C = chunksOf(S, chunk);
    const samples: EnsemblePart[] = new Array(P * C);
    for (const r of replies) {
      for (const [j, n] of r.nominal) nominal[j] = n;
      for (const [i, e] of r.samples) samples[i] = e;
    }
    return points.map((_, j) => this.parts.combine(nominal[j], this.parts.robust && nominal[j].error === undefined ? samples.slice(j * C, (j + 1) * C) : []));
  }

  async close(): Promise<void> {
    for (const { replies } of this.workers) replies.close();
    await Promise.all(this.workers.map(({ worker }) => worker.terminate()));
  }
}
