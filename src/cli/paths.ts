import { existsSync } from 'node:fs';
import { isAbsolute, relative, resolve } from 'node:path';
import { InputError } from '../errors.js';

/**
 * Resolve an output path given on the command line. It must stay inside the working folder (a path that
 * climbs out with .. or points elsewhere is refused unless allowOutside), so a pasted command or a script
 * cannot write over files elsewhere by accident.
 */
export function outputPath(option: string, path: string, allowOutside: boolean): string {
  if (path.includes('\u0000')) throw new InputError(`${option}: the path contains a NUL byte`);
  const p = resolve(path);
  const rel = relative(process.cwd(), p);
  if (!allowOutside && (rel.startsWith('..') || isAbsolute(rel))) {
    throw new InputError(`${option} ${path}: outside the working folder ${process.cwd()}; pass --allow-outside to write there`);
  }
  return p;
}

/** An output file path: inside the working folder (unless allowed) and not replacing a file unless forced. */
export function safeOutputPath(option: string, path: string, force: boolean, allowOutside: boolean): string {
  const p = outputPath(option, path, allowOutside);
  if (existsSync(p) && !force) throw new InputError(`${path} exists; use --force to overwrite it`);
  return p;
}
