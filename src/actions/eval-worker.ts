// Worker thread: takes tasks of a batch (a point's nominal metrics, or one disorder sample of a point) from the
// counter shared by all workers until none is left, for one job. Started by pool.ts.
import { parentPort, workerData } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts } from './evaluator.js';
import type { BatchMessage, BatchReply } from './pool.js';

const { constraints, objective } = workerData as { constraints: ConstraintSet; objective: Objective };
const parts = makeEvaluatorParts(constraints, objective);
parentPort!.on('message', (m: BatchMessage) => {
  const ctl = new Int32Array(m.control);
  const P = m.points.length, S = m.samples, total = P * (1 + S);
  const designs: ReturnType<typeof parts.design>[] = [];
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
  parentPort!.postMessage(reply);
});
