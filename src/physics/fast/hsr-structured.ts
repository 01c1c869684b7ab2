import { CM_TO_RAD_PER_PS } from '../constants.js';
import { luFactor, luSolveInPlace } from '../linalg/lu.js';
import { Workspace } from '../linalg/workspace.js';
import { diagonalInEigenbasis, type Eigenbasis, eigenbasis, multiplyByG, siteDiagonal, siteDiagonalPair, symmetricInEigenbasis } from './eigenbasis.js';
import { hsrEigenvectors } from './hsr-eigenvectors.js';
import { populationCoupling } from './population-coupling.js';
import { makeProbe, type ProbeOperator, probeImage, probeResidual } from './residual-probe.js';
import { unavailable } from './structured-errors.js';

/** The hsr problem in plain arrays (validated by the caller). */
export interface HsrProblem {
  readonly n: number;
  /** Row-major N x N, cm^-1. */
  readonly hamiltonian: Float64Array;
  /** Per site, ps^-1. */
  readonly trapRates: Float64Array;
  readonly lossRates: Float64Array;
  /** gamma_phi, ps^-1. */
  readonly dephasing: number;
  /** Site-basis initial density matrix (real symmetric, trace 1). */
  readonly rho0: Float64Array;
}

export interface StructuredHsrResult {
  readonly efficiency: number;
  readonly lossFraction: number;
  readonly transferTime: number;
  readonly balanceResidual: number;
  /** Largest relative residual of the two solves seen by the probes. */
  readonly probeResidual: number;
  /** 1-norm condition estimate ||V||_1 ||V^-1||_1 of the eigenvectors. */
  readonly eigenvectorCondition: number;
  /** Which eigen-solver produced the eigenbasis. */
  readonly eigenSolver: 'rank-one' | 'complex-symmetric' | 'unitary-qr';
}

/** Eigenvector bases worse conditioned than this are not used (cond_1(V) estimate). */
export const MAX_EIGENVECTOR_CONDITION = 1e8;
/** Largest relative residual a probe may see. */
export const MAX_PROBE_RESIDUAL = 1e-10;
/** Largest |eta + loss - 1| accepted. */
export const MAX_BALANCE_RESIDUAL = 1e-9;
/**
 * Random probes per solution. One suffices: a residual c times the tolerance passes a random quadratic form
 * with probability of order 1/c (the form's density near zero is bounded), X and Y are probed separately, and
 * the population consistency and eta + loss = 1 checks look at the same solutions.
 */
const PROBES = 1;
/** Scratch arrays shared by every call in this thread (each worker thread has its own module instance). */
const WORK = new Workspace();

/**
 * Efficiency, loss and mean transfer time of the Haken-Strobl-Reineker model in O(N^4) time and O(N^3)
 * memory instead of the dense O(N^6) / O(N^4). In the site basis the generator is
 *   L(X) = A X + X A^H + gamma diag(X),   A = -i H - (K + gamma I)/2,
 * K = diag(loss + trap rate): the Lyapunov operator L0(X) = A X + X A^H plus a rank-N diagonal part.
 * With A = V Lambda V^T (A is complex symmetric, so V^-1 = V^T), L0^-1(C) = V [(V^T C conj(V)) o G] V^H,
 * G_ij = 1 / (lambda_i + conj(lambda_j)) (Bartels and Stewart, Comm. ACM 15, 820 (1972), with A diagonalized
 * instead of triangularized). The solution of L(X) = B has diagonal d = u - gamma M d with u = diag(L0^-1(B))
 * and M_km = [L0^-1(E_mm)]_kk (the Sherman-Morrison-Woodbury identity for the rank-N correction; Hager,
 * SIAM Rev. 31, 221 (1989)), so (I + gamma M) d = u is an N x N solve, and
 * X = L0^-1(B - gamma diag(d)). Forming M is the O(N^4) step.
 * X = -L^-1 rho0 gives eta = sum_t k_t X_tt and the loss; Y = L^-1(-X) = L^-2 rho0 gives tau.
 * Both solutions are checked by residual probes (residual-probe.ts) and eta + loss = 1; when a check fails
 * a NumericalError with code STRUCTURED_UNAVAILABLE (structured-errors.ts) says why, and the caller falls back
 * to the dense solve.
 */
export function structuredHsr(p: HsrProblem): StructuredHsrResult {
  const ws = WORK;
  const { n, dephasing: gamma } = p;
  const len = n * n;
  const a = ws.frame('hsr', n, hsrArrays);
  // K (loss + trap) is kept apart from K + gamma: recovering a 1e-3 loss from 1e4 + 1e-3 would cost 8 digits
  const { k, decay } = a;
  for (let m = 0; m < n; m++) { k[m] = p.lossRates[m] + p.trapRates[m]; decay[m] = k[m] + gamma; }
  // H in rad/ps with its mean diagonal taken out (a multiple of I cancels in L)
  let mean = 0;
  for (let m = 0; m < n; m++) mean += p.hamiltonian[m * n + m];
  mean /= n;
  const h = a.h;
  for (let i = 0; i < len; i++) h[i] = p.hamiltonian[i] * CM_TO_RAD_PER_PS;
  for (let m = 0; m < n; m++) h[m * n + m] -= mean * CM_TO_RAD_PER_PS;
  // S0 = H - i K/2 = i A0 (dephasing left out: it shifts A by -gamma/2 I and is added exactly in eigenbasis.ts)
  // (the eigen-solvers do not modify their input: re can be h itself)
  const s = { n, re: h, im: a.si };
  for (let i = 0; i < len; i++) s.im[i] = 0;
  for (let m = 0; m < n; m++) s.im[m * n + m] = -0.5 * k[m];
  const eig = hsrEigenvectors(s, MAX_EIGENVECTOR_CONDITION, ws);
  if ('failure' in eig) unavailable(eig.failure);
  // lambda0 = -i mu
  const { lr, li } = a;
  for (let i = 0; i < n; i++) { lr[i] = eig.valuesIm[i]; li[i] = -eig.valuesRe[i]; }
  const e = eigenbasis(lr, li, eig.vectors, gamma, ws);
  if (!(e.gapRatio > 1e-13)) unavailable(`the Lyapunov part is nearly singular (min |lambda_i + conj(lambda_j)| / max |lambda| = ${e.gapRatio.toExponential(2)})`);
  const F = populationCoupling(e, ws);
  let lu;
  try {
    lu = luFactor(F, n, false, a.pivots);
  } catch (err) {
    unavailable(`the population system I + gamma M is singular (${(err as Error).message})`);
  }
  // X = L^-1(b): d = (I + gamma M)^-1 diag(L0^-1 b), X = L0^-1(b - gamma diag(d)), all packed in the eigenbasis;
  // then Y = L^-1(-X) the same way. diag(X) and diag(L0^-1(-X)) share one pass over u.
  const b = symmetricInEigenbasis(e, p.rho0, a.b, ws);
  for (let i = 0; i < len; i++) b[i] = -b[i];
  const { w, u } = a;
  w.set(b);
  multiplyByG(e, w);
  const dX = luSolveInPlace(lu, siteDiagonal(e, w, a.dx));
  const x = assemble(e, b, dX, gamma, a.x);
  const mx = a.mx;
  for (let i = 0; i < len; i++) mx[i] = -x[i];
  w.set(mx);
  multiplyByG(e, w);
  const X = { packed: x, diagonal: a.xd, predicted: dX };
  siteDiagonalPair(e, x, w, X.diagonal, u);
  const dY = luSolveInPlace(lu, u);
  const y = assemble(e, mx, dY, gamma, a.y);
  const Y = { packed: y, diagonal: siteDiagonal(e, y, a.yd), predicted: dY };
  checkConsistent('X', X.diagonal, X.predicted);
  checkConsistent('Y', Y.diagonal, Y.predicted);
  const op: ProbeOperator = { n, h, decay, gamma };
  let worst = 0;
  for (let t = 0; t < PROBES; t++) {
    const z = makeProbe(e, op, t, ws);
    let zrz = 0; // z^H rho0 z
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const r = p.rho0[i * n + j];
      if (r !== 0) zrz += r * (z.zr[i] * z.zr[j] + z.zi[i] * z.zi[j]);
    }
    const xz = probeImage(e, z, X.packed, ws);
    worst = Math.max(worst, probeResidual(z, xz, X.diagonal, -zrz));
    const zxz = xz.quadratic;
    // the second image reuses the first one's arrays
    worst = Math.max(worst, probeResidual(z, probeImage(e, z, Y.packed, ws), Y.diagonal, -zxz));
  }
  if (!(worst <= MAX_PROBE_RESIDUAL)) unavailable(`the residual check failed (relative residual ${worst.toExponential(2)} > ${MAX_PROBE_RESIDUAL})`);
  let efficiency = 0, lossFraction = 0, trapTime = 0;
  for (let m = 0; m < n; m++) {
    efficiency += p.trapRates[m] * X.diagonal[m];
    lossFraction += p.lossRates[m] * X.diagonal[m];
    trapTime += p.trapRates[m] * Y.diagonal[m];
  }
  const balanceResidual = Math.abs(efficiency + lossFraction - 1);
  if (!(balanceResidual <= MAX_BALANCE_RESIDUAL)) unavailable(`eta + loss misses 1 by ${balanceResidual.toExponential(2)}`);
  return {
    efficiency,
    lossFraction,
    transferTime: efficiency > 0 ? trapTime / efficiency : Infinity,
    balanceResidual,
    probeResidual: worst,
    eigenvectorCondition: eig.condition,
    eigenSolver: eig.solver,
  };
}

/** The solver's own arrays for n sites (kept in WORK between calls of the same size). */
function hsrArrays(n: number) {
  const v = (): Float64Array => new Float64Array(n), m = (): Float64Array => new Float64Array(n * n);
  return {
    n, k: v(), decay: v(), h: m(), si: m(), lr: v(), li: v(), pivots: new Int32Array(n),
    b: m(), w: m(), u: v(), dx: v(), x: m(), mx: m(), xd: v(), y: m(), yd: v(),
  };
}

/** X = L0^-1(rhs - gamma diag(d)) packed in the eigenbasis, into out. */
function assemble(e: Eigenbasis, rhs: Float64Array, d: Float64Array, gamma: number, out: Float64Array): Float64Array {
  diagonalInEigenbasis(e, d, out);
  for (let i = 0; i < out.length; i++) out[i] = rhs[i] - gamma * out[i];
  return multiplyByG(e, out);
}

/** The site diagonal of the assembled solution must match the one the N x N solve predicted. */
function checkConsistent(name: string, got: Float64Array, predicted: Float64Array): void {
  let diff = 0, size = 0;
  for (let k = 0; k < got.length; k++) { diff = Math.max(diff, Math.abs(got[k] - predicted[k])); size = Math.max(size, Math.abs(predicted[k])); }
  if (!(diff <= 1e-9 * size)) unavailable(`the populations of ${name} do not match the N x N solve (difference ${(diff / size).toExponential(2)} relative)`);
}

export type { Eigenbasis };
