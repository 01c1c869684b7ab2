import { mkdirSync, readFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import pino from 'pino';
import type { Progress } from '../search/core/types.js';
import { createRunFolder, writeFileAtomic } from '../output/atomic.js';
import { formatDesignFile } from '../output/design-file.js';
import { exportDesign } from './exports.js';
import { rankingCsv } from '../output/csv.js';
import { hashOf, makeJob, sha256Hex, runJob, searchSettings, type OptimizationJob } from './job.js';
import { loadDesignProblem } from './load-configs.js';
import type { OptimizationOutcome } from './optimize-core.js';
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
  onProgress?: (p: Progress, budget: number) => void;
}

export interface OptimizeSummary {
  format: 'lumenfold.run-summary/1';
  run_folder: string;
  optimizer: string;
  choice?: string;
  evaluations: number;
  failed_evaluations: number;
  seconds: number;
  best: { name: string; score?: number; metrics: Record<string, number> } | undefined;
  naive_score?: number;
  files: string[];
}

/** Run an optimization and write its run folder. */
export async function optimize(req: OptimizeRequest): Promise<OptimizeSummary> {
  const { constraints, objective, files } = loadDesignProblem(req.constraintsFile, req.objectiveFile);
  const search = searchSettings(objective, { optimizer: req.optimizer, budget: req.budget, batch: req.batch, seed: req.seed, top: req.top });
  const name = `${constraints.name ?? 'design'}-${objective.name ?? 'objective'}`;
  const job = makeJob(name, constraints, objective, search);
  const folder = resolve(req.out ?? join('designs', 'runs', `${name}-${job.id}`));
  const run = createRunFolder(folder, { force: req.force });
  try {
    const log = pino({ base: { job: job.id } }, pino.destination({ dest: join(folder, 'run.log'), sync: true }));
    log.info({ files, search }, 'run started');
    const history: string[] = [];
    const started = new Date().toISOString();
    const outcome = await runJob(job, {
      onProgress: (p) => req.onProgress?.(p, search.budget),
      onEvaluation: (e) => history.push(JSON.stringify({ i: e.index, score: Array.isArray(e.score) ? e.score : Number.isFinite(e.score) ? -e.score : null, ...e.metrics, ...(e.error ? { error: e.error } : {}) })),
    }, req.workers);
    log.info({ evaluations: outcome.evaluations, failed: outcome.failedEvaluations, seconds: outcome.seconds }, 'search finished');
    const written = writeRunFiles(folder, job, outcome, history, { files, started, workers: req.workers });
    log.info({ written }, 'run written');
    const best = outcome.ranked[0];
    return {
      format: 'lumenfold.run-summary/1',
      run_folder: folder,
      optimizer: outcome.optimizer,
      choice: outcome.choice,
      evaluations: outcome.evaluations,
      failed_evaluations: outcome.failedEvaluations,
      seconds: outcome.seconds,
      best: best ? { name: `${name}-rank01`, score: best.score, metrics: toRecord(best, name, {}).metrics as Record<string, number> } : undefined,
      naive_score: outcome.naive.score,
      files: written,
    };
  } finally {
    run.release();
  }
}

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
    configs: {
      constraints: configEntry(meta.files?.constraints, job.constraints),
      objective: configEntry(meta.files?.objective, job.objective),
    },
    best_score: records[0]?.score ?? null,
    naive_score: outcome.naive.score ?? null,
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
