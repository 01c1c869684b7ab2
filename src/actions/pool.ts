import { Worker } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts, type EnsemblePart, type Evaluation, type NominalPart } from './evaluator.js';

/**
 * A batch as every worker receives it. `control` is shared: entry 0 counts the tasks taken, entry 1 + j is set
 * when point j's nominal evaluation failed. Task t < P is point t's nominal metrics, task P + j S + k is
 * sample k of point j's disorder ensemble (P points, S samples each).
 */
export interface BatchMessage { id: number; points: Record<string, unknown>[]; samples: number; control: SharedArrayBuffer }
/** What one worker computed: nominal parts by point, one-sample ensemble parts by j S + k. */
export interface BatchReply { id: number; nominal: [number, NominalPart][]; samples: [number, EnsemblePart][] }

/**
 * A fixed pool of worker threads that score batches of decoded points for one job. The work of a batch is cut
 * into tasks (each point's nominal metrics first, then each disorder sample of each point) that the workers take
 * one at a time from a shared counter until none is left, so that a worker that drew cheap tasks takes more and
 * none waits for the other (the cost of a sample varies: some fall back to the dense solver). Samples of a point
 * whose nominal evaluation already failed are skipped. The main thread puts the one-sample parts back in sample
 * order and combines them exactly as a single thread would, so results do not depend on the number of workers
 * or on which worker took which task.
 */
export class EvaluationPool {
  private readonly workers: Worker[];
  private readonly parts: ReturnType<typeof makeEvaluatorParts>;
  private next = 0;
  private readonly pending = new Map<number, (r: BatchReply) => void>();
  private failure: Error | undefined;

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    this.parts = makeEvaluatorParts(constraints, objective);
    const url = new URL('./eval-worker.js', import.meta.url);
    this.workers = Array.from({ length: size }, () => {
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
    const replies = await Promise.all(this.workers.map((w) => {
      const id = this.next++;
      return new Promise<BatchReply>((resolve) => {
        this.pending.set(id, resolve);
        w.postMessage({ id, points, samples: S, control } satisfies BatchMessage);
      });
    }));
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
