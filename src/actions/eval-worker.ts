// Worker thread of pool.ts: takes tasks of each batch it is sent from the shared counter until none is left.
import { parentPort, workerData } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts } from './evaluator.js';
import { runTasks, type BatchMessage } from './pool.js';

const { constraints, objective } = workerData as { constraints: ConstraintSet; objective: Objective };
const parts = makeEvaluatorParts(constraints, objective);
parentPort!.on('message', (m: BatchMessage) => parentPort!.postMessage(runTasks(parts, m)));
