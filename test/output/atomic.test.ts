import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { createRunFolder, LOCK_FILE, writeFileAtomic } from '../../src/output/atomic.js';
import { acquireLock, processAlive } from '../../src/output/run-lock.js';

const root = mkdtempSync(join(tmpdir(), 'lumenfold-atomic-'));
afterAll(() => rmSync(root, { recursive: true, force: true }));
let count = 0;
const fresh = () => join(root, `case-${++count}`);

/** The pid of a process that has exited (pids are not reused at once on Linux: common practice). */
function deadPid(): number {
  const child = spawnSync(process.execPath, ['-e', 'process.stdout.write(String(process.pid))'], { encoding: 'utf8' });
  return Number(child.stdout);
}

describe('writeFileAtomic', () => {
  it('writes and replaces a file and leaves no temporary file behind', () => {
    const dir = fresh();
    mkdirSync(dir);
    const file = join(dir, 'result.json');
    writeFileAtomic(file, 'first\n');
    writeFileAtomic(file, new TextEncoder().encode('second, longer content\n'));
    expect(readFileSync(file, 'utf8')).toBe('second, longer content\n');
    expect(readdirSync(dir)).toEqual(['result.json']);
  });

  it('writes a large text whole', () => {
    const dir = fresh();
    mkdirSync(dir);
    const text = 'x'.repeat(5_000_000) + '\n';
    writeFileAtomic(join(dir, 'big.txt'), text);
    expect(readFileSync(join(dir, 'big.txt'), 'utf8')).toBe(text);
  });

  it('fails with an InputError naming the file when the folder is missing, and leaves nothing behind', () => {
    const dir = fresh();
    mkdirSync(dir);
    const file = join(dir, 'missing', 'out.csv');
    expect(() => writeFileAtomic(file, 'a')).toThrow(InputError);
    expect(() => writeFileAtomic(file, 'a')).toThrow(`${file}: cannot write the file (ENOENT)`);
    expect(readdirSync(dir)).toEqual([]);
  });

  it('leaves the old content and no temporary file when the rename cannot happen', () => {
    const dir = fresh();
    mkdirSync(join(dir, 'target'), { recursive: true }); // a folder where the file should go: rename fails
    expect(() => writeFileAtomic(join(dir, 'target'), 'a')).toThrow(InputError);
    expect(readdirSync(dir)).toEqual(['target']);
  });
});

describe('createRunFolder', () => {
  it('creates the folder and a lock holding this pid; release removes the lock', () => {
    const dir = fresh();
    const run = createRunFolder(dir);
    expect(readFileSync(join(dir, LOCK_FILE), 'utf8').split('\n')[0]).toBe(String(process.pid));
    run.release();
    run.release();
    expect(existsSync(join(dir, LOCK_FILE))).toBe(false);
  });

  it('blocks a second holder while the first holds the lock', () => {
    const dir = fresh();
    const run = createRunFolder(dir);
    expect(() => createRunFolder(dir, { force: true })).toThrow(/in use by process \d+/);
    run.release();
    expect(() => createRunFolder(dir).release()).not.toThrow();
  });

  it('refuses a non-empty folder unless forced, and accepts an empty existing one', () => {
    const dir = fresh();
    mkdirSync(dir);
    createRunFolder(dir).release();
    writeFileSync(join(dir, 'ranking.csv'), 'x');
    expect(() => createRunFolder(dir)).toThrow(/is not empty \(ranking\.csv\); choose a new folder, or force/);
    expect(existsSync(join(dir, LOCK_FILE))).toBe(false); // the refused attempt let go of its lock
    const forced = createRunFolder(dir, { force: true });
    expect(readdirSync(dir).sort()).toEqual([LOCK_FILE, 'ranking.csv']);
    forced.release();
  });

  it('takes over a stale lock whose process has exited', () => {
    const dir = fresh();
    mkdirSync(dir);
    const pid = deadPid();
    expect(processAlive(pid)).toBe(false);
    writeFileSync(join(dir, LOCK_FILE), `${pid}\n`);
    const run = createRunFolder(dir);
    expect(readFileSync(join(dir, LOCK_FILE), 'utf8').split('\n')[0]).toBe(String(process.pid));
    run.release();
    expect(readdirSync(dir)).toEqual([]);
  });

  it('refuses a folder locked by another live process', async () => {
    const dir = fresh();
    mkdirSync(dir);
    const other = spawn(process.execPath, ['-e', 'setTimeout(() => {}, 60000)'], { stdio: 'ignore' });
    try {
      writeFileSync(join(dir, LOCK_FILE), `${other.pid}\n`);
      expect(() => createRunFolder(dir)).toThrow(`in use by process ${other.pid}`);
    } finally {
      other.kill();
      await new Promise((done) => other.once('exit', done));
    }
    expect(() => createRunFolder(dir).release()).not.toThrow();
  });

  it('refuses a lock file it cannot read an owner from, and a path that is a file', () => {
    const dir = fresh();
    mkdirSync(dir);
    writeFileSync(join(dir, LOCK_FILE), 'garbage');
    expect(() => createRunFolder(dir)).toThrow(/in use by an unreadable owner/);
    writeFileSync(join(root, 'plain-file'), 'x');
    expect(() => createRunFolder(join(root, 'plain-file'))).toThrow(/exists and is not a folder/);
  });

  it('does not remove a lock that another holder took after this one was released', () => {
    const dir = fresh();
    mkdirSync(dir);
    const file = join(dir, LOCK_FILE);
    const first = acquireLock(file);
    rmSync(file); // lost, e.g. removed by hand
    const second = acquireLock(file);
    first.release();
    expect(existsSync(file)).toBe(true);
    second.release();
    expect(existsSync(file)).toBe(false);
  });
});
