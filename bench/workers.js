// Worker-pool benchmark: the demo optimization with 1 and 2 worker threads, side by side in one run, repeated
// with the runs interleaved (other work on a shared machine slows whichever run it overlaps). Two run sizes:
// the demo objective's own budget, and three times that (a longer campaign, where the fixed costs of a run,
// start-up and compiling the code on each thread, weigh less). Beside them, what the machine's two cores can
// give this same work: two single-thread runs started together, against one alone.
import { execFileSync, spawn } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const BIN = fileURLToPath(new URL('../bin/lumenfold.js', import.meta.url));
/** Designs of the start-up run: enough for one batch, so that it times what does not grow with the budget. */
const STARTUP_BUDGET = 16;
/** The demo objective's budget (objectives/demo-robust.yaml), and the longer run's. */
const DEMO_BUDGET = 8000;
const LONG_BUDGET = 3 * DEMO_BUDGET;

function runArgs(workers, budget, out) {
  return [BIN, 'optimize', ...(budget === undefined ? [] : ['--budget', String(budget)]), '--seed', '2', '--workers', String(workers), '--out', out, '--force', '--quiet', '--json'];
}

/** One demo optimization; without a budget, the demo objective's own. */
function timedRun(workers, budget, dir) {
  const out = join(dir, `w${workers}-b${budget ?? 'demo'}`);
  const t0 = performance.now();
  execFileSync(process.execPath, runArgs(workers, budget, out), { cwd: dir, stdio: ['ignore', 'pipe', 'inherit'] });
  const seconds = (performance.now() - t0) / 1000;
  const best = readFileSync(join(out, 'designs', 'rank01.design.json'), 'utf8');
  return { seconds, best };
}

/** Two single-thread demo optimizations started together: the mean of their wall times, s. */
async function pairedRuns(budget, dir) {
  const one = (k) => new Promise((resolve, reject) => {
    const t0 = performance.now();
    const child = spawn(process.execPath, runArgs(1, budget, join(dir, `pair${k}`)), { cwd: dir, stdio: ['ignore', 'ignore', 'inherit'] });
    child.on('error', reject);
    child.on('exit', (code) => (code === 0 ? resolve((performance.now() - t0) / 1000) : reject(new Error(`paired run exited with ${code}`))));
  });
  const [a, b] = await Promise.all([one(1), one(2)]);
  return (a + b) / 2;
}

/** Wall time of a fixed CPU-bound loop in `n` processes at once: what the cores give to arithmetic alone. */
function spin(n) {
  const code = 'let s=0;for(let i=0;i<1e8;i++)s+=Math.sqrt(i);';
  const t0 = performance.now();
  execFileSync('/bin/sh', ['-c', Array.from({ length: n }, () => `"${process.execPath}" -e "${code}" &`).join(' ') + ' wait']);
  return (performance.now() - t0) / 1000;
}

const median = (v) => [...v].sort((a, b) => a - b)[Math.floor(v.length / 2)];
const fixed = (v, d = 2) => v.toFixed(d);

/** Repeats of one run size: 1 and 2 workers, and (demo size only) the start-up runs and the paired runs. */
async function measure(budget, repeats, dir, { startup, paired }) {
  const rows = [];
  for (let r = 0; r < repeats; r++) {
    const row = {};
    if (paired) row.spin = (2 * spin(1)) / spin(2);
    row.one = timedRun(1, budget, dir);
    row.two = timedRun(2, budget, dir);
    if (paired) row.pair = await pairedRuns(budget, dir);
    if (startup) {
      row.start1 = timedRun(1, STARTUP_BUDGET, dir).seconds;
      row.start2 = timedRun(2, STARTUP_BUDGET, dir).seconds;
    }
    rows.push(row);
  }
  return rows;
}

function report(label, budget, rows) {
  const s1 = median(rows.map((x) => x.one.seconds)), s2 = median(rows.map((x) => x.two.seconds));
  const ratio = median(rows.map((x) => x.one.seconds / x.two.seconds));
  const same = rows.every((x) => x.one.best === x.two.best);
  const line = [label, budget, rows.length, fixed(s1), fixed(s2), fixed(ratio), rows.map((x) => fixed(x.one.seconds / x.two.seconds)).join(', ')];
  if (rows[0].pair !== undefined) {
    const capacity = median(rows.map((x) => (2 * x.one.seconds) / x.pair));
    line.push(fixed(capacity), `${fixed((100 * ratio) / capacity, 0)}%`);
  } else line.push('-', '-');
  line.push(same ? 'yes' : 'NO');
  console.log(line.join(' | '));
  return ratio;
}

export async function runWorkersBench({ quick } = {}) {
  const dir = mkdtempSync(join(tmpdir(), 'lumenfold-bench-workers-'));
  // five: on a shared machine one run in three or four lands on a slow phase of the other core
  const demoBudget = quick ? 1500 : DEMO_BUDGET;
  const demo = await measure(demoBudget, quick ? 1 : 5, dir, { startup: true, paired: true });
  const long = quick ? [] : await measure(LONG_BUDGET, 3, dir, { startup: false, paired: false });
  console.log('\n## worker threads: the demo optimization with 1 and 2 threads, whole command, interleaved repeats (medians)');
  console.log('run | designs | repeats | 1 thread, s | 2 threads, s | speed-up | speed-up per repeat | two-core capacity for this work | speed-up as a share of it | same best design');
  const demoRatio = report('demo objective', demoBudget, demo);
  const longRatio = long.length ? report('three times longer', LONG_BUDGET, long) : undefined;
  console.log('two-core capacity for this work: 2 x (one single-thread run alone) / (two single-thread runs started together), the most two threads could give the demo run on this machine with no serial part at all');
  console.log(`arithmetic alone (a square-root loop, 2 t1 / t2), per repeat: ${demo.map((x) => fixed(x.spin)).join(', ')}`);
  const f1 = median(demo.map((x) => x.start1)), f2 = median(demo.map((x) => x.start2));
  console.log(`start-up (a run of one batch, ${STARTUP_BUDGET} designs): ${fixed(f1)} s with 1 thread, ${fixed(f2)} s with 2; the demo run without it: speed-up ${fixed(median(demo.map((x) => (x.one.seconds - x.start1) / (x.two.seconds - x.start2))))}`);
  return { speedup: demoRatio, longSpeedup: longRatio };
}

if (import.meta.url === `file://${process.argv[1]}`) await runWorkersBench({ quick: process.argv.includes('--quick') });
