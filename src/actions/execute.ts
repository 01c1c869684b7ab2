import { existsSync, readFileSync, rmSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { ConfigError } from '../config/config-error.js';
import { validateConfigValue } from '../config/load.js';
import { InputError } from '../errors.js';
import { writeFileAtomic } from '../output/atomic.js';
import type { Progress } from '../search/core/types.js';
import { checkOptimizerName, hashOf, runJob, type OptimizationJob } from './job.js';
import type { OptimizationOutcome, ResumePoint } from './optimize-core.js';
import { writeRunFiles } from './optimize.js';
import { toRecord } from './records.js';

export const CHECKPOINT_FILE = 'checkpoint.json';
/** Written last when a job finishes: its presence marks a finished run folder. */
export const RESULT_FILE = 'result.json';

/** The short result of a finished job (what a sweep summary and a cluster runner collect). */
export interface JobResult {
  format: 'lumenfold.result/1';
  id: string;
  label: string;
  best_score: number | null;
  naive_score: number | null;
  metrics: Record<string, number>;
  evaluations: number;
  seconds: number;
}

interface Checkpoint {
  format: 'lumenfold.checkpoint/1';
  job_id: string;
  written: string;
  resume: ResumePoint;
}

export interface ExecuteOptions {
  workers: number;
  /** Continue from the folder's checkpoint. */
  resume: boolean;
  shouldStop?: () => boolean;
  onProgress?: (p: Progress) => void;
  files?: { constraints: string; objective: string };
}

/** One history line per scored candidate (score as maximized for a weighted sum). */
function historyLine(e: { index: number; score: number | number[]; metrics: Record<string, number | undefined>; error?: string }): string {
  const score = Array.isArray(e.score) ? e.score : Number.isFinite(e.score) ? -e.score : null;
  return JSON.stringify({ i: e.index, score, ...e.metrics, ...(e.error ? { error: e.error } : {}) });
}

/** Read a run folder's job record (job.json), checked as readJobFile does. */
export function readJob(folder: string): OptimizationJob {
  const file = join(folder, 'job.json');
  if (!existsSync(file)) throw new InputError(`${folder}: no job.json: not a lumenfold run folder`);
  return readJobFile(file);
}

/**
 * Read a job file (a sweep point or a run's job.json, for example handed to a cluster runner): its configs are
 * validated again against their schemas and its id must match its content, so an edited job is refused.
 */
export function readJobFile(file: string): OptimizationJob {
  let job: OptimizationJob;
  try {
    job = JSON.parse(readFileSync(file, 'utf8')) as OptimizationJob;
  } catch {
    throw new InputError(`${file}: cannot be read as JSON`);
  }
  if (!job || typeof job !== 'object' || job.format !== 'lumenfold.job/1') throw new InputError(`${file}: /format: expected lumenfold.job/1`);
  const issues = [
    ...validateConfigValue(job.constraints, 'constraints', { file: `${file}#/constraints`, baseDir: dirname(file) }).issues,
    ...validateConfigValue(job.objective, 'objective', { file: `${file}#/objective`, baseDir: dirname(file) }).issues,
  ];
  if (issues.length) throw new ConfigError(issues);
  const s = job.search;
  const positive = (v: unknown) => Number.isSafeInteger(v) && (v as number) > 0;
  if (!s || typeof s.optimizer !== 'string' || !positive(s.budget) || !positive(s.batch) || !positive(s.top) || !(Number.isSafeInteger(s.seed) && s.seed >= 0)) {
    throw new InputError(`${file}: /search: needs optimizer (a name), budget, batch, top (positive integers) and seed (an integer >= 0)`);
  }
  checkOptimizerName(s.optimizer);
  if (hashOf({ constraints: job.constraints, objective: job.objective, search: job.search }).slice(0, 16) !== job.id) {
    throw new InputError(`${file}: /id: the job was changed after it was made (its id no longer matches its content)`);
  }
  return job;
}

/**
 * Run (or continue) a job in its folder: on a stop request the batch in flight is finished, then the
 * outputs so far and a checkpoint are written; on completion the checkpoint is removed. The same job and
 * seed give the same final files whether or not the run was interrupted.
 */
export async function executeJobInFolder(folder: string, job: OptimizationJob, o: ExecuteOptions): Promise<OptimizationOutcome> {
  const cpFile = join(folder, CHECKPOINT_FILE);
  let resume: ResumePoint | undefined;
  let history: string[] = [];
  if (o.resume) {
    if (!existsSync(cpFile)) throw new InputError(`${folder}: no ${CHECKPOINT_FILE}: the run finished or never started; nothing to resume`);
    const cp = JSON.parse(readFileSync(cpFile, 'utf8')) as Checkpoint;
    if (cp.format !== 'lumenfold.checkpoint/1' || cp.job_id !== job.id) throw new InputError(`${cpFile}: belongs to another job`);
    resume = cp.resume;
    const hist = join(folder, 'history.jsonl');
    history = existsSync(hist) ? readFileSync(hist, 'utf8').split('\n').filter((l) => l !== '').slice(0, resume.scored) : [];
  }
  writeFileAtomic(join(folder, 'job.json'), JSON.stringify(job, null, 2) + '\n');
  const started = new Date().toISOString();
  const outcome = await runJob(job, {
    shouldStop: o.shouldStop,
    onProgress: o.onProgress,
    onEvaluation: (e) => history.push(historyLine(e)),
  }, o.workers, resume);
  writeRunFiles(folder, job, outcome, history, { files: o.files, started, workers: o.workers });
  if (outcome.stopped) {
    const cp: Checkpoint = { format: 'lumenfold.checkpoint/1', job_id: job.id, written: new Date().toISOString(), resume: outcome.resumePoint };
    writeFileAtomic(cpFile, JSON.stringify(cp) + '\n');
  } else {
    if (existsSync(cpFile)) rmSync(cpFile);
    const best = outcome.ranked[0];
    const result: JobResult = {
      format: 'lumenfold.result/1', id: job.id, label: job.label,
      best_score: best?.score ?? null, naive_score: outcome.naive?.score ?? null,
      metrics: best ? (toRecord(best, job.label, {}).metrics as Record<string, number>) : {},
      evaluations: outcome.evaluations, seconds: outcome.seconds,
    };
    writeFileAtomic(join(folder, RESULT_FILE), JSON.stringify(result, null, 2) + '\n');
  }
  return outcome;
}
