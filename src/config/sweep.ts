import { dirname, isAbsolute, join } from 'node:path';
import { contentHash } from './canonical-json.js';
import { ConfigError, type ConfigIssue } from './config-error.js';
import type { ConstraintSet } from './constraints-types.js';
import { MAX_SWEEP_JOBS } from './limits.js';
import { inspectConfigFile, validateConfigValue } from './load.js';
import type { Objective } from './objective-types.js';
import type { Sweep, SweepJob } from './sweep-types.js';
import { axisValues, combinePoints } from './sweep/axis-values.js';
import { pathPointer, setPath } from './sweep/set-path.js';

export interface SweepBase {
  constraints: ConstraintSet;
  objective: Objective;
}

const show = (value: unknown) => (typeof value === 'string' ? value : JSON.stringify(value));

/**
 * Expands a sweep into self-contained jobs: for each point, copies of the base constraint set and
 * objective with the varied fields set, validated again (schema, defaults, checks), and an id from the
 * SHA-256 of their canonical JSON, so the same configs always get the same id. Pure data: nothing runs.
 * `file` names the sweep in messages. Returns the jobs, or every issue found.
 */
export function expandSweepChecked(sweep: Sweep, base: SweepBase, file = '<sweep>'): { jobs: SweepJob[]; issues: ConfigIssue[] } {
  const issues: ConfigIssue[] = [];
  const issue = (path: string, message: string) => issues.push({ file, path, message });
  const lists = sweep.vary.map(axisValues);
  sweep.vary.forEach((axis, i) => {
    const first = sweep.vary.findIndex((a) => a.path === axis.path);
    if (first < i) issue(`/vary/${i}/path`, `varies ${axis.path} again (also vary[${first}]); vary each field once.`);
  });
  if (sweep.combine === 'zip' && lists.some((l) => l.length !== lists[0].length)) {
    issue('/vary', `combine is zip, but the fields have ${lists.map((l) => l.length).join(', ')} values; zip needs the same number for each.`);
  }
  const total = sweep.combine === 'zip' ? lists[0].length : lists.reduce((p, l) => p * l.length, 1);
  if (total > MAX_SWEEP_JOBS) issue('/vary', `expands to ${total} jobs; a sweep may have at most ${MAX_SWEEP_JOBS}.`);
  if (issues.length > 0) return { jobs: [], issues };

  const jobs: SweepJob[] = [];
  const seen = new Map<string, number>();
  combinePoints(lists, sweep.combine).forEach((values, index) => {
    const docs = { constraints: structuredClone(base.constraints), objective: structuredClone(base.objective) } as unknown as Record<'constraints' | 'objective', Record<string, unknown>>;
    const point: Record<string, unknown> = {};
    const label = sweep.vary.map((axis, a) => `${axis.path}=${show(values[a])}`).join(', ');
    sweep.vary.forEach((axis, a) => {
      point[axis.path] = values[a];
      const problem = setPath(docs[axis.path.startsWith('constraints.') ? 'constraints' : 'objective'], axis.path, values[a]);
      if (problem !== undefined) issue(`/vary/${a}/path`, `cannot set ${axis.path}: ${problem}`);
    });
    if (issues.length > 0) return;
    for (const kind of ['constraints', 'objective'] as const) {
      const checked = validateConfigValue(docs[kind], kind, { file, baseDir: '.' });
      for (const found of checked.issues) {
        const a = sweep.vary.findIndex((axis) => axis.path.startsWith(`${kind}.`) && found.path.startsWith(pathPointer(axis.path)));
        issue(a >= 0 ? `/vary/${a}` : '/vary', `at ${label}: the ${kind} ${found.path === '' ? 'document' : found.path} ${found.message}`);
      }
    }
    const job = { constraints: docs.constraints as unknown as ConstraintSet, objective: docs.objective as unknown as Objective };
    const id = contentHash(job).slice(0, 16);
    const twin = seen.get(id);
    if (twin !== undefined) issue('/vary', `points ${twin} and ${index} (${label}) give the same configs; list each value once.`);
    seen.set(id, index);
    jobs.push({ index, id, point, label, ...job });
  });
  return issues.length > 0 ? { jobs: [], issues } : { jobs, issues };
}

/**
 * Expands a sweep into jobs; throws ConfigError (an InputError) listing every issue. Give the base
 * configs (pure: nothing is read), or the sweep file's path to load the base files named in the sweep
 * relative to it.
 */
export function expandSweep(sweep: Sweep, base: SweepBase, file?: string): SweepJob[];
export function expandSweep(sweep: Sweep, sweepFile: string): SweepJob[];
export function expandSweep(sweep: Sweep, base: SweepBase | string, file?: string): SweepJob[] {
  const { jobs, issues } = typeof base === 'string' ? inspectBases(sweep, base) : expandSweepChecked(sweep, base, file);
  if (issues.length > 0) throw new ConfigError(issues);
  return jobs;
}

/** Where a sweep's base files are: relative to the sweep file. */
export function sweepBasePaths(sweep: Sweep, file: string): { constraints: string; objective: string } {
  const at = (p: string) => (isAbsolute(p) ? p : join(dirname(file), p));
  return { constraints: at(sweep.constraints), objective: at(sweep.objective) };
}

function inspectBases(sweep: Sweep, file: string): { jobs: SweepJob[]; issues: ConfigIssue[] } {
  const paths = sweepBasePaths(sweep, file);
  const constraints = inspectConfigFile(paths.constraints, 'constraints');
  const objective = inspectConfigFile(paths.objective, 'objective');
  if (constraints.value === undefined || objective.value === undefined) return { jobs: [], issues: [...constraints.issues, ...objective.issues] };
  return expandSweepChecked(sweep, { constraints: constraints.value, objective: objective.value }, file);
}

/** Loads a sweep file and its base files and expands it, never throwing for bad input. */
export function inspectSweepJobs(file: string): { sweep?: Sweep; jobs: SweepJob[]; issues: ConfigIssue[] } {
  const loaded = inspectConfigFile(file, 'sweep');
  if (loaded.value === undefined) return { jobs: [], issues: loaded.issues };
  return { sweep: loaded.value, ...inspectBases(loaded.value, file) };
}

/** Loads a sweep file and its base files and expands it into jobs; throws ConfigError listing every issue. */
export function loadSweepJobs(file: string): SweepJob[] {
  const { jobs, issues } = inspectSweepJobs(file);
  if (issues.length > 0) throw new ConfigError(issues);
  return jobs;
}
