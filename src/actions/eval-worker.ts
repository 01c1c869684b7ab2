// Worker thread: the nominal metrics of some points of a batch and a chunk of every point's disorder
// ensemble, for one job. Started by pool.ts.
import { parentPort, workerData } from 'node:worker_threads';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';
import { makeEvaluatorParts } from './evaluator.js';

const { constraints, objective } = workerData as { constraints: ConstraintSet; objective: Objective };
const parts = makeEvaluatorParts(constraints, objective);
parentPort!.on('message', (m: { id: number; points: Record<string, unknown>[]; nominal: number[]; from: number; to: number }) => {
  const nominal = m.nominal.map((j) => parts.nominal(m.points[j]));
  const ensembles = m.to > m.from ? m.points.map((p) => parts.ensemble(p, m.from, m.to)) : null;
  parentPort!.postMessage({ id: m.id, nominal, ensembles });
});
