import { InputError } from '../errors.js';

/** One problem in a design file: the file, the JSON pointer (RFC 6901) into it, and what is wrong. */
export interface DesignIssue {
  readonly file: string;
  /** '' for the whole document. */
  readonly path: string;
  readonly message: string;
}

/** Escape one key or index as a JSON pointer token (RFC 6901 section 3: ~ as ~0, / as ~1). */
export function pointerToken(key: string | number): string {
  return String(key).replace(/~/g, '~0').replace(/\//g, '~1');
}

/** A design file (or record) that cannot be used, with every problem found. */
export class DesignFileError extends InputError {
  constructor(readonly issues: readonly DesignIssue[]) {
    const lines = issues.map((i) => `${i.file}: ${i.path === '' ? '(whole file)' : i.path}: ${i.message}`);
    super(issues.length === 1 ? lines[0] : `${issues.length} problems in a design:\n  ${lines.join('\n  ')}`, 'bad-design');
  }
}

/** Throw a DesignFileError with one issue. */
export function designFail(file: string, path: string, message: string): never {
  throw new DesignFileError([{ file, path, message }]);
}
