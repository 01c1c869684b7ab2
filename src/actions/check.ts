import { checkConfigFiles } from '../config/check.js';
import type { ConfigIssue } from '../config/config-error.js';

export interface CheckReport {
  files: { file: string; kind?: string; valid: boolean }[];
  issues: ConfigIssue[];
}

/**
 * Validate config files (any kind, told apart by their format field) and report every issue with its path,
 * plus the reasons no design can satisfy the constraint sets, objectives and sweep points given.
 */
export function checkConfigs(paths: readonly string[]): CheckReport {
  return checkConfigFiles(paths, { precheck: true });
}
