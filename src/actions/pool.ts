import { Worker } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import type { Evaluation } from './evaluator.js';

/**
 * A fixed pool of worker threads that score batches of decoded points for one job. A batch is cut into one
 * contiguous chunk per worker and reassembled in order, so results do not depend on the number of workers.
 */
export class EvaluationPool {
  private readonly workers: Worker[];
  private next = 0;
  private readonly pending = new Map<number, (r: Evaluation[]) => void>();
  private failure: Error | undefined;

  constructor(size: number, constraints: ConstraintSet, objective: Objective) {
    const url = new URL('./eval-worker.js', import.meta.url);
    this.workers = Array.from({ length: size }, () => {
      const w = new Worker(url, { workerData: { constraints, objective } });
      w.on('message', (m: { id: number; results: Evaluation[] }) => {
        const done = this.pending.get(m.id);
        this.pending.delete(m.id);
        done?.(m.results);
      });
      w.on('error', (e) => { this.failure = e; for (const done of this.pending.values()) done([]); this.pending.clear(); });
      return w;
    });
  }

  async evaluate(points: Record<string, unknown>[]): Promise<Evaluation[]> {
    const k = this.workers.length;
    const size = Math.ceil(points.length / k);
    const parts = await Promise.all(this.workers.map((w, i) => {
      const chunk = points.slice(i * size, (i + 1) * size);
      if (chunk.length === 0) return Promise.resolve([] as Evaluation[]);
      const id = this.next++;
      return new Promise<Evaluation[]>((resolve) => { this.pending.set(id, resolve); w.postMessage({ id, points: chunk }); });
    }));
    if (this.failure) throw this.failure;
    return parts.flat();
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
