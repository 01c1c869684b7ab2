// Transport benchmark: time per evaluation (efficiency + transfer time) for N = 7, 16, 32, 64, 128, side by side
// in one run: lumenfold's structured hsr solver, lumenfold's dense hsr solve (up to N = 32), a dense Liouvillian
// solve in numpy and QuTiP's construction with a sparse LU on the same problem (bench/reference_timing.py with
// Debian's python3), plus redfield (structured, and dense up to N = 32) and forster; then the fitted exponent of
// the structured solvers' cost in N (least squares on log-log over N = 16..128) and the time and peak memory of
// a fresh process for N = 100 and 128.
// Ratios are reference time / lumenfold structured time.
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateTransport, systemFromHamiltonian } from '../dist/physics/index.js';

const PYTHON = '/usr/bin/python3';
/** Largest N for lumenfold's dense hsr and redfield solves (N = 64 is a 4096 x 4096 LU: about a minute). */
const DENSE_MAX_N = 32;
/** Skip a python method whose run is predicted (N^6 from the last measured size) to take longer than this. */
const PYTHON_MAX_S = 60;

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

/**
 * Median time (ms) of fn over repeats that fill about budgetMs (at least one, at most 2000), after a warm-up
 * of about a quarter of the budget so that the JIT has compiled the hot path (V8 optimizes a function only
 * after many calls; a 7-site evaluation runs some ten thousand times before it is measured).
 */
export function timeIt(fn, budgetMs = 1000) {
  const start = performance.now();
  while (performance.now() - start < budgetMs / 4) fn();
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
    const out = execFileSync(PYTHON, ['bench/reference_timing.py', '--case-json', file], { encoding: 'utf8', stdio: ['ignore', 'pipe', 'ignore'], timeout: 900_000 });
    return out.split('\n').filter((l) => l.startsWith('{')).map((l) => JSON.parse(l));
  } catch (e) {
    return [{ method: 'python', skipped: `python reference not available (${e.message.split('\n')[0]})` }];
  }
}

/** Slope of log t against log N by least squares. */
export function fitExponent(points) {
  const xs = points.map((p) => Math.log(p[0])), ys = points.map((p) => Math.log(p[1]));
  const mx = xs.reduce((a, b) => a + b, 0) / xs.length, my = ys.reduce((a, b) => a + b, 0) / ys.length;
  let sxy = 0, sxx = 0;
  for (let i = 0; i < xs.length; i++) { sxy += (xs[i] - mx) * (ys[i] - my); sxx += (xs[i] - mx) ** 2; }
  return sxy / sxx;
}

/** Time and peak memory of one structured hsr evaluation of size n in a fresh node process. */
function freshProcess(n) {
  const script = `
    import { evaluateTransport, systemFromHamiltonian } from './dist/physics/index.js';
    import { randomCase } from './bench/transport.js';
    const c = randomCase(${n});
    const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps });
    const o = { model: 'hsr', dephasing: c.dephasing_ps, trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site } };
    const t0 = performance.now();
    const r = evaluateTransport(sys, o);
    const first = performance.now() - t0;
    const t1 = performance.now();
    evaluateTransport(sys, o);
    const second = performance.now() - t1;
    console.log(JSON.stringify({ first, second, maxRssKiB: process.resourceUsage().maxRSS, solver: r.solver, eta: r.efficiency, tau: r.transferTime }));`;
  try {
    const out = execFileSync(process.execPath, ['--input-type=module', '-e', script], { encoding: 'utf8', timeout: 600_000 });
    return JSON.parse(out.trim().split('\n').pop());
  } catch (e) {
    return { error: e.message.split('\n')[0] };
  }
}

const fmt = (ms) => (ms === undefined ? 'n/a' : typeof ms === 'string' ? ms : ms.toPrecision(3));

export async function runTransportBench({ sizes = [7, 16, 32, 64, 128] } = {}) {
  const rows = [];
  const structured = [];
  const redfieldStructured = [];
  const notes = new Set();
  let hsr7 = NaN;
  let lastNumpy, lastQutip; // [n, seconds] of the largest numpy / QuTiP run, to predict the next
  for (const n of sizes) {
    const c = randomCase(n);
    const sys = systemFromHamiltonian(c.hamiltonian_cm, { traps: c.trap_sites, lossRate: c.loss_rate_ps, reorganization: 35 });
    const base = { trapRate: c.trap_rate_ps, start: { kind: 'site', site: c.start_site } };
    const hsr = { model: 'hsr', dephasing: c.dephasing_ps };
    const budget = n >= 64 ? 3000 : 1500;
    // options objects are built once, outside the timed calls
    const hsrStructured = { ...base, ...hsr, solver: 'structured' }, hsrDense = { ...base, ...hsr, solver: 'dense' };
    const s = timeIt(() => evaluateTransport(sys, hsrStructured), budget);
    structured.push([n, s.ms]);
    if (n === 7) hsr7 = s.ms;
    const r = evaluateTransport(sys, { ...base, ...hsr });
    const dense = n <= DENSE_MAX_N ? timeIt(() => evaluateTransport(sys, hsrDense), budget).ms : 'skipped';
    const rf = { ...base, model: 'redfield', temperature: 300, cutoff: 100 };
    const rfStructured = { ...rf, solver: 'structured' }, rfDense = { ...rf, solver: 'dense' }, fo = { ...base, model: 'forster', temperature: 300 };
    const redfield = timeIt(() => evaluateTransport(sys, rfStructured), budget).ms;
    redfieldStructured.push([n, redfield]);
    const redfieldDense = n <= DENSE_MAX_N ? timeIt(() => evaluateTransport(sys, rfDense), budget).ms : 'skipped';
    const forster = timeIt(() => evaluateTransport(sys, fo), budget).ms;
    if (n > DENSE_MAX_N) notes.add(`lumenfold dense hsr and redfield skipped above N = ${DENSE_MAX_N}: an N^2 x N^2 LU (O(N^6)), about a minute at N = 64`);
    let py;
    // both python methods run in one process: skip it when either is predicted (N^6 from its last run) too slow
    const predict = (last) => (last ? last[1] * (n / last[0]) ** 6 : 0);
    const pn = predict(lastNumpy), pq = predict(lastQutip);
    if (Math.max(pn, pq) > PYTHON_MAX_S) {
      py = [{ method: 'numpy-dense-build+solve', skipped: `predicted ${pn.toFixed(0)} s (N^6 from N = ${lastNumpy?.[0]})` }, { method: 'qutip-sparse-build+solve', skipped: `predicted ${pq.toFixed(0)} s (N^6 from N = ${lastQutip?.[0]})` }];
    } else {
      py = pythonTimes(c);
    }
    const pick = (method) => py.find((p) => p.method === method) ?? py.find((p) => p.method === 'python');
    const np = pick('numpy-dense-build+solve');
    const qt = pick('qutip-sparse-build+solve');
    for (const p of [np, qt]) if (p?.skipped) notes.add(`${p.method ?? 'python'} at N = ${n}: ${p.skipped}`);
    if (np && !np.skipped) lastNumpy = [n, np.median_ms / 1e3];
    if (qt && !qt.skipped) lastQutip = [n, qt.median_ms / 1e3];
    const refMs = (p) => (!p || p.skipped ? undefined : p.median_ms);
    const ratio = (p) => (refMs(p) === undefined ? '' : (refMs(p) / s.ms).toPrecision(3));
    const agree = refMs(np) === undefined ? '' : Math.max(Math.abs(np.efficiency - r.efficiency) / np.efficiency, Math.abs(np.transfer_time_ps - r.transferTime) / np.transfer_time_ps).toExponential(1);
    rows.push([n, fmt(s.ms), fmt(dense), fmt(refMs(np) ?? 'skipped'), ratio(np), fmt(refMs(qt) ?? 'skipped'), ratio(qt), typeof dense === 'number' ? (dense / s.ms).toPrecision(3) : '', fmt(redfield), fmt(redfieldDense), fmt(forster), r.solver, agree]);
  }
  const head = ['N', 'hsr structured ms', 'hsr dense ms', 'numpy ms', 'numpy/structured', 'qutip ms', 'qutip/structured', 'dense/structured', 'redfield structured ms', 'redfield dense ms', 'forster ms', 'hsr auto ran', 'rel diff vs numpy'];
  console.log('\n## transport: time per evaluation (hsr efficiency + transfer time unless named), median');
  console.log(head.join(' | '));
  for (const row of rows) console.log(row.join(' | '));
  const fitPts = structured.filter(([n]) => n >= 16 && n <= 128);
  if (fitPts.length >= 2) console.log(`fitted exponent of the structured hsr cost, N = ${fitPts.map((p) => p[0]).join(', ')} (least squares on log-log): ${fitExponent(fitPts).toFixed(2)}`);
  const rfPts = redfieldStructured.filter(([n]) => n >= 16 && n <= 128);
  if (rfPts.length >= 2) console.log(`fitted exponent of the structured redfield cost, same sizes: ${fitExponent(rfPts).toFixed(2)}`);
  for (const n of [100, 128]) {
    const f = freshProcess(n);
    if (f.error) console.log(`N = ${n}, fresh process: ${f.error}`);
    else console.log(`N = ${n}, fresh process: first evaluation ${f.first.toFixed(0)} ms (with JIT warm-up), second ${f.second.toFixed(0)} ms, peak RSS ${(f.maxRssKiB / 1024).toFixed(0)} MiB, solver ${f.solver}, eta ${f.eta.toFixed(6)}, tau ${f.tau.toPrecision(6)} ps`);
  }
  for (const note of notes) console.log(`note: ${note}`);
  console.log('hsr structured: physics/fast (eigenbasis of -iH - K/2, here a rank-one update of H\'s real eigenbasis; N x N population system, O(N^4)); dense: LU of the real N^2 x N^2 generator;');
  console.log('redfield structured: secular blocks with a uniform sink and the trap as a Woodbury correction, O(N^3); forster: LU of the N x N rate matrix;');
  console.log('numpy dense: N^2 x N^2 complex superoperator from kron formulas + numpy.linalg.solve (build included);');
  console.log('qutip: qutip.liouvillian of the same collapse operators + scipy.sparse.linalg.splu (build included).');
  return { hsr7Ms: hsr7 };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const sizes = process.argv.slice(2).map(Number).filter((x) => x > 1);
  await runTransportBench(sizes.length ? { sizes } : {});
}
