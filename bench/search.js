// Search benchmark: evaluations needed to reach f - f_opt <= 1e-8 on the 10-D and 20-D BBOB separable
// ellipsoid (f2) and Rosenbrock (f8) for CMA-ES, DE (rand/1/bin) and random search (median of 10 seeds,
// 3 with `quick`), side by side in the same run with the best value SciPy's differential_evolution
// (bench/scipy_de.py, Debian's python3) reaches at the same budget; and the optimizer's own overhead
// per candidate (ask + tell, objective excluded) for CMA-ES on a 30-D problem.
import { spawn } from 'node:child_process';
import { pathToFileURL } from 'node:url';
import { bbob, createOptimizer, Rng, SearchSpace } from '../dist/search/index.js';

const PYTHON = '/usr/bin/python3';
const TARGET = 1e-8;
const PROBLEMS = [
  { fn: 'ellipsoid', dim: 10, cap: 100000 },
  { fn: 'rosenbrock', dim: 10, cap: 100000 },
  { fn: 'ellipsoid', dim: 20, cap: 200000 },
  { fn: 'rosenbrock', dim: 20, cap: 200000 },
];
const OPTIMIZERS = ['cmaes', 'de-rand1bin', 'random'];
/** One fixed shift x_opt per problem (BBOB instance drawn with our seeded generator). */
const INSTANCE_SEED = 2009;

/** Runs `name` until f - f_opt <= TARGET or `cap` evaluations; keeps the improvements of the best value. */
function run(name, f, cap, seed) {
  const space = new SearchSpace().reals('x', f.dim, -5, 5);
  const opt = createOptimizer(name, { space, rng: Rng.fromSeed(seed), batch: 1, budget: cap, objectives: 'single' });
  const x = new Float64Array(f.dim);
  let used = 0;
  let best = Infinity;
  let hit;
  const improvements = [];
  while (used < cap && hit === undefined) {
    const cands = opt.ask(1000);
    const scores = cands.map((c) => {
      for (let i = 0; i < f.dim; i++) x[i] = -5 + 10 * c.x[i];
      return f.evaluate(x) - f.fopt;
    });
    opt.tell(cands, scores);
    for (const s of scores) {
      used++;
      if (s < best) {
        best = s;
        improvements.push([used, s]);
      }
      if (hit === undefined && best <= TARGET) hit = used;
    }
  }
  return { hit, best, improvements };
}

/** Best value a run had after `budget` evaluations. */
function bestAt(r, budget) {
  let best = Infinity;
  for (const [used, v] of r.improvements) {
    if (used > budget) break;
    best = v;
  }
  return best;
}

const median = (xs) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
};

/** Median evaluations to target, counting failures as Infinity (so the median says "not reached" when most fail). */
function medianHits(runs) {
  return median(runs.map((r) => r.hit ?? Infinity));
}

function scipyDe(request) {
  return new Promise((resolve, reject) => {
    const child = spawn(PYTHON, [new URL('./scipy_de.py', import.meta.url).pathname], { stdio: ['pipe', 'pipe', 'inherit'] });
    let out = '';
    child.stdout.on('data', (d) => (out += d));
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve(JSON.parse(out)) : reject(new Error(`scipy_de.py exited with ${code}`))));
    child.stdin.end(JSON.stringify(request));
  });
}

/** Optimizer overhead per candidate in ms: ask + tell only, objective excluded. */
function overhead(name, dim, evaluations) {
  const f = bbob('ellipsoid', dim, INSTANCE_SEED);
  const space = new SearchSpace().reals('x', dim, -5, 5);
  const opt = createOptimizer(name, { space, rng: Rng.fromSeed(1), batch: 1, budget: Infinity, objectives: 'single' }, name === 'cmaes' ? { restarts: 0 } : {});
  const x = new Float64Array(dim);
  let spent = 0;
  let used = 0;
  while (used < evaluations) {
    const t0 = performance.now();
    const cands = opt.ask(1000);
    const t1 = performance.now();
    const scores = cands.map((c) => {
      for (let i = 0; i < dim; i++) x[i] = -5 + 10 * c.x[i];
      return f.evaluate(x);
    });
    const t2 = performance.now();
    opt.tell(cands, scores);
    const t3 = performance.now();
    if (used >= 2000) spent += t1 - t0 + (t3 - t2); // the first 2000 warm up the JIT
    used += cands.length;
  }
  return spent / (used - 2000);
}

const fmtEvals = (v, cap) => (Number.isFinite(v) ? String(Math.round(v)) : `>${cap}`);
const fmtF = (v) => (v <= TARGET ? '<=1e-8' : v.toExponential(1));

export async function runSearchBench({ quick = false } = {}) {
  const seeds = Array.from({ length: quick ? 3 : 10 }, (_, i) => i + 1);
  const started = performance.now();
  console.log(`\n== search: evaluations to f - f_opt <= 1e-8, median of ${seeds.length} seeds (BBOB f2 separable ellipsoid, f8 Rosenbrock, shifted x_opt) ==`);
  const fns = PROBLEMS.map((p) => bbob(p.fn, p.dim, INSTANCE_SEED));
  // 1. CMA-ES first: the budget at which its slowest run reached 1e-8 is the equal budget B.
  const cma = fns.map((f, k) => seeds.map((s) => run('cmaes', f, PROBLEMS[k].cap, s)));
  const budgets = cma.map((runs, k) => Math.max(...runs.map((r) => r.hit ?? PROBLEMS[k].cap)));
  const probe = (f) => [Array.from(f.xopt, (v) => v + 0.3), Array.from(f.xopt, (v, i) => (i % 2 ? v - 1 : 0))];
  const request = {
    seeds,
    problems: fns.map((f, k) => ({ fn: f.name, dim: f.dim, xopt: Array.from(f.xopt), budget: budgets[k], probe: probe(f) })),
  };
  // 2. SciPy runs in another process while our DE and random search run here.
  const scipyPromise = scipyDe(request);
  const others = {};
  for (const name of ['de-rand1bin', 'random']) others[name] = fns.map((f, k) => seeds.map((s) => run(name, f, PROBLEMS[k].cap, s)));
  const scipy = await scipyPromise;
  // 3. Table.
  const rows = [['problem', 'CMA-ES evals', 'DE evals', 'random evals', 'equal budget B', 'CMA-ES best@B', 'DE best@B', 'SciPy DE best@B', 'CMA-ES wins']];
  const wins = [];
  fns.forEach((f, k) => {
    const cap = PROBLEMS[k].cap;
    const s = scipy.results[k];
    const mismatch = probe(f).map((x, i) => Math.abs(f.evaluate(x) - s.probe[i]) / Math.max(1, Math.abs(s.probe[i])));
    if (Math.max(...mismatch) > 1e-9) throw new Error(`scipy_de.py computes another ${f.name} (relative difference ${Math.max(...mismatch)})`);
    const cmaBest = median(cma[k].map((r) => bestAt(r, budgets[k])));
    const scipyBest = median(s.best);
    const win = cmaBest < scipyBest;
    wins.push(win);
    const ok = (runs) => `${runs.filter((r) => r.hit !== undefined).length}/${seeds.length}`;
    rows.push([
      `${f.name} ${f.dim}-D`,
      `${fmtEvals(medianHits(cma[k]), cap)} (${ok(cma[k])})`,
      `${fmtEvals(medianHits(others['de-rand1bin'][k]), cap)} (${ok(others['de-rand1bin'][k])})`,
      `${fmtEvals(medianHits(others.random[k]), cap)} (${ok(others.random[k])})`,
      String(budgets[k]),
      fmtF(cmaBest),
      fmtF(median(others['de-rand1bin'][k].map((r) => bestAt(r, budgets[k])))),
      fmtF(scipyBest),
      win ? 'yes' : 'NO',
    ]);
  });
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  for (const r of rows) console.log(r.map((v, c) => v.padEnd(widths[c])).join('  '));
  console.log(`(n/m: runs that reached 1e-8 within ${PROBLEMS.map((p) => p.cap).join('/')} evaluations; B: evaluations of the slowest CMA-ES run;`);
  console.log(` best@B: median best f - f_opt after B evaluations; SciPy ${scipy.scipy} differential_evolution defaults, polish off, tol 0)`);
  // 4. Overhead: median of 5 repetitions (the machine is shared; a single timing can be far off).
  const repeat = (name) => median(Array.from({ length: 5 }, () => overhead(name, 30, quick ? 12000 : 30000)));
  const overheadPerCandidateMs = repeat('cmaes');
  const deOverhead = repeat('de-rand1bin');
  console.log(`optimizer overhead per candidate, 30-D ellipsoid (ask + tell, objective excluded, median of 5): CMA-ES ${(overheadPerCandidateMs * 1000).toFixed(1)} us, DE ${(deOverhead * 1000).toFixed(1)} us`);
  console.log(`CMA-ES beats SciPy's DE at equal budget on ${wins.filter(Boolean).length}/${wins.length} problems; search section took ${((performance.now() - started) / 1000).toFixed(1)} s`);
  return { overheadPerCandidateMs, wins: wins.filter(Boolean).length, problems: wins.length };
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  await runSearchBench({ quick: process.argv.includes('--quick') });
}
