// Transport benchmark: time per evaluation (efficiency + transfer time) for N = 7, 16, 32, 64 and each model,
// side by side in one run with a dense Liouvillian solve in numpy and QuTiP's construction on the same problem
// (bench/reference_timing.py, Debian's python3). Ratios are numpy time / lumenfold time.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateTransport, systemFromHamiltonian } from '../dist/physics/index.js';

const PYTHON = '/usr/bin/python3';

function rng(seed) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A seeded random hsr problem of n sites: energies in [0, 400], couplings in [-100, 100] cm^-1, trap at the last site. */
export function randomCase(n) {
  const r = rng(1000 + n);
  const H = Array.from({ length: n }, () => new Array(n).fill(0));
  for (let i = 0; i < n; i++) {
    H[i][i] = 400 * r();
    for (let j = i + 1; j < n; j++) H[i][j] = H[j][i] = 100 * (2 * r() - 1);
  }
  return { hamiltonian_cm: H, trap_sites: [n - 1], trap_rate_ps: 1, loss_rate_ps: 0.001, dephasing_ps: 10, start_site: 0 };
}

/** Median time (ms) of fn over repeats that fill about budgetMs (at least one, at most 2000). */
export function timeIt(fn, budgetMs = 1000) {
  const first = performance.now();
  fn();
  const once = performance.now() - first;
  const reps = Math.max(1, Math.min(2000, Math.floor(budgetMs / Math.max(once, 1e-3))));
  const times = [];
  for (let k = 0; k < reps; k++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(times.length / 2)], reps };
}

function pythonTimes(c) {
  const dir = mkdtempSync(join(tmpdir(), 'lumenfold-bench-'));
  const file = join(dir, 'case.json');
  writeFileSync(file, JSON.stringify(c));
  try {
    const out = execFileSync(PYTHON, ['bench/reference_timing.py', '--case-json', file], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 600_000 });
    return out.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l));
  } catch (e) {
    return [{ method: 'python', skipped: `python reference not available (${e.message.split('\n')[0]})` }];
  }
}

export async function runTransportBench({ sizes = [7, 16, 32, 64] } = {}) {
  const rows = [];
  let hsr7 = NaN;
  for (const n of sizes) {
    const c = randomCase(n);
    const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps, reorganization: 35 });
    const base = { trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site } };
    const opts = { hsr: { model: 'hsr', dephasing: c.dephasing_ps }, redfield: { model: 'redfield', temperature: 300, cutoff: 100 }, forster: { model: 'forster', temperature: 300 } };
    const budget = n >= 64 ? 1 : 1500;
    const ts = {};
    for (const [model, o] of Object.entries(opts)) {
      const t = timeIt(() => evaluateTransport(sys, { ...base, ...o }), budget);
      ts[model] = t;
      if (model === 'hsr' && n === 7) hsr7 = t.ms;
    }
    const eta = evaluateTransport(sys, { ...base, ...opts.hsr }).efficiency;
    const py = pythonTimes(c);
    const pick = (method) => py.find((p) => p.method === method);
    const npDense = pick('numpy-dense-build+solve');
    const qt = pick('qutip-sparse-build+solve');
    const fmt = (p) => (!p ? 'n/a' : p.skipped ? 'skipped' : p.median_ms.toPrecision(3));
    const ratio = (p) => (!p || p.skipped ? '' : (p.median_ms / ts.hsr.ms).toPrecision(3));
    const agree = npDense && !npDense.skipped ? Math.abs(npDense.efficiency - eta).toExponential(1) : '';
    rows.push([n, ts.hsr.ms.toPrecision(3), ts.redfield.ms.toPrecision(3), ts.forster.ms.toPrecision(3), fmt(npDense), ratio(npDense), fmt(qt), ratio(qt), agree]);
  }
  const head = ['N', 'hsr ms', 'redfield ms', 'forster ms', 'numpy dense ms', 'numpy/hsr', 'qutip ms', 'qutip/hsr', '|d eta| vs numpy'];
  console.log('\n## transport: time per evaluation (efficiency + transfer time), median');
  console.log(head.join(' | '));
  for (const r of rows) console.log(r.join(' | '));
  console.log('numpy dense: N^2 x N^2 complex superoperator from kron formulas + numpy.linalg.solve (build included);');
  console.log('qutip: qutip.liouvillian of the same collapse operators + scipy.sparse.linalg.splu (build included).');
  return { hsr7Ms: hsr7 };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const sizes = process.argv.slice(2).map(Number).filter((x) => x > 1);
  await runTransportBench(sizes.length ? { sizes } : {});
}
