/**
 * Reading a run folder written by `lumenfold optimize`: manifest.json, history.jsonl and the ranked design
 * files designs/rankNN.design.json. A missing or incomplete folder is an InputError naming the folder or
 * the file at fault.
 */
import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { InputError } from '../errors.js';
import { readDesignFile } from '../output/design-file.js';
import type { DesignRecord } from '../output/record.js';
import type { HistoryRow } from './chart-data.js';

export const RUN_FORMAT = 'lumenfold.run/1';

export interface ConfigEntry {
  readonly file: string | null;
  readonly file_sha256: string | null;
  readonly resolved_sha256: string;
  readonly resolved: unknown;
}

/** The manifest fields the report uses. */
export interface RunManifest {
  readonly format: typeof RUN_FORMAT;
  readonly tool: { readonly name: string; readonly version: string };
  readonly job: { readonly id: string; readonly label: string };
  readonly started?: string;
  readonly finished?: string;
  readonly seconds: number;
  readonly search: {
    readonly optimizer: string; readonly budget: number; readonly batch: number; readonly seed: number; readonly top: number;
    readonly workers?: number; readonly optimizer_used?: string; readonly choice?: string | null;
  };
  readonly evaluations: number;
  readonly failed_evaluations: number;
  readonly configs: { readonly constraints: ConfigEntry; readonly objective: ConfigEntry };
  readonly best_score: number | null;
  readonly naive_score: number | null;
  readonly hypervolume: number | null;
  readonly convergence: readonly { readonly evaluations: number; readonly best: number | null }[];
}

export interface RunFolderData {
  readonly folder: string;
  readonly manifest: RunManifest;
  readonly history: HistoryRow[];
  /** Ranked designs, best first. */
  readonly designs: { readonly file: string; readonly record: DesignRecord }[];
}

const incomplete = (file: string, what: string) => new InputError(`${file}: ${what}; the run folder is incomplete (write it again with lumenfold optimize)`, 'run-incomplete');

function readJsonFile(file: string): unknown {
  if (!existsSync(file)) throw incomplete(file, 'missing');
  try {
    return JSON.parse(readFileSync(file, 'utf8'));
  } catch (e) {
    throw new InputError(`${file}: not valid JSON (${(e as Error).message})`, 'run-incomplete');
  }
}

/** The value at a dotted path, or an InputError naming the file and the missing key. */
function need(file: string, doc: unknown, path: string, kind: 'number' | 'string' | 'object' | 'array'): void {
  let v: unknown = doc;
  for (const k of path.split('.')) v = v !== null && typeof v === 'object' ? (v as Record<string, unknown>)[k] : undefined;
  const ok = kind === 'array' ? Array.isArray(v) : kind === 'object' ? v !== null && typeof v === 'object' : typeof v === kind;
  if (!ok) throw incomplete(file, `"${path}" is missing or not ${kind === 'array' || kind === 'object' ? 'an' : 'a'} ${kind}`);
}

function readManifest(folder: string): RunManifest {
  const file = join(folder, 'manifest.json');
  const m = readJsonFile(file) as Record<string, unknown>;
  if (m === null || typeof m !== 'object' || m.format !== RUN_FORMAT) {
    throw new InputError(`${file}: not a run manifest (expected "format": "${RUN_FORMAT}")`, 'run-incomplete');
  }
  for (const [p, k] of [
    ['tool.version', 'string'], ['job.id', 'string'], ['job.label', 'string'], ['seconds', 'number'], ['search.optimizer', 'string'],
    ['search.budget', 'number'], ['search.seed', 'number'], ['evaluations', 'number'], ['failed_evaluations', 'number'],
    ['configs.constraints.resolved', 'object'], ['configs.objective.resolved', 'object'], ['convergence', 'array'],
  ] as const) need(file, m, p, k);
  return m as unknown as RunManifest;
}

function readHistory(folder: string): HistoryRow[] {
  const file = join(folder, 'history.jsonl');
  if (!existsSync(file)) throw incomplete(file, 'missing');
  return readFileSync(file, 'utf8').split('\n').flatMap((line, k) => {
    if (line.trim() === '') return [];
    try {
      const row = JSON.parse(line) as HistoryRow;
      if (typeof row?.i !== 'number') throw new Error('no candidate index "i"');
      return [row];
    } catch (e) {
      throw new InputError(`${file}:${k + 1}: not a history line (${(e as Error).message})`, 'run-incomplete');
    }
  });
}

function readRanked(folder: string): RunFolderData['designs'] {
  const dir = join(folder, 'designs');
  const first = join(dir, 'rank01.design.json');
  if (!existsSync(first)) throw incomplete(first, 'missing');
  const ranks = readdirSync(dir)
    .map((f) => /^rank(\d+)\.design\.json$/.exec(f))
    .filter((m): m is RegExpExecArray => m !== null)
    .map((m) => Number(m[1]))
    .sort((a, b) => a - b);
  const out: { file: string; record: DesignRecord }[] = [];
  for (const r of ranks) {
    if (r !== out.length + 1) break; // ranks are contiguous from 1
    const file = join(dir, `rank${String(r).padStart(2, '0')}.design.json`);
    out.push({ file, record: readDesignFile(file) });
  }
  return out;
}

/** Read and check a run folder. */
export function readRunFolder(folder: string): RunFolderData {
  let isDir = false;
  try {
    isDir = statSync(folder).isDirectory();
  } catch {
    throw new InputError(`${folder}: no such run folder; give the folder lumenfold optimize wrote`, 'run-missing');
  }
  if (!isDir) throw new InputError(`${folder}: not a folder; give the run folder lumenfold optimize wrote`, 'run-missing');
  return { folder, manifest: readManifest(folder), history: readHistory(folder), designs: readRanked(folder) };
}
