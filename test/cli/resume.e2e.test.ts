import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN, ROOT, runCli } from '../helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-resume-'));
// about 5 s of work on one core, so every stop below lands inside the run
const ARGS = ['optimize', '--budget', '3000', '--seed', '4', '--quiet'];

/**
 * Start the binary and send `signal` `delay` ms after its run log appears (the run folder exists and the stop
 * handlers are installed by then); resolve with the exit code.
 */
function runAndStop(args: string[], folder: string, delay: number, signal: NodeJS.Signals): Promise<number | null> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: 'ignore', cwd: tmpdir() });
    const timer = setInterval(() => {
      if (!existsSync(join(folder, 'run.log'))) return;
      clearInterval(timer);
      setTimeout(() => child.kill(signal), delay);
    }, 10);
    child.on('exit', (code) => { clearInterval(timer); resolve(code); });
  });
}

describe('checkpoint and resume', () => {
  it('an uninterrupted run for reference', () => {
    const r = runCli([...ARGS, '--out', join(dir, 'straight')]);
    expect(r.code, r.stderr).toBe(0);
  });
  for (const [k, [delay, signal]] of ([[200, 'SIGINT'], [1000, 'SIGTERM'], [2200, 'SIGINT']] as const).entries()) {
    // the earliest stop lands in a run with 2 threads (whose batches never wait on the event loop: the stop must
    // still be seen), the others in runs with 1; each resumes with the other number
    const workers = k === 0 ? 2 : 1;
    it(`stopped by ${signal} after ${delay} ms with ${workers} thread(s), exits 130 with a checkpoint, and resumes with ${3 - workers} to the identical result`, async () => {
      const folder = join(dir, `stopped${k}`);
      const code = await runAndStop([...ARGS, '--workers', String(workers), '--out', folder], folder, delay, signal);
      expect(code).toBe(130);
      expect(existsSync(join(folder, 'checkpoint.json'))).toBe(true);
      expect(existsSync(join(folder, 'designs/rank01.design.json'))).toBe(true); // the best so far
      const again = runCli(['optimize', '--resume', folder, '--quiet', '--workers', String(3 - workers)]);
      expect(again.code, again.stderr).toBe(0);
      expect(existsSync(join(folder, 'checkpoint.json'))).toBe(false);
      for (const f of ['designs/rank01.design.json', 'history.jsonl', 'ranking.csv', 'best.pdb']) {
        expect(readFileSync(join(folder, f), 'utf8'), f).toBe(readFileSync(join(dir, 'straight', f), 'utf8'));
      }
    });
  }
  it('refuses to resume a finished run or a folder without a job', () => {
    expect(runCli(['optimize', '--resume', join(dir, 'straight')]).stderr).toMatch(/nothing to resume/);
    const r = runCli(['optimize', '--resume', dir]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/not a lumenfold run folder/);
  });
});

describe('an interrupted sweep', () => {
  const sweepFile = join(dir, 'sweep.yaml');
  writeFileSync(sweepFile, [
    'format: lumenfold.sweep/1',
    `constraints: ${join(ROOT, 'constraints/demo-helix.yaml')}`,
    `objective: ${join(ROOT, 'objectives/demo-robust.yaml')}`,
    'vary:',
    '  - path: objective.model.temperature',
    '    values: [200, 295]',
    '',
  ].join('\n'));
  const args = (out: string) => ['sweep', sweepFile, '--budget', '2000', '--seed', '4', '--quiet', '--out', out];
  it('continues from the checkpoint of the point it was stopped in, to the same summary', async () => {
    const straight = runCli(args(join(dir, 'sweep-straight')));
    expect(straight.code, straight.stderr).toBe(0);
    const out = join(dir, 'sweep-stopped');
    const code = await new Promise<number | null>((resolve) => {
      const child = spawn(process.execPath, [BIN, ...args(out)], { stdio: 'ignore', cwd: tmpdir() });
      const timer = setInterval(() => {
        if (!existsSync(out) || !readdirSync(out).some((f) => /^000-/.test(f))) return;
        clearInterval(timer);
        setTimeout(() => child.kill('SIGINT'), 500);
      }, 10);
      child.on('exit', (c) => { clearInterval(timer); resolve(c); });
    });
    expect(code).toBe(130);
    const again = runCli(args(out));
    expect(again.code, again.stderr).toBe(0);
    expect(readFileSync(join(out, 'summary.csv'), 'utf8')).toBe(readFileSync(join(dir, 'sweep-straight', 'summary.csv'), 'utf8'));
  });
  it('with --workers 2 also continues to the same summary as a straight run with one thread', async () => {
    const out = join(dir, 'sweep-stopped-two');
    const two = (o: string) => [...args(o), '--workers', '2'];
    const code = await new Promise<number | null>((resolve) => {
      const child = spawn(process.execPath, [BIN, ...two(out)], { stdio: 'ignore', cwd: tmpdir() });
      const timer = setInterval(() => {
        if (!existsSync(out) || !readdirSync(out).some((f) => /^000-/.test(f))) return;
        clearInterval(timer);
        setTimeout(() => child.kill('SIGINT'), 500);
      }, 10);
      child.on('exit', (c) => { clearInterval(timer); resolve(c); });
    });
    expect(code).toBe(130);
    expect(readdirSync(out).filter((f) => /^00[01]-/.test(f)).some((p) => existsSync(join(out, p, 'checkpoint.json')))).toBe(true);
    const again = runCli(two(out));
    expect(again.code, again.stderr).toBe(0);
    expect(readFileSync(join(out, 'summary.csv'), 'utf8')).toBe(readFileSync(join(dir, 'sweep-straight', 'summary.csv'), 'utf8'));
  });
});
