import type { Layout } from './layout.js';

/**
 * A superoperator term, applied to one entry X_cd = re + i im of an input matrix, adding its image into the
 * complex scratch matrix (outRe, outIm), both row-major N x N.
 */
export type Term = (c: number, d: number, re: number, im: number, outRe: Float64Array, outIm: Float64Array) => void;

/**
 * Assemble the real dim x dim matrix (row-major) of the sum of terms in the layout's basis, column by column:
 * each basis element has at most two entries, each term touches O(N) outputs, so the cost is O(N^4).
 */
export function assemble(L: Layout, terms: readonly Term[]): Float64Array {
  const { n, pairs, dim, pairRow, pairCol } = L;
  const M = new Float64Array(dim * dim);
  const outRe = new Float64Array(n * n);
  const outIm = new Float64Array(n * n);
  const apply = (c: number, d: number, re: number, im: number) => {
    for (const t of terms) t(c, d, re, im, outRe, outIm);
  };
  for (let col = 0; col < dim; col++) {
    outRe.fill(0);
    outIm.fill(0);
    if (col < n) {
      apply(col, col, 1, 0);
    } else if (col < n + pairs) {
      const k = col - n, c = pairRow[k], d = pairCol[k];
      apply(c, d, 1, 0);
      apply(d, c, 1, 0);
    } else {
      const k = col - n - pairs, c = pairRow[k], d = pairCol[k];
      apply(c, d, 0, 1);
      apply(d, c, 0, -1);
    }
    for (let m = 0; m < n; m++) M[m * dim + col] = outRe[m * n + m];
    for (let k = 0; k < pairs; k++) {
      const idx = pairRow[k] * n + pairCol[k];
      M[(n + k) * dim + col] = outRe[idx];
      M[(n + pairs + k) * dim + col] = outIm[idx];
    }
  }
  return M;
}

/** -i [H, X] for a real symmetric H (row-major, in rad/ps). */
export function commutatorTerm(n: number, H: Float64Array): Term {
  return (c, d, re, im, outRe, outIm) => {
    // -i (H X)_id = -i H_ic X_cd ; +i (X H)_cj = +i X_cd H_dj
    for (let i = 0; i < n; i++) {
      const h = H[i * n + c];
      if (h === 0) continue;
      outRe[i * n + d] += h * im;
      outIm[i * n + d] -= h * re;
    }
    for (let j = 0; j < n; j++) {
      const h = H[d * n + j];
      if (h === 0) continue;
      outRe[c * n + j] -= h * im;
      outIm[c * n + j] += h * re;
    }
  };
}

/** -1/2 {K, X} for a real symmetric K (row-major, ps^-1). */
export function anticommutatorTerm(n: number, K: Float64Array): Term {
  return (c, d, re, im, outRe, outIm) => {
    for (let i = 0; i < n; i++) {
      const k = 0.5 * K[i * n + c];
      if (k === 0) continue;
      outRe[i * n + d] -= k * re;
      outIm[i * n + d] -= k * im;
    }
    for (let j = 0; j < n; j++) {
      const k = 0.5 * K[d * n + j];
      if (k === 0) continue;
      outRe[c * n + j] -= k * re;
      outIm[c * n + j] -= k * im;
    }
  };
}

/** -1/2 {diag(k), X}: element (c, d) decays at (k_c + k_d) / 2. */
export function diagonalDecayTerm(n: number, k: Float64Array): Term {
  return (c, d, re, im, outRe, outIm) => {
    const g = 0.5 * (k[c] + k[d]);
    outRe[c * n + d] -= g * re;
    outIm[c * n + d] -= g * im;
  };
}

/** Pure dephasing in the basis of the matrix: off-diagonal elements decay at gamma (Haken-Strobl-Reineker). */
export function pureDephasingTerm(n: number, gamma: number): Term {
  return (c, d, re, im, outRe, outIm) => {
    if (c === d) return;
    outRe[c * n + d] -= gamma * re;
    outIm[c * n + d] -= gamma * im;
  };
}
