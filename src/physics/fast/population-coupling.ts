import type { Eigenbasis } from './eigenbasis.js';

/**
 * The population system matrix I + gamma M, M_km = [L0^-1(E_mm)]_kk, as u[k] . z[m] (eigenbasis.ts): a real
 * symmetric N x N matrix (symmetric because V^-1 = V^T). This N x N^2 by N^2 x N product is the O(N^4) step
 * of the structured solver; only the lower triangle is computed, in 2 x 2 register blocks (four dot products
 * share their loads). Returns the matrix row-major.
 */
export function populationCoupling(e: Eigenbasis): Float64Array {
  const { n, u, z } = e;
  const len = n * n;
  const M = new Float64Array(n * n);
  let k = 0;
  for (; k + 1 < n; k += 2) {
    const a0 = k * len, a1 = a0 + len;
    let m = 0;
    for (; m + 1 <= k; m += 2) {
      // rows k, k+1 of u against rows m, m+1 of z (m + 1 <= k keeps the block in the lower triangle)
      const b0 = m * len, b1 = b0 + len;
      let s00 = 0, s01 = 0, s10 = 0, s11 = 0;
      for (let i = 0; i < len; i++) {
        const x0 = u[a0 + i], x1 = u[a1 + i], y0 = z[b0 + i], y1 = z[b1 + i];
        s00 += x0 * y0; s01 += x0 * y1; s10 += x1 * y0; s11 += x1 * y1;
      }
      M[k * n + m] = s00; M[k * n + m + 1] = s01; M[(k + 1) * n + m] = s10; M[(k + 1) * n + m + 1] = s11;
    }
    // the diagonal block (m = k) when k is even: entries (k, k), (k+1, k), (k+1, k+1)
    if (m === k) {
      const b0 = a0, b1 = a1;
      let s00 = 0, s10 = 0, s11 = 0;
      for (let i = 0; i < len; i++) {
        const x0 = u[a0 + i], x1 = u[a1 + i], y0 = z[b0 + i], y1 = z[b1 + i];
        s00 += x0 * y0; s10 += x1 * y0; s11 += x1 * y1;
      }
      M[k * n + k] = s00; M[(k + 1) * n + k] = s10; M[(k + 1) * n + k + 1] = s11;
    }
  }
  if (k < n) {
    // last odd row
    const a0 = k * len;
    for (let m = 0; m <= k; m++) {
      const b0 = m * len;
      let s = 0;
      for (let i = 0; i < len; i++) s += u[a0 + i] * z[b0 + i];
      M[k * n + m] = s;
    }
  }
  for (let r = 0; r < n; r++) for (let c = r + 1; c < n; c++) M[r * n + c] = M[c * n + r];
  return M;
}
