import type { ConfigIssue } from './config-error.js';
import { asIssues, inspectConfigFile, type Inspection } from './load.js';
import { precheck, precheckConstraints } from './precheck/precheck.js';
import type { ConfigKind } from './schemas.js';
import { inspectSweepJobs } from './sweep.js';

export interface CheckOptions {
  /** Also report why no design can satisfy the configs (default true). */
  precheck?: boolean;
}

/** What checkConfigFiles found: the kind of each file, and every issue in all of them. */
export interface CheckResult {
  files: { file: string; kind?: ConfigKind; valid: boolean }[];
  issues: ConfigIssue[];
}

/**
 * Checks config files of any kind (told apart by their format key) and reports EVERY issue found, not
 * only the first, as {file, path, message}. With precheck (the default): every valid constraint set is
 * prechecked; every pair of a valid constraint set and a valid objective is prechecked together (the
 * objective's reasons are reported under the objective, naming the constraint set); a sweep is expanded
 * and each point prechecked (a reason shared by every point is reported once).
 */
export function checkConfigFiles(paths: readonly string[], options: CheckOptions = {}): CheckResult {
  const files: CheckResult['files'] = [];
  const issues: ConfigIssue[] = [];
  const seen = new Set<string>();
  const report = (found: readonly ConfigIssue[]) => {
    for (const issue of found) {
      const key = `${issue.file}\n${issue.path}\n${issue.message}`;
      if (!seen.has(key)) issues.push(issue);
      seen.add(key);
    }
  };
  const constraints: { file: string; found: Inspection<'constraints'> }[] = [];
  const objectives: { file: string; found: Inspection<'objective'> }[] = [];
  for (const file of paths) {
    const found = inspectConfigFile(file);
    files.push({ file, kind: found.kind, valid: found.value !== undefined });
    report(found.issues);
    if (found.value === undefined) continue;
    if (found.kind === 'constraints') constraints.push({ file, found: found as Inspection<'constraints'> });
    if (found.kind === 'objective') objectives.push({ file, found: found as Inspection<'objective'> });
    if (found.kind === 'sweep') report(checkSweep(file, options.precheck !== false));
  }
  if (options.precheck === false) return { files, issues };
  for (const c of constraints) {
    report(asIssues(precheckConstraints(c.found.value!), c.file, c.found.positions));
    for (const o of objectives) {
      const reasons = precheck(c.found.value!, o.found.value!).filter((r) => r.in === 'objective');
      report(asIssues(reasons.map((r) => ({ path: r.path, message: `${r.message} (with the constraint set ${c.file})` })), o.file, o.found.positions));
    }
  }
  return { files, issues };
}

function checkSweep(file: string, withPrecheck: boolean): ConfigIssue[] {
  const { jobs, issues } = inspectSweepJobs(file);
  if (!withPrecheck || jobs.length === 0) return issues;
  const where = new Map<string, string[]>();
  for (const job of jobs) {
    for (const reason of precheck(job.constraints, job.objective)) {
      const text = `the ${reason.in === 'objective' ? 'objective' : 'constraint set'}: ${reason.message}`;
      where.set(text, [...(where.get(text) ?? []), job.label]);
    }
  }
  const found: ConfigIssue[] = [...issues];
  for (const [text, labels] of where) {
    const at = labels.length === jobs.length && jobs.length > 1 ? 'at every point' : `at ${labels.join('; ')}`;
    found.push({ file, path: '/vary', message: `${at}, ${text}` });
  }
  return found;
}
