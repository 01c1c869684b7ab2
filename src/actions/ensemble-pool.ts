import { Worker } from 'node:worker_threads';
import type { Objective } from '../config/objective-types.js';
import { ModelError } from '../errors.js';
import type { Design, EnsembleEfficiencies } from '../metrics/evaluate.js';

/**
 * Worker threads that share out one design's disorder samples: the ensemble is cut into one contiguous chunk
 * per worker and the chunks are joined in sample order, so the result is the same for any number of workers.
 */
export class EnsemblePool {
  private readonly workers: Worker[];
  private next = 0;
  private readonly pending = new Map<number, (r: { result?: EnsembleEfficiencies; error?: string }) => void>();

  constructor(size: number, objective: Objective, maxSites: number, private readonly samples: number) {
    const url = new URL('./ensemble-worker.js', import.meta.url);
    this.workers = Array.from({ length: size }, () => {
      const w = new Worker(url, { workerData: { objective, maxSites } });
      w.on('message', (m: { id: number; result?: EnsembleEfficiencies; error?: string }) => {
        this.pending.get(m.id)?.(m);
        this.pending.delete(m.id);
      });
      return w;
    });
  }

  async efficiencies(design: Design): Promise<EnsembleEfficiencies> {
    const k = this.workers.length;
    const size = Math.ceil(this.samples / k);
    const parts = await Promise.all(this.workers.map((w, i) => new Promise<{ result?: EnsembleEfficiencies; error?: string }>((resolve) => {
      const id = this.next++;
      this.pending.set(id, resolve);
      w.postMessage({ id, design: { sites: design.sites, traps: design.traps }, from: i * size, to: Math.min(this.samples, (i + 1) * size) });
    })));
    const failed = parts.find((p) => p.error !== undefined);
    if (failed) throw new ModelError(failed.error!);
    return { etas: parts.flatMap((p) => p.result!.etas), skipped: parts.reduce((n, p) => n + p.result!.skipped, 0) };
  }

  async close(): Promise<void> {
    await Promise.all(this.workers.map((w) => w.terminate()));
  }
}
