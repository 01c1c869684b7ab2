/** Atomic file writes and run folders that one run at a time may write into. */
import { randomBytes } from 'node:crypto';
import { closeSync, fsyncSync, mkdirSync, openSync, readdirSync, renameSync, rmSync, statSync, writeSync } from 'node:fs';
import { basename, dirname, join, resolve } from 'node:path';
import { InputError } from '../errors.js';
import { acquireLock } from './run-lock.js';

/** Name of the lock file inside a run folder. */
export const LOCK_FILE = '.lock';

function code(e: unknown): string {
  return (e as NodeJS.ErrnoException).code ?? String(e);
}

/** fsync a folder so that a rename in it survives a crash; not every platform allows it (best effort). */
function syncFolder(dir: string): void {
  let fd: number | undefined;
  try {
    fd = openSync(dir, 'r');
    fsyncSync(fd);
  } catch {
    // Windows and some file systems refuse to open or sync a folder; the rename is still atomic.
  } finally {
    if (fd !== undefined) closeSync(fd);
  }
}

/**
 * Write a file so that readers see either the old content or the whole new content: write a temporary
 * file in the same folder, fsync it, rename it over the target, fsync the folder. On failure the
 * temporary file is removed and an InputError names the file.
 */
export function writeFileAtomic(path: string, data: string | Uint8Array): void {
  const dir = dirname(resolve(path));
  const tmp = join(dir, `.${basename(path)}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`);
  let fd: number | undefined;
  try {
    fd = openSync(tmp, 'wx', 0o666);
    const bytes = typeof data === 'string' ? Buffer.from(data, 'utf8') : data;
    for (let off = 0; off < bytes.length; ) off += writeSync(fd, bytes, off, bytes.length - off);
    fsyncSync(fd);
    closeSync(fd);
    fd = undefined;
    renameSync(tmp, path);
  } catch (e) {
    if (fd !== undefined) closeSync(fd);
    rmSync(tmp, { force: true });
    throw new InputError(`${path}: cannot write the file (${code(e)}); check that its folder exists and is writable`, 'write-failed');
  }
  syncFolder(dir);
}

/** A run folder held by this process. */
export interface RunFolder {
  /** Absolute path of the folder. */
  readonly path: string;
  /** Absolute path of its lock file. */
  readonly lockFile: string;
  /** Remove the lock (the folder and what was written stay); calling it again does nothing. */
  release(): void;
}

export interface RunFolderOptions {
  /** Write into a folder that already holds files (default false: refuse). */
  force?: boolean;
}

/**
 * Create (or open) a run folder and lock it: an existing non-empty folder is refused unless `force`, and a
 * folder whose lock is held by a live process is refused always (InputError). Call release() when done.
 */
export function createRunFolder(path: string, options: RunFolderOptions = {}): RunFolder {
  const dir = resolve(path);
  try {
    if (!statSync(dir).isDirectory()) throw new InputError(`${path}: exists and is not a folder; choose a folder name for the run`, 'not-a-folder');
  } catch (e) {
    if (e instanceof InputError) throw e;
    if (code(e) !== 'ENOENT') throw new InputError(`${path}: cannot be used as a run folder (${code(e)})`, 'not-a-folder');
  }
  try {
    mkdirSync(dir, { recursive: true });
  } catch (e) {
    throw new InputError(`${path}: cannot create the run folder (${code(e)})`, 'not-a-folder');
  }
  const lock = acquireLock(join(dir, LOCK_FILE));
  const present = readdirSync(dir).filter((f) => !f.startsWith(LOCK_FILE));
  if (present.length > 0 && !options.force) {
    lock.release();
    const shown = present.slice(0, 5).join(', ') + (present.length > 5 ? ', ...' : '');
    throw new InputError(`${path}: the folder is not empty (${shown}); choose a new folder, or force writing into this one`, 'folder-not-empty');
  }
  return { path: dir, lockFile: lock.file, release: () => lock.release() };
}
