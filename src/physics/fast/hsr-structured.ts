import { NumericalError } from '../../errors.js';
import { CM_TO_RAD_PER_PS } from '../constants.js';
import { complexZeros } from '../linalg/complex-dense.js';
import { luFactor, luSolve } from '../linalg/lu.js';
import { diagonalInEigenbasis, type Eigenbasis, eigenbasis, multiplyByG, siteDiagonal, symmetricInEigenbasis } from './eigenbasis.js';
import { hsrEigenvectors } from './hsr-eigenvectors.js';
import { populationCoupling } from './population-coupling.js';
import { type ProbeOperator, probeImage, probeResidual, probeVector } from './residual-probe.js';

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
  readonly eigenSolver: 'complex-symmetric' | 'unitary-qr';
}

/** Code of the NumericalError thrown when the structured path cannot vouch for its answer. */
export const STRUCTURED_UNAVAILABLE = 'structured-unavailable';
/** Eigenvector bases worse conditioned than this are not used (cond_1(V) estimate). */
export const MAX_EIGENVECTOR_CONDITION = 1e8;
/** Largest relative residual a probe may see. */
export const MAX_PROBE_RESIDUAL = 1e-10;
/** Largest |eta + loss - 1| accepted. */
export const MAX_BALANCE_RESIDUAL = 1e-9;
const PROBES = 2;

function unavailable(reason: string): never {
  throw new NumericalError(reason, STRUCTURED_UNAVAILABLE);
}

/**
 * Efficiency, loss and mean transfer time of the Haken-Strobl-Reineker model in O(N^4) time and O(N^3)
 * memory instead of the dense O(N^6) / O(N^4). In the site basis the generator is
 *   L(X) = A X + X A^H + gamma diag(X),   A = -i H - (K + gamma I)/2,
 * K = diag(loss + trap rate): the Lyapunov operator L0(X) = A X + X A^H plus a rank-N diagonal part.
 * With A = V Lambda V^T (A is complex symmetric, so V^-1 = V^T), L0^-1(C) = V [(V^T C conj(V)) o G] V^H,
 * G_ij = 1 / (lambda_i + conj(lambda_j)) (the Bartels-Stewart idea with a diagonal A, Golub and Van Loan,
 * Matrix Computations, 4th ed., sec. 7.6.3). The solution of L(X) = B has diagonal d = u - gamma M d with
 * u = diag(L0^-1(B)) and M_km = [L0^-1(E_mm)]_kk (the Sherman-Morrison-Woodbury identity for the rank-N
 * correction, Golub and Van Loan sec. 2.1.4), so (I + gamma M) d = u is an N x N solve, and
 * X = L0^-1(B - gamma diag(d)). Forming M is the O(N^4) step.
 * X = -L^-1 rho0 gives eta = sum_t k_t X_tt and the loss; Y = L^-1(-X) = L^-2 rho0 gives tau.
 * Both solutions are checked by residual probes (residual-probe.ts) and eta + loss = 1; when a check fails
 * a NumericalError with code STRUCTURED_UNAVAILABLE says why, and the caller falls back to the dense solve.
 */
export function structuredHsr(p: HsrProblem): StructuredHsrResult {
  const { n, dephasing: gamma } = p;
  // K (loss + trap) is kept apart from K + gamma: recovering a 1e-3 loss from 1e4 + 1e-3 would cost 8 digits
  const k = new Float64Array(n), decay = new Float64Array(n);
  for (let m = 0; m < n; m++) { k[m] = p.lossRates[m] + p.trapRates[m]; decay[m] = k[m] + gamma; }
  // H in rad/ps with its mean diagonal taken out (a multiple of I cancels in L)
  let mean = 0;
  for (let m = 0; m < n; m++) mean += p.hamiltonian[m * n + m];
  mean /= n;
  const h = new Float64Array(n * n);
  for (let k = 0; k < n * n; k++) h[k] = p.hamiltonian[k] * CM_TO_RAD_PER_PS;
  for (let m = 0; m < n; m++) h[m * n + m] -= mean * CM_TO_RAD_PER_PS;
  // S0 = H - i K/2 = i A0 (dephasing left out: it shifts A by -gamma/2 I and is added exactly in eigenbasis.ts)
  const s = complexZeros(n);
  s.re.set(h);
  for (let m = 0; m < n; m++) s.im[m * n + m] = -0.5 * k[m];
  const eig = hsrEigenvectors(s, MAX_EIGENVECTOR_CONDITION);
  if ('failure' in eig) unavailable(eig.failure);
  // lambda0 = -i mu
  const lr = Float64Array.from(eig.valuesIm), li = eig.valuesRe.map((x) => -x);
  const e = eigenbasis(lr, li, eig.vectors, gamma);
  if (!(e.gapRatio > 1e-13)) unavailable(`the Lyapunov part is nearly singular (min |lambda_i + conj(lambda_j)| / max |lambda| = ${e.gapRatio.toExponential(2)})`);
  const F = populationCoupling(e);
  let lu;
  try {
    lu = luFactor(F, n, false);
  } catch (err) {
    unavailable(`the population system I + gamma M is singular (${(err as Error).message})`);
  }
  const solve = (rhs: Float64Array) => {
    const w = multiplyByG(e, Float64Array.from(rhs));
    const d = luSolve(lu, siteDiagonal(e, w));
    const x = diagonalInEigenbasis(e, d);
    for (let k = 0; k < x.length; k++) x[k] = rhs[k] - gamma * x[k];
    multiplyByG(e, x);
    return { packed: x, diagonal: siteDiagonal(e, x), predicted: d };
  };
  const rho0Packed = symmetricInEigenbasis(e, p.rho0);
  for (let k = 0; k < rho0Packed.length; k++) rho0Packed[k] = -rho0Packed[k];
  const X = solve(rho0Packed);
  const Y = solve(X.packed.map((x) => -x));
  checkConsistent('X', X.diagonal, X.predicted);
  checkConsistent('Y', Y.diagonal, Y.predicted);
  const op: ProbeOperator = { n, h, decay, gamma };
  let worst = 0;
  for (let t = 0; t < PROBES; t++) {
    const z = probeVector(n, t);
    const xz = probeImage(e, X.packed, z);
    const yz = probeImage(e, Y.packed, z);
    let zrz = 0; // z^H rho0 z
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const r = p.rho0[i * n + j];
      if (r !== 0) zrz += r * (z.zr[i] * z.zr[j] + z.zi[i] * z.zi[j]);
    }
    worst = Math.max(worst, probeResidual(op, xz, X.diagonal, -zrz), probeResidual(op, yz, Y.diagonal, -xz.quadratic));
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

/** The site diagonal of the assembled solution must match the one the N x N solve predicted. */
function checkConsistent(name: string, got: Float64Array, predicted: Float64Array): void {
  let diff = 0, size = 0;
  for (let k = 0; k < got.length; k++) { diff = Math.max(diff, Math.abs(got[k] - predicted[k])); size = Math.max(size, Math.abs(predicted[k])); }
  if (!(diff <= 1e-9 * size)) unavailable(`the populations of ${name} do not match the N x N solve (difference ${(diff / size).toExponential(2)} relative)`);
}

export type { Eigenbasis };
