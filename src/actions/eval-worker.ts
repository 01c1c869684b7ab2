// Worker thread of pool.ts: takes tasks of each batch it is sent from the shared counter until none is left.
import { type MessagePort, parentPort, workerData } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts } from './evaluator.js';
import { runTasks, type BatchMessage } from './pool.js';

const { constraints, objective, replies } = workerData as { constraints: ConstraintSet; objective: Objective; replies: MessagePort };
const parts = makeEvaluatorParts(constraints, objective);
parentPort!.on('message', (m: BatchMessage) => {
  replies.postMessage(runTasks(parts, m));
  // the reply is on the port: wake the main thread if it is blocked waiting for it
  const ctl = new Int32Array(m.control);
  Atomics.store(ctl, m.done, 1);
  Atomics.notify(ctl, m.done);
});
