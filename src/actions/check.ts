import type { ConfigIssue } from '../config/config-error.js';
import { inspectConfigFile } from '../config/load.js';
import { precheck } from '../config/precheck/precheck.js';
import type { ConstraintSet } from '../config/constraints-types.js';
import type { Objective } from '../config/objective-types.js';

export interface CheckReport {
  files: { file: string; kind?: string; valid: boolean }[];
  issues: ConfigIssue[];
}

/**
 * Validate config files (any kind, told apart by their format field) and report every issue with its path;
 * when a valid constraint set and a valid objective are both given, also the reasons no design can satisfy them.
 */
export function checkConfigs(paths: readonly string[]): CheckReport {
  const files: CheckReport['files'] = [];
  const issues: ConfigIssue[] = [];
  let constraints: { file: string; value: ConstraintSet } | undefined;
  let objective: { file: string; value: Objective } | undefined;
  for (const file of paths) {
    const r = inspectConfigFile(file);
    files.push({ file, kind: r.kind, valid: r.issues.length === 0 });
    issues.push(...r.issues);
    if (r.issues.length === 0 && r.kind === 'constraints') constraints = { file, value: r.value as ConstraintSet };
    if (r.issues.length === 0 && r.kind === 'objective') objective = { file, value: r.value as Objective };
  }
  if (constraints && objective) {
    for (const reason of precheck(constraints.value, objective.value)) {
      issues.push({ file: reason.in === 'objective' ? objective.file : constraints.file, path: reason.path, message: reason.message });
    }
  }
  return { files, issues };
}
