// The evaluation worker threads of pool.ts, started and kept apart from the pool itself: this module loads
// nothing but node:worker_threads, so that a command can start its workers before it loads the (much larger)
// code of its action, and the workers load their own modules on the other core meanwhile.
import { MessageChannel, type MessagePort, Worker } from 'node:worker_threads';

export interface PoolWorker {
  worker: Worker;
  /** Batches go out on this port; the worker reads it without its event loop. */
  batches: MessagePort;
  /** Replies come back on this one, which the main thread can read without the event loop. */
  replies: MessagePort;
  /** Entry 0 counts the orders posted to this worker; the worker sleeps on it between batches. */
  signal: Int32Array;
  /** Set when the thread failed (also before a pool took it); onFailure tells the pool that owns it. */
  failure?: Error;
  onFailure?: (e: Error) => void;
}

/** Started workers no pool holds: not yet taken, or given back by a closed pool (warm: their code is compiled). */
const spare: PoolWorker[] = [];

/** Post an order on a worker's batch port and wake it. */
export function orderWorker(w: PoolWorker, m: unknown): void {
  w.batches.postMessage(m);
  Atomics.add(w.signal, 0, 1);
  Atomics.notify(w.signal, 0);
}

function startWorker(): PoolWorker {
  const out = new MessageChannel(), back = new MessageChannel();
  const signal = new Int32Array(new SharedArrayBuffer(4));
  const url = new URL('./eval-worker.js', import.meta.url);
  const worker = new Worker(url, { workerData: { batches: out.port2, replies: back.port2, signal }, transferList: [out.port2, back.port2] });
  const w: PoolWorker = { worker, batches: out.port1, replies: back.port1, signal };
  worker.on('error', (e) => {
    w.failure = e;
    w.onFailure?.(e);
  });
  return w;
}

/** Spare workers do not keep the process alive (a command that fails before a pool takes them still exits). */
function park(w: PoolWorker): void {
  w.worker.unref();
  w.replies.removeAllListeners('message');
  w.replies.unref();
  w.onFailure = undefined;
  spare.push(w);
}

/**
 * Have `count` worker threads ready for the next pool: start those missing now, before the job is known, so that
 * they load their modules (about 0.2 s) while the main thread loads its own and reads the configuration.
 */
export function startWorkers(count: number): void {
  while (spare.length < count) park(startWorker());
}

/** `count` workers for a pool: spare ones first (a sweep's later jobs reuse the first job's threads). */
export function takeWorkers(count: number): PoolWorker[] {
  const got = spare.splice(0, count).filter((w) => !w.failure);
  while (got.length < count) got.push(startWorker());
  for (const w of got) {
    w.worker.ref();
    w.replies.ref();
  }
  return got;
}

/** Give a closed pool's workers back (they wait for the next job), or stop them when they failed. */
export async function releaseWorkers(workers: PoolWorker[]): Promise<void> {
  const failed = workers.filter((w) => w.failure);
  for (const w of workers) if (!w.failure) park(w);
  await Promise.all(failed.map((w) => w.worker.terminate()));
}
