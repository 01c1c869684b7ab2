// Worker thread of pool.ts: sleeps on its signal word until an order is posted on its batch port. An order is
// a job (the first, and again each time another pool takes the thread) or a batch, whose tasks it takes from
// the shared counter until none is left. It runs until the process ends (threads.ts keeps it between pools).
import { type MessagePort, receiveMessageOnPort, workerData } from 'node:worker_threads';
import { makeEvaluatorParts } from './evaluator.js';
import { unpackPoints } from './point-pack.js';
import { runTasks, type WorkerOrder } from './pool.js';

const { batches, replies, signal } = workerData as { batches: MessagePort; replies: MessagePort; signal: Int32Array };

/** The next order, sleeping on the signal word until there is one. */
function nextOrder(): WorkerOrder {
  for (;;) {
    // read the count before looking at the port: an order posted after the look changes the count first
    const seen = Atomics.load(signal, 0);
    const got = receiveMessageOnPort(batches);
    if (got) return got.message as WorkerOrder;
    Atomics.wait(signal, 0, seen);
  }
}

function serve(): void {
  let parts: ReturnType<typeof makeEvaluatorParts> | undefined;
  for (;;) {
    const m = nextOrder();
    if ('job' in m) {
      parts = makeEvaluatorParts(m.job.constraints, m.job.objective);
      continue;
    }
    replies.postMessage(runTasks(parts!, m, unpackPoints(m.points)));
    // the reply is on the port: wake the main thread if it is blocked waiting for it
    const ctl = new Int32Array(m.control);
    Atomics.store(ctl, m.done, 1);
    Atomics.notify(ctl, m.done);
  }
}

serve();
