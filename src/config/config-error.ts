import { InputError } from '../errors.js';

/** One problem found in a config file. */
export interface ConfigIssue {
  /** The file as the user named it. */
  file: string;
  /** JSON pointer (RFC 6901) into the file's document, '' for the whole document. */
  path: string;
  /** What is wrong, in words a user can act on. */
  message: string;
  /** 1-based line and column of the place in the file, when known. */
  line?: number;
  column?: number;
}

/** Issues in reading order: by line, then by path. */
export function sortIssues(issues: ConfigIssue[]): ConfigIssue[] {
  return issues.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || a.path.localeCompare(b.path));
}

/** Renders one issue as `file:line:column: /path: message`. */
export function formatIssue(issue: ConfigIssue): string {
  const where = issue.line === undefined ? issue.file : `${issue.file}:${issue.line}:${issue.column ?? 1}`;
  const path = issue.path === '' ? '(top level)' : issue.path;
  return `${where}: ${path}: ${issue.message}`;
}

/** A config file (or several) that cannot be used; carries every issue found, not only the first. */
export class ConfigError extends InputError {
  constructor(readonly issues: readonly ConfigIssue[]) {
    super(ConfigError.describe(issues), 'bad-config');
  }

  private static describe(issues: readonly ConfigIssue[]): string {
    const head = issues.length === 1 ? 'Invalid config:' : `Invalid config (${issues.length} problems):`;
    return [head, ...issues.map((issue) => `  ${formatIssue(issue)}`)].join('\n');
  }
}

/** Escapes one key for a JSON pointer (RFC 6901: ~ becomes ~0, / becomes ~1). */
export function pointerToken(key: string | number): string {
  return String(key).replace(/~/g, '~0').replace(/\//g, '~1');
}

/** Splits a JSON pointer into its unescaped keys. */
export function pointerKeys(pointer: string): string[] {
  if (pointer === '') return [];
  return pointer
    .slice(1)
    .split('/')
    .map((token) => token.replace(/~1/g, '/').replace(/~0/g, '~'));
}
