import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { basename, join, resolve } from 'node:path';
import { loadConfigFile } from '../config/load.js';
import { InterruptedError } from '../errors.js';
import { expandSweep } from '../config/sweep.js';
import { acquireLock } from '../output/run-lock.js';
import { writeFileAtomic } from '../output/atomic.js';
import { formatCsv } from '../output/csv.js';
import { checkSatisfiable } from './load-configs.js';
import { makeJob, searchSettings } from './job.js';
import { CHECKPOINT_FILE, executeJobInFolder, RESULT_FILE, type JobResult } from './execute.js';

export interface SweepRequest {
  sweepFile: string;
  out?: string;
  seed?: number;
  budget?: number;
  workers: number;
  /** Only write each point's job.json (for a runner elsewhere: lumenfold optimize --job FILE --out FOLDER). */
  planOnly?: boolean;
  /** Polled after every batch; true stops the sweep with a checkpoint in the current point's folder. */
  shouldStop?: () => boolean;
  onPoint?: (i: number, total: number, label: string, status: 'skipped' | 'planned' | 'running' | 'resuming' | 'done') => void;
}

/** A sweep point's result: the job's result plus where it sits in the sweep. */
export interface SweepPointResult extends JobResult {
  index: number;
  point: Record<string, unknown>;
}

/**
 * Run one optimization per sweep point into <out>/<id>/, then a summary table. A point whose result.json
 * exists (same id: same configs and search settings) is skipped, so a stopped sweep resumes where it left off.
 */
export async function sweep(req: SweepRequest): Promise<{ folder: string; points: (SweepPointResult & { status: 'skipped' | 'done' })[] }> {
  const sw = loadConfigFile(req.sweepFile, 'sweep');
  const jobs = expandSweep(sw, req.sweepFile);
  const folder = resolve(req.out ?? join('designs', 'sweeps', sw.name ?? basename(req.sweepFile).replace(/\.(ya?ml|json)$/, '')));
  // everything that can be refused is checked before the folder is touched
  for (const j of jobs) checkSatisfiable(j.constraints, j.objective, { constraints: `${req.sweepFile} [${j.label}] constraints`, objective: `${req.sweepFile} [${j.label}] objective` });
  const made = jobs.map((j) => makeJob(j.label, j.constraints, j.objective, searchSettings(j.objective, { seed: req.seed, budget: req.budget })));
  mkdirSync(folder, { recursive: true });
  const lock = acquireLock(join(folder, '.lock'));
  try {
    const points: (SweepPointResult & { status: 'skipped' | 'done' })[] = [];
    for (const j of jobs) {
      const job = made[j.index];
      const dir = join(folder, `${String(j.index).padStart(3, '0')}-${job.id}`);
      const resultFile = join(dir, RESULT_FILE);
      const place = { index: j.index, point: j.point };
      if (existsSync(resultFile)) {
        req.onPoint?.(j.index, jobs.length, j.label, 'skipped');
        points.push({ ...(JSON.parse(readFileSync(resultFile, 'utf8')) as JobResult), ...place, status: 'skipped' });
        continue;
      }
      if (req.planOnly) {
        mkdirSync(dir, { recursive: true });
        writeFileAtomic(join(dir, 'job.json'), JSON.stringify(job, null, 2) + '\n');
        req.onPoint?.(j.index, jobs.length, j.label, 'planned');
        continue;
      }
      const resuming = existsSync(join(dir, CHECKPOINT_FILE));
      req.onPoint?.(j.index, jobs.length, j.label, resuming ? 'resuming' : 'running');
      mkdirSync(dir, { recursive: true });
      const outcome = await executeJobInFolder(dir, job, { workers: req.workers, resume: resuming, shouldStop: req.shouldStop });
      if (outcome.stopped) {
        throw new InterruptedError(`sweep interrupted at point ${j.index + 1} of ${jobs.length} (${j.label}); a checkpoint is in ${dir}; run the same sweep again to continue`);
      }
      req.onPoint?.(j.index, jobs.length, j.label, 'done');
      points.push({ ...(JSON.parse(readFileSync(resultFile, 'utf8')) as JobResult), ...place, status: 'done' });
    }
    if (req.planOnly) return { folder, points };
    const metricNames = [...new Set(points.flatMap((p) => Object.keys(p.metrics)))];
    const axes = [...new Set(points.flatMap((p) => Object.keys(p.point)))];
    writeFileAtomic(join(folder, 'summary.csv'), formatCsv(
      ['index', 'id', ...axes, 'best_score', 'naive_score', ...metricNames],
      points.map((p) => [p.index, p.id, ...axes.map((a) => String(p.point[a])), p.best_score ?? '', p.naive_score ?? '', ...metricNames.map((m) => p.metrics[m])]),
    ));
    return { folder, points };
  } finally {
    lock.release();
  }
}
