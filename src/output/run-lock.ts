/**
 * A lock file that lets one process at a time write into a folder. The lock is created complete (written to
 * a temporary file, then hard-linked to its name, which fails when the name exists) and holds the owner's
 * pid on its first line and a random token on its second. A lock whose pid is not a live process is stale
 * and is taken over. Only processes on this machine can be checked: a folder shared between machines
 * (network file systems) is not protected against a run on another machine.
 */
import { randomBytes } from 'node:crypto';
import { linkSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import { InputError } from '../errors.js';

export interface FolderLock {
  readonly file: string;
  /** Remove the lock if it is still ours; calling it again does nothing. */
  release(): void;
}

function readLock(file: string): string | undefined {
  try {
    return readFileSync(file, 'utf8');
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return undefined;
    throw e;
  }
}

/** The pid on the first line of a lock's text, if it is one. */
function ownerPid(text: string): number | undefined {
  const first = text.split('\n', 1)[0].trim();
  return /^[1-9]\d{0,9}$/.test(first) ? Number(first) : undefined;
}

/** Whether a process with this pid exists (signal 0 checks without sending anything). */
export function processAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

function inUse(file: string, pid: number | undefined): InputError {
  const who = pid === undefined ? 'an unreadable owner' : `process ${pid}`;
  return new InputError(
    `${file}: the folder is in use by ${who}; wait for that run to finish, choose another folder, or delete the lock file if no lumenfold run uses the folder`,
    'folder-locked',
  );
}

/** Try to create the lock in one step; false when it exists. */
function tryCreate(file: string, text: string): boolean {
  const tmp = `${file}.${process.pid}.${randomBytes(6).toString('hex')}.tmp`;
  writeFileSync(tmp, text, { flag: 'wx' });
  try {
    linkSync(tmp, file);
    return true;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') return false;
    // A file system without hard links: an exclusive create (O_EXCL) instead.
    return createExclusive(file, text);
  } finally {
    rmSync(tmp, { force: true });
  }
}

function createExclusive(file: string, text: string): boolean {
  try {
    writeFileSync(file, text, { flag: 'wx' });
    return true;
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') return false;
    throw e;
  }
}

/**
 * Move a stale lock aside and check that what was moved is the stale lock that was seen; if another
 * process replaced it in between, put that one back and report the folder in use.
 */
function breakStale(file: string, seen: string): void {
  const aside = `${file}.${process.pid}.${randomBytes(6).toString('hex')}.stale`;
  try {
    renameSync(file, aside);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code === 'ENOENT') return;
    throw e;
  }
  const moved = readLock(aside) ?? '';
  if (moved !== seen) {
    try {
      linkSync(aside, file);
    } finally {
      rmSync(aside, { force: true });
    }
    throw inUse(file, ownerPid(moved));
  }
  rmSync(aside, { force: true });
}

/** Take the lock file, or throw an InputError naming the process that holds it. */
export function acquireLock(file: string): FolderLock {
  const text = `${process.pid}\n${randomBytes(8).toString('hex')}\n`;
  for (let attempt = 0; attempt < 5; attempt++) {
    if (tryCreate(file, text)) {
      let held = true;
      return {
        file,
        release() {
          if (!held) return;
          held = false;
          if (readLock(file) === text) rmSync(file, { force: true });
        },
      };
    }
    const seen = readLock(file);
    if (seen === undefined) continue;
    const pid = ownerPid(seen);
    if (pid === undefined || processAlive(pid)) throw inUse(file, pid);
    breakStale(file, seen);
  }
  throw inUse(file, ownerPid(readLock(file) ?? ''));
}
