// Worker-pool benchmark: the demo optimization with 1 and 2 worker threads, side by side in one run.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const BIN = fileURLToPath(new URL('../bin/lumenfold.js', import.meta.url));

function timedRun(workers, budget, dir) {
  const out = join(dir, `w${workers}`);
  const t0 = performance.now();
  execFileSync(process.execPath, [BIN, 'optimize', '--budget', String(budget), '--seed', '2', '--workers', String(workers), '--out', out, '--quiet', '--json'], { cwd: dir, stdio: ['ignore', 'pipe', 'inherit'] });
  const seconds = (performance.now() - t0) / 1000;
  const best = readFileSync(join(out, 'designs', 'rank01.design.json'), 'utf8');
  return { seconds, best };
}

/** Wall time of a fixed CPU-bound loop in `n` processes at once: what the machine's cores can give in parallel. */
function spin(n) {
  const code = 'let s=0;for(let i=0;i<2e8;i++)s+=Math.sqrt(i);';
  const t0 = performance.now();
  execFileSync('/bin/sh', ['-c', Array.from({ length: n }, () => `"${process.execPath}" -e "${code}" &`).join(' ') + ' wait']);
  return (performance.now() - t0) / 1000;
}

export async function runWorkersBench({ quick } = {}) {
  const one0 = spin(1), two0 = spin(2);
  const budget = quick ? 1500 : 4000;
  const dir = mkdtempSync(join(tmpdir(), 'lumenfold-bench-workers-'));
  const one = timedRun(1, budget, dir);
  const two = timedRun(2, budget, dir);
  console.log(`\n## worker threads: demo optimization, ${budget} designs, whole command`);
  console.log('workers | seconds | speed-up | same best design');
  console.log(`1 | ${one.seconds.toFixed(2)} | 1.00 | -`);
  console.log(`2 | ${two.seconds.toFixed(2)} | ${(one.seconds / two.seconds).toFixed(2)} | ${one.best === two.best ? 'yes' : 'NO'}`);
  console.log(`machine's parallel capacity: a CPU-bound loop takes ${one0.toFixed(2)} s alone and ${two0.toFixed(2)} s as two processes at once, so two threads can give at most ${((2 * one0) / two0).toFixed(2)}x`);
  return { speedup: one.seconds / two.seconds };
}

if (import.meta.url === `file://${process.argv[1]}`) await runWorkersBench({ quick: process.argv.includes('--quick') });
