import { mkdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import pino from 'pino';
import type { Progress } from '../search/core/types.js';
import { InterruptedError } from '../errors.js';
import { createRunFolder, LOCK_FILE, writeFileAtomic } from '../output/atomic.js';
import { acquireLock } from '../output/run-lock.js';
import { executeJobInFolder, readJob, readJobFile } from './execute.js';
import { formatDesignFile } from '../output/design-file.js';
import { exportDesign } from './exports.js';
import { rankingCsv } from '../output/csv.js';
import { hashOf, makeJob, sha256Hex, searchSettings, type OptimizationJob } from './job.js';
import { loadDesignProblem } from './load-configs.js';
import type { OptimizationOutcome } from './optimize-core.js';
import { startWorkers } from './pool.js';
import { toRecord } from './records.js';
import { VERSION } from './version.js';

export interface OptimizeRequest {
  constraintsFile?: string;
  objectiveFile?: string;
  optimizer?: string;
  budget?: number;
  batch?: number;
  seed?: number;
  top?: number;
  workers: number;
  /** Run folder; default designs/runs/<name>-<job id>. */
  out?: string;
  force: boolean;
  /** Run this job file (configs and search settings in one record, as a sweep plan writes them). */
  jobFile?: string;
  /** Continue the interrupted run in this folder (its job and seed). */
  resume?: string;
  /** Polled after every batch; true stops the run with a checkpoint. */
  shouldStop?: () => boolean;
  onProgress?: (p: Progress, budget: number) => void;
}

export interface OptimizeSummary {
  format: 'lumenfold.run-summary/1';
  run_folder: string;
  optimizer: string;
  choice?: string;
  evaluations: number;
  failed_evaluations: number;
  disorder_samples_skipped: number;
  seconds: number;
  best: { name: string; score?: number; metrics: Record<string, number> } | undefined;
  naive_score?: number;
  files: string[];
}

/** Run an optimization (or continue one from its checkpoint) and write its run folder. */
export async function optimize(req: OptimizeRequest): Promise<OptimizeSummary> {
  // the workers load their modules while this thread reads and checks the configuration
  if (req.workers > 1) startWorkers(req.workers - 1);
  let job: OptimizationJob;
  let folder: string;
  let files: { constraints: string; objective: string } | undefined;
  let lock: { release(): void };
  if (req.resume) {
    folder = resolve(req.resume);
    job = readJob(folder);
    lock = acquireLock(join(folder, LOCK_FILE));
  } else if (req.jobFile) {
    job = readJobFile(req.jobFile);
    folder = resolve(req.out ?? join('designs', 'runs', `${job.label}-${job.id}`));
    lock = createRunFolder(folder, { force: req.force });
  } else {
    const p = loadDesignProblem(req.constraintsFile, req.objectiveFile);
    files = p.files;
    const search = searchSettings(p.objective, { optimizer: req.optimizer, budget: req.budget, batch: req.batch, seed: req.seed, top: req.top });
    const name = `${p.constraints.name ?? 'design'}-${p.objective.name ?? 'objective'}`;
    job = makeJob(name, p.constraints, p.objective, search);
    folder = resolve(req.out ?? join('designs', 'runs', `${name}-${job.id}`));
    lock = createRunFolder(folder, { force: req.force });
  }
  try {
    const log = pino({ base: { job: job.id } }, pino.destination({ dest: join(folder, 'run.log'), sync: true, append: true }));
    log.info({ files, search: job.search, resume: Boolean(req.resume), workers: req.workers }, req.resume ? 'run resumed' : 'run started');
    const outcome = await executeJobInFolder(folder, job, {
      workers: req.workers,
      resume: Boolean(req.resume),
      shouldStop: req.shouldStop,
      onProgress: (p) => req.onProgress?.(p, job.search.budget),
      files,
    });
    log.info({ evaluations: outcome.evaluations, failed: outcome.failedEvaluations, seconds: outcome.seconds, stopped: outcome.stopped }, outcome.stopped ? 'run interrupted, checkpoint written' : 'run finished');
    if (outcome.stopped) {
      throw new InterruptedError(`interrupted after ${outcome.evaluations} of ${job.search.budget} designs; the best so far and a checkpoint are in ${folder}; continue with: lumenfold optimize --resume ${folder}`);
    }
    const best = outcome.ranked[0];
    return {
      format: 'lumenfold.run-summary/1',
      run_folder: folder,
      optimizer: outcome.optimizer,
      choice: outcome.choice,
      evaluations: outcome.evaluations,
      failed_evaluations: outcome.failedEvaluations,
      disorder_samples_skipped: outcome.skippedDisorderSamples,
      seconds: outcome.seconds,
      best: best ? { name: `${job.label}-rank01`, score: best.score, metrics: toRecord(best, job.label, {}).metrics as Record<string, number> } : undefined,
      naive_score: outcome.naive?.score,
      files: RUN_FILES,
    };
  } finally {
    lock.release();
  }
}

/** The files every finished run folder holds. */
export const RUN_FILES = ['manifest.json', 'history.jsonl', 'designs/', 'ranking.csv', 'best.xyz', 'best.pdb', 'job.json', 'result.json', 'run.log'];

/** Write manifest, history, ranked designs, ranking CSV and the best design's XYZ and PDB into a run folder. */
export function writeRunFiles(folder: string, job: OptimizationJob, outcome: OptimizationOutcome, history: string[], meta: { files?: { constraints: string; objective: string }; started: string; workers: number }): string[] {
  const written: string[] = [];
  const put = (rel: string, text: string) => {
    mkdirSync(dirname(join(folder, rel)), { recursive: true });
    writeFileAtomic(join(folder, rel), text);
    written.push(rel);
  };
  const records = outcome.ranked.map((s, i) => toRecord(s, `${job.label}-rank${String(i + 1).padStart(2, '0')}`, { runId: job.id, rank: i + 1, seed: job.search.seed, toolVersion: VERSION }));
  const manifest = {
    format: 'lumenfold.run/1',
    tool: { name: 'lumenfold', version: VERSION },
    job: { id: job.id, label: job.label },
    started: meta.started,
    finished: new Date().toISOString(),
    seconds: outcome.seconds,
    search: { ...job.search, workers: meta.workers, optimizer_used: outcome.optimizer, choice: outcome.choice ?? null },
    evaluations: outcome.evaluations,
    failed_evaluations: outcome.failedEvaluations,
    disorder_samples_skipped: outcome.skippedDisorderSamples,
    unrankable_designs: outcome.unrankable,
    configs: {
      constraints: configEntry(meta.files?.constraints, job.constraints),
      objective: configEntry(meta.files?.objective, job.objective),
    },
    best_score: records[0]?.score ?? null,
    naive_score: outcome.naive?.score ?? null,
    hypervolume: outcome.hypervolume ?? null,
    convergence: outcome.history,
  };
  put('manifest.json', JSON.stringify(manifest, null, 2) + '\n');
  put('history.jsonl', history.join('\n') + (history.length ? '\n' : ''));
  records.forEach((r, i) => put(join('designs', `rank${String(i + 1).padStart(2, '0')}.design.json`), formatDesignFile(r)));
  put('ranking.csv', rankingCsv(records));
  if (records[0]) {
    put('best.xyz', exportDesign(records[0], 'xyz'));
    put('best.pdb', exportDesign(records[0], 'pdb'));
  }
  put('job.json', JSON.stringify(job, null, 2) + '\n');
  return written;
}

function configEntry(file: string | undefined, value: unknown) {
  let fileHash: string | null = null;
  if (file) fileHash = sha256Hex(readFileSync(file, 'utf8'));
  return { file: file ?? null, file_sha256: fileHash, resolved_sha256: hashOf(value), resolved: value };
}
