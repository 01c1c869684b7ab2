import type { ComplexEigen } from './complex-eigen.js';
import { type ComplexMatrix, complexZeros } from './complex-dense.js';
import { complexSymmetricQl } from './complex-symmetric-ql.js';
import { complexSymmetricTridiagonal } from './complex-symmetric-tridiagonal.js';
import { tridiagonalEigenvectors } from './complex-tridiagonal-inverse-iteration.js';

const EPS = Number.EPSILON;

/** Eigen-decomposition S = V diag(values) V^T of a complex symmetric matrix with V^T V = I. */
export interface ComplexSymmetricEigen extends ComplexEigen {
  /** Largest |v|^2 / |v^T v| of the tridiagonalization's reflectors (1 when they were real). */
  readonly growth: number;
}

/**
 * Eigenvalues and complex orthogonal eigenvectors of a complex symmetric matrix S (S^T = S): complex
 * orthogonal tridiagonalization, splitting at negligible off-diagonals, complex symmetric QL for the
 * eigenvalues of each block and inverse iteration for its eigenvectors, then V = Q Y. The eigenvectors are
 * scaled so that V^T V = I (so V^-1 = V^T; Horn and Johnson, Matrix Analysis, 2nd ed., sec. 4.4), and their
 * 2-norms measure the eigenvalues' condition numbers.
 * The imaginary part shared by most diagonal entries is shifted out first (S - i sigma I has the same
 * eigenvectors) and the other rows are ordered first, so that a matrix whose imaginary part sits on one
 * diagonal entry, such as H - i K / 2 with one trap and a uniform loss, is reduced in real arithmetic.
 * Throws NumericalError where a complex orthogonal step is close to isotropic; use complexEigen then.
 */
export function complexSymmetricEigen(s: ComplexMatrix): ComplexSymmetricEigen {
  const { n } = s;
  const sigma = commonImaginaryDiagonal(s);
  const order: number[] = [];
  for (let i = 0; i < n; i++) if (s.im[i * n + i] !== sigma) order.push(i);
  for (let i = 0; i < n; i++) if (s.im[i * n + i] === sigma) order.push(i);
  const p = complexZeros(n);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
    p.re[a * n + b] = s.re[order[a] * n + order[b]];
    p.im[a * n + b] = s.im[order[a] * n + order[b]] - (a === b ? sigma : 0);
  }
  const t = complexSymmetricTridiagonal(p);
  const valuesRe = new Float64Array(n), valuesIm = new Float64Array(n);
  const v = complexZeros(n);
  let start = 0;
  for (let k = 0; k < n; k++) {
    const last = k === n - 1;
    const split = last || Math.hypot(t.offRe[k], t.offIm[k]) <= EPS * (Math.hypot(t.diagRe[k], t.diagIm[k]) + Math.hypot(t.diagRe[k + 1], t.diagIm[k + 1]));
    if (!split) continue;
    const m = k - start + 1;
    const dr = t.diagRe.slice(start, k + 1), di = t.diagIm.slice(start, k + 1);
    const er = t.offRe.slice(start, k + 1), ei = t.offIm.slice(start, k + 1);
    er[m - 1] = 0; ei[m - 1] = 0;
    const lr = Float64Array.from(dr), li = Float64Array.from(di);
    const wr = Float64Array.from(er), wi = Float64Array.from(ei);
    complexSymmetricQl(lr, li, wr, wi);
    const y = tridiagonalEigenvectors(dr, di, er, ei, lr, li);
    for (let c = 0; c < m; c++) { valuesRe[start + c] = lr[c]; valuesIm[start + c] = li[c] + sigma; }
    backTransform(t.q, t.qReal, order, start, m, y, v);
    start = k + 1;
  }
  return { n, valuesRe, valuesIm, vectors: v, growth: t.growth };
}

/** The imaginary part that most diagonal entries share exactly (the first of equally common ones). */
function commonImaginaryDiagonal(s: ComplexMatrix): number {
  const { n } = s;
  const d = Float64Array.from({ length: n }, (_, i) => s.im[i * n + i]).sort();
  let best = d[0], bestCount = 0;
  for (let i = 0; i < n;) {
    let j = i;
    while (j < n && d[j] === d[i]) j++;
    if (j - i > bestCount) { best = d[i]; bestCount = j - i; }
    i = j;
  }
  return best;
}

/** Rows order[r] of V, columns start.., receive (Q Y)[r, :] for the block's Y (m x m). */
function backTransform(q: ComplexMatrix, qReal: boolean, order: number[], start: number, m: number, y: { re: Float64Array; im: Float64Array }, v: ComplexMatrix): void {
  const { n } = q;
  const { re: qr, im: qi } = q;
  for (let r = 0; r < n; r++) {
    const rr = r * n, out = order[r] * n + start;
    for (let a = 0; a < m; a++) {
      const zr = qr[rr + start + a], zi = qReal ? 0 : qi[rr + start + a];
      if (zr === 0 && zi === 0) continue;
      const ra = a * m;
      if (zi === 0) {
        for (let c = 0; c < m; c++) { v.re[out + c] += zr * y.re[ra + c]; v.im[out + c] += zr * y.im[ra + c]; }
      } else {
        for (let c = 0; c < m; c++) {
          const br = y.re[ra + c], bi = y.im[ra + c];
          v.re[out + c] += zr * br - zi * bi;
          v.im[out + c] += zr * bi + zi * br;
        }
      }
    }
  }
}
