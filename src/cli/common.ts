import type { Command } from 'commander';
import { InputError } from '../errors.js';
import { parseCount } from './parse.js';

/** The options every working command shares. */
export interface CommonFlags {
  seed?: string;
  workers?: string;
  out?: string;
  json?: boolean;
  quiet?: boolean;
  force?: boolean;
  allowOutside?: boolean;
}

export function addCommonOptions(cmd: Command, opts: { out: string; force?: boolean; seed?: boolean; workers?: boolean }): Command {
  if (opts.seed !== false) cmd.option('--seed <n>', 'random seed (the same seed gives the same run)');
  if (opts.workers !== false) cmd.option('--workers <n>', 'how many threads evaluate designs (default: 1); results do not depend on the number');
  cmd.option('--out <path>', opts.out);
  cmd.option('--allow-outside', 'allow --out to point outside the working folder');
  if (opts.force) cmd.option('--force', 'overwrite an existing output');
  cmd.option('--json', 'print the result as JSON on stdout');
  cmd.option('--quiet', 'no progress bar or notes on stderr');
  return cmd;
}

export function parseSeed(text: string | undefined): number | undefined {
  if (text === undefined) return undefined;
  if (!/^\d+$/.test(text.trim()) || !Number.isSafeInteger(Number(text))) throw new InputError(`--seed: '${text}' is not a non-negative integer`);
  return Number(text);
}

export function parseWorkers(text: string | undefined): number {
  if (text === undefined) return 1;
  const n = parseCount('--workers', text);
  if (n > 64) throw new InputError(`--workers: at most 64, got ${n}`);
  return n;
}
