import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { InputError } from '../errors.js';

/** An output file path: refuses to replace an existing file unless forced. */
export function safeOutputPath(path: string, force: boolean): string {
  const p = resolve(path);
  if (existsSync(p) && !force) throw new InputError(`${path} exists; use --force to overwrite it`);
  return p;
}
