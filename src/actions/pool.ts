import { Worker } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts, type EnsemblePart, type Evaluation, type NominalPart } from './evaluator.js';

interface Reply { id: number; nominal: NominalPart[]; ensembles: EnsemblePart[] | null }

/**
 * A fixed pool of worker threads that score batches of decoded points for one job. Worker i computes the
 * nominal metrics of points i, i + k, ... and the i-th contiguous chunk of every point's disorder samples; the
 * main thread joins the chunks in sample order and combines them exactly as a single thread would, so results
 * do not depend on the number of workers. Sharing out the ensemble keeps every worker busy even when a batch
 * has few feasible points. (Computing one share on the main thread instead of a worker measured slower.)
 */
export class EvaluationPool {
  private readonly workers: Worker[];
  private readonly parts: ReturnType<typeof makeEvaluatorParts>;
  private next = 0;
  private readonly pending = new Map<number, (r: Reply) => void>();
  private failure: Error | undefined;

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    this.parts = makeEvaluatorParts(constraints, objective);
    const url = new URL('./eval-worker.js', import.meta.url);
    this.workers = Array.from({ length: size }, () => {
      const w = new Worker(url, { workerData: { constraints, objective } });
      w.on('message', (m: Reply) => {
        const done = this.pending.get(m.id);
        this.pending.delete(m.id);
        done?.(m);
      });
      w.on('error', (e) => {
        this.failure = e;
        for (const done of this.pending.values()) done({ id: -1, nominal: [], ensembles: null });
        this.pending.clear();
      });
      return w;
    });
  }

  async evaluate(points: Record<string, unknown>[]): Promise<Evaluation[]> {
    const k = this.workers.length;
    const S = this.parts.robust ? this.parts.samples : 0;
    const chunk = Math.ceil(S / k);
    const replies = await Promise.all(this.workers.map((w, i) => {
      const nominal = points.map((_, j) => j).filter((j) => j % k === i);
      const from = Math.min(S, i * chunk), to = Math.min(S, (i + 1) * chunk);
      if (nominal.length === 0 && to <= from) return Promise.resolve<Reply>({ id: -1, nominal: [], ensembles: null });
      const id = this.next++;
      return new Promise<Reply>((resolve) => { this.pending.set(id, resolve); w.postMessage({ id, points, nominal, from, to }); });
    }));
    if (this.failure) throw this.failure;
    return points.map((_, j) => {
      const n = replies[j % k].nominal[Math.floor(j / k)];
      const chunks = this.parts.robust && n.error === undefined ? replies.filter((r) => r.ensembles).map((r) => r.ensembles![j]) : [];
      return this.parts.combine(n, chunks);
    });
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
