// Worker-pool benchmark: the demo optimization with 1 and 2 worker threads, side by side in one run, repeated
// with the runs interleaved (other work on a shared machine slows whichever run it overlaps).
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const BIN = fileURLToPath(new URL('../bin/lumenfold.js', import.meta.url));
/** Designs of the start-up run: enough for one batch, so that it times what does not grow with the budget. */
const STARTUP_BUDGET = 16;

/** One demo optimization; without a budget, the demo objective's own (8000 designs). */
function timedRun(workers, budget, dir) {
  const out = join(dir, `w${workers}-b${budget ?? 'demo'}`);
  const t0 = performance.now();
  const args = [BIN, 'optimize', ...(budget === undefined ? [] : ['--budget', String(budget)]), '--seed', '2', '--workers', String(workers), '--out', out, '--force', '--quiet', '--json'];
  execFileSync(process.execPath, args, { cwd: dir, stdio: ['ignore', 'pipe', 'inherit'] });
  const seconds = (performance.now() - t0) / 1000;
  const best = readFileSync(join(out, 'designs', 'rank01.design.json'), 'utf8');
  return { seconds, best };
}

/** Wall time of a fixed CPU-bound loop in `n` processes at once: what the machine's cores can give in parallel. */
function spin(n) {
  const code = 'let s=0;for(let i=0;i<1e8;i++)s+=Math.sqrt(i);';
  const t0 = performance.now();
  execFileSync('/bin/sh', ['-c', Array.from({ length: n }, () => `"${process.execPath}" -e "${code}" &`).join(' ') + ' wait']);
  return (performance.now() - t0) / 1000;
}

const median = (v) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];

export async function runWorkersBench({ quick } = {}) {
  // the run a user makes with the demo: its objective's budget (short runs are dominated by start-up)
  const budget = quick ? 1500 : undefined;
  // five: on a shared machine one run in three or four can land on a slow phase of the other core
  const repeats = quick ? 1 : 5;
  const dir = mkdtempSync(join(tmpdir(), 'lumenfold-bench-workers-'));
  const rows = [];
  for (let r = 0; r < repeats; r++) {
    // what the two cores give at this moment (a virtual machine's second core is not always a whole core)
    const spin1 = spin(1), spin2 = spin(2);
    const one = timedRun(1, budget, dir), two = timedRun(2, budget, dir);
    const start1 = timedRun(1, STARTUP_BUDGET, dir), start2 = timedRun(2, STARTUP_BUDGET, dir);
    rows.push({ one, two, start1, start2, capacity: (2 * spin1) / spin2 });
  }
  console.log(`\n## worker threads: demo optimization, ${budget ?? "the demo objective's budget of 8000"} designs, whole command (${repeats} interleaved repeats, median)`);
  console.log('workers | seconds | speed-up | start-up (budget 16), s | rest, s | speed-up of the rest | same best design');
  const s1 = median(rows.map((x) => x.one.seconds)), s2 = median(rows.map((x) => x.two.seconds));
  const f1 = median(rows.map((x) => x.start1.seconds)), f2 = median(rows.map((x) => x.start2.seconds));
  const ratio = median(rows.map((x) => x.one.seconds / x.two.seconds));
  const rest = median(rows.map((x) => (x.one.seconds - x.start1.seconds) / (x.two.seconds - x.start2.seconds)));
  const same = rows.every((x) => x.one.best === x.two.best);
  console.log(`1 | ${s1.toFixed(2)} | 1.00 | ${f1.toFixed(2)} | ${(s1 - f1).toFixed(2)} | 1.00 | -`);
  console.log(`2 | ${s2.toFixed(2)} | ${ratio.toFixed(2)} | ${f2.toFixed(2)} | ${(s2 - f2).toFixed(2)} | ${rest.toFixed(2)} | ${same ? 'yes' : 'NO'}`);
  console.log(`speed-up per repeat: ${rows.map((x) => (x.one.seconds / x.two.seconds).toFixed(2)).join(', ')}`);
  console.log(`machine's parallel capacity just before each repeat (a CPU-bound loop alone, and as two processes at once: 2 t1 / t2, the most two threads can give): ${rows.map((x) => x.capacity.toFixed(2)).join(', ')}`);
  const share = median(rows.map((x) => x.one.seconds / x.two.seconds / x.capacity));
  console.log(`speed-up as a share of that capacity, median: ${(100 * share).toFixed(0)}%`);
  return { speedup: ratio, restSpeedup: rest, capacityShare: share };
}

if (import.meta.url === `file://${process.argv[1]}`) await runWorkersBench({ quick: process.argv.includes('--quick') });
