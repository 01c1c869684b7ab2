import { spawn } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { BIN, runCli } from '../helpers/cli.js';

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
    it(`stopped by ${signal} after ${delay} ms, exits 130 with a checkpoint, and resumes to the identical result`, async () => {
      const folder = join(dir, `stopped${k}`);
      const code = await runAndStop([...ARGS, '--out', folder], folder, delay, signal);
      expect(code).toBe(130);
      expect(existsSync(join(folder, 'checkpoint.json'))).toBe(true);
      expect(existsSync(join(folder, 'designs/rank01.design.json'))).toBe(true); // the best so far
      const again = runCli(['optimize', '--resume', folder, '--quiet', '--workers', String(1 + (k % 2))]);
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
