import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN, ROOT, runCli } from '../helpers/cli.js';

const dir = mkdtempSync(join(tmpdir(), 'lumenfold-resume-'));
// about 5 s of work on one core, so every stop below lands inside the run
const ARGS = ['optimize', '--budget', '3000', '--seed', '4', '--quiet'];

/** Start the binary and send `signal` `delay` ms after `ready()` holds; resolve with the exit code. */
function runAndStop(args: string[], ready: () => boolean, delay: number, signal: NodeJS.Signals): Promise<number | null> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [BIN, ...args], { stdio: 'ignore', cwd: tmpdir() });
    const timer = setInterval(() => {
      if (!ready()) return;
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
      // the run log appears once the run folder exists and the stop handlers are installed
      const code = await runAndStop([...ARGS, '--workers', String(workers), '--out', folder], () => existsSync(join(folder, 'run.log')), delay, signal);
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
  for (const workers of [1, 2]) {
    it(`stopped with ${workers} thread(s), continues from the checkpoint of the point it was stopped in to the summary of a straight run`, async () => {
      const straight = join(dir, 'sweep-straight');
      if (!existsSync(join(straight, 'summary.csv'))) {
        const r = runCli(args(straight));
        expect(r.code, r.stderr).toBe(0);
      }
      const out = join(dir, `sweep-stopped-${workers}`);
      const run = [...args(out), '--workers', String(workers)];
      const code = await runAndStop(run, () => existsSync(out) && readdirSync(out).some((f) => /^000-/.test(f)), 500, 'SIGINT');
      expect(code).toBe(130);
      expect(readdirSync(out).filter((f) => /^00[01]-/.test(f)).some((p) => existsSync(join(out, p, 'checkpoint.json')))).toBe(true);
      const again = runCli(run);
      expect(again.code, again.stderr).toBe(0);
      expect(readFileSync(join(out, 'summary.csv'), 'utf8')).toBe(readFileSync(join(straight, 'summary.csv'), 'utf8'));
    });
  }
});
