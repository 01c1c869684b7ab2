import { type ComplexMatrix, normalizeColumnBilinear } from './complex-dense.js';
import type { ComplexEigen } from './complex-eigen.js';
import { NumericalError } from '../../errors.js';
import { cabs } from './complex-scalar.js';
import { complexSymmetricQl } from './complex-symmetric-ql.js';
import { applyQ, complexSymmetricTridiagonal, type ComplexSymmetricTridiagonal } from './complex-symmetric-tridiagonal.js';
import { tridiagonalEigenvectors } from './complex-tridiagonal-inverse-iteration.js';
import { scratch, type Workspace } from './workspace.js';

const EPS = Number.EPSILON;
/**
 * Up to this size the QL rotations are accumulated into the eigenvectors (imtql2, about 3 N^3 complex
 * operations, cheapest for small matrices); above it each vector comes from inverse iteration (O(N^2) each)
 * and the reflectors are applied once.
 */
export const ACCUMULATE_MAX = 24;
export type EigenvectorMethod = 'accumulate' | 'inverse-iteration';

/** Eigen-decomposition S = V diag(values) V^T of a complex symmetric matrix with V^T V = I. */
export interface ComplexSymmetricEigen extends ComplexEigen {
  /** Largest |v|^2 / |v^T v| of the tridiagonalization's reflectors (1 when they were real). */
  readonly growth: number;
}

/**
 * Eigenvalues and complex orthogonal eigenvectors of a complex symmetric matrix S (S^T = S): complex
 * orthogonal tridiagonalization, then complex symmetric QL: up to ACCUMULATE_MAX rows with its rotations
 * accumulated into the eigenvectors Y of T, above that for the eigenvalues of each block between negligible
 * off-diagonals with inverse iteration for its eigenvectors; then V = Q Y. The eigenvectors are
 * scaled so that V^T V = I (so V^-1 = V^T; Horn and Johnson, Matrix Analysis, 2nd ed., sec. 4.4), and their
 * 2-norms measure the eigenvalues' condition numbers.
 * The imaginary part shared by most diagonal entries is shifted out first (S - i sigma I has the same
 * eigenvectors) and the other rows are ordered first, so that a matrix whose imaginary part sits on one
 * diagonal entry, such as H - i K / 2 with one trap and a uniform loss, is reduced in real arithmetic.
 * Throws NumericalError where a complex orthogonal step is close to isotropic; use complexEigen then.
 * With a workspace the returned arrays live in it (workspace.ts). `vectors` forces one way to the eigenvectors.
 */
export function complexSymmetricEigen(s: ComplexMatrix, ws?: Workspace, vectors: 'auto' | EigenvectorMethod = 'auto'): ComplexSymmetricEigen {
  const { n } = s;
  const sigma = commonImaginaryDiagonal(s);
  const order = new Int32Array(n);
  let t0 = 0;
  for (let i = 0; i < n; i++) if (s.im[i * n + i] !== sigma) order[t0++] = i;
  for (let i = 0; i < n; i++) if (s.im[i * n + i] === sigma) order[t0++] = i;
  const p = { n, re: scratch(ws, 'cse.pr', n * n), im: scratch(ws, 'cse.pi', n * n) };
  for (let a = 0; a < n; a++) {
    const ra = order[a] * n;
    for (let b = 0; b < n; b++) {
      p.re[a * n + b] = s.re[ra + order[b]];
      p.im[a * n + b] = s.im[ra + order[b]];
    }
    p.im[a * n + a] -= sigma;
  }
  const t = complexSymmetricTridiagonal(p, ws, true);
  const valuesRe = scratch(ws, 'cse.lr', n), valuesIm = scratch(ws, 'cse.li', n);
  // eigenvectors of T into Y (p's storage is free again)
  const y = { n, re: p.re.fill(0), im: p.im.fill(0) };
  const method = vectors === 'auto' ? (n <= ACCUMULATE_MAX ? 'accumulate' : 'inverse-iteration') : vectors;
  if (method === 'accumulate') accumulatedVectors(t, valuesRe, valuesIm, y, ws);
  else inverseIterationVectors(t, valuesRe, valuesIm, y, ws);
  for (let c = 0; c < n; c++) valuesIm[c] += sigma;
  applyQ(t, y, ws);
  // undo the row order
  const v = { n, re: scratch(ws, 'cse.vr', n * n), im: scratch(ws, 'cse.vi', n * n) };
  for (let r = 0; r < n; r++) {
    const from = r * n, to = order[r] * n;
    for (let c = 0; c < n; c++) { v.re[to + c] = y.re[from + c]; v.im[to + c] = y.im[from + c]; }
  }
  return { n, valuesRe, valuesIm, vectors: v, growth: t.growth };
}

/** The imaginary part that most diagonal entries share exactly (the first of equally common ones). */
function commonImaginaryDiagonal(s: ComplexMatrix): number {
  const { n } = s;
  let best = s.im[0], bestCount = 0;
  for (let i = 0; i < n; i++) {
    const x = s.im[i * n + i];
    let count = 0;
    for (let j = 0; j < n; j++) if (s.im[j * n + j] === x) count++;
    if (count > bestCount) { best = x; bestCount = count; }
    if (2 * count > n) break;
  }
  return best;
}

/** Eigenpairs of T by QL with the rotations accumulated (Y = I on entry), each column scaled to y^T y = 1. */
function accumulatedVectors(t: ComplexSymmetricTridiagonal, valuesRe: Float64Array, valuesIm: Float64Array, y: ComplexMatrix, ws?: Workspace): void {
  const { n } = t;
  const er = scratch(ws, 'cse.er', n), ei = scratch(ws, 'cse.ei', n);
  valuesRe.set(t.diagRe); valuesIm.set(t.diagIm);
  er.set(t.offRe); ei.set(t.offIm);
  for (let i = 0; i < n; i++) y.re[i * n + i] = 1;
  complexSymmetricQl(valuesRe, valuesIm, er, ei, y);
  for (let c = 0; c < n; c++) {
    if (!normalizeColumnBilinear(y.re, y.im, n, c, 1e-10)) throw new NumericalError(`eigenvector ${c + 1} of ${n} is nearly isotropic (y^T y = 0): the matrix is close to a defective one`, 'isotropic-eigenvector');
  }
}

/** Eigenvalues of T block by block (split at negligible off-diagonals) by QL, eigenvectors by inverse iteration. */
function inverseIterationVectors(t: ComplexSymmetricTridiagonal, valuesRe: Float64Array, valuesIm: Float64Array, y: ComplexMatrix, ws?: Workspace): void {
  const { n } = t;
  const er = scratch(ws, 'cse.er', n), ei = scratch(ws, 'cse.ei', n);
  let start = 0;
  for (let k = 0; k < n; k++) {
    const last = k === n - 1;
    const split = last || cabs(t.offRe[k], t.offIm[k]) <= EPS * (cabs(t.diagRe[k], t.diagIm[k]) + cabs(t.diagRe[k + 1], t.diagIm[k + 1]));
    if (!split) continue;
    const m = k - start + 1;
    const dr = t.diagRe.subarray(start, k + 1), di = t.diagIm.subarray(start, k + 1);
    const lr = valuesRe.subarray(start, k + 1), li = valuesIm.subarray(start, k + 1);
    const wr = er.subarray(start, k + 1), wi = ei.subarray(start, k + 1);
    lr.set(dr); li.set(di);
    wr.set(t.offRe.subarray(start, k + 1)); wi.set(t.offIm.subarray(start, k + 1));
    complexSymmetricQl(lr, li, wr, wi);
    // inverse iteration reads the off-diagonal of the block (its last entry is never used)
    const b = tridiagonalEigenvectors(dr, di, t.offRe.subarray(start, k + 1), t.offIm.subarray(start, k + 1), lr, li, ws);
    for (let r = 0; r < m; r++) {
      const o = (start + r) * n + start;
      for (let c = 0; c < m; c++) { y.re[o + c] = b.re[r * m + c]; y.im[o + c] = b.im[r * m + c]; }
    }
    start = k + 1;
  }
}
