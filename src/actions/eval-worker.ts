// Worker thread: scores decoded points of one job's design space. Started by pool.ts.
import { parentPort, workerData } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluator } from './evaluator.js';

const { constraints, objective } = workerData as { constraints: ConstraintSet; objective: Objective };
const evaluate = makeEvaluator(constraints, objective);
parentPort!.on('message', (msg: { id: number; points: Record<string, unknown>[] }) => {
  parentPort!.postMessage({ id: msg.id, results: msg.points.map(evaluate) });
});
