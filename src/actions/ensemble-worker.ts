// Worker thread: efficiencies of a chunk of one design's disorder samples. Started by ensemble-pool.ts.
import { parentPort, workerData } from 'node:worker_threads';
import type { Objective } from '../config/objective-types.js';
import { ensembleEfficiencies, type Design } from '../metrics/evaluate.js';
import { metricSettingsFrom } from './settings.js';

const { objective, maxSites } = workerData as { objective: Objective; maxSites: number };
const settings = metricSettingsFrom(objective, maxSites);
parentPort!.on('message', (m: { id: number; design: Design; from: number; to: number }) => {
  try {
    parentPort!.postMessage({ id: m.id, result: ensembleEfficiencies(m.design, settings, undefined, m.from, m.to) });
  } catch (e) {
    parentPort!.postMessage({ id: m.id, error: e instanceof Error ? e.message : String(e) });
  }
});
