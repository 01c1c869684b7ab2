import { fresh, type Workspace } from '../linalg/workspace.js';
import type { Eigenbasis } from './eigenbasis.js';

/**
 * The population system matrix I + gamma M, M_km = [L0^-1(E_mm)]_kk, as u[k] . z[m] (eigenbasis.ts): a real
 * symmetric N x N matrix (symmetric because V^-1 = V^T). This N x N^2 by N^2 x N product is the O(N^4) step
 * of the structured solver: only the lower triangle is computed, in 4 x 2 register blocks (eight dot products
 * share six loads per step; 2 x 2 and 1 x 2 for the last rows), then mirrored. Returns the matrix row-major.
 */
export function populationCoupling(e: Eigenbasis, ws?: Workspace): Float64Array {
  const { n, u, z } = e;
  const len = n * n;
  const M = fresh(ws, 'pc.m', n * n); // every entry is written below
  // rows k..k+3 of u against rows m, m+1 of z, for m + 1 <= k + 3 (blocks reaching the lower triangle)
  let k = 0;
  for (; k + 3 < n; k += 4) {
    const a0 = k * len, a1 = a0 + len, a2 = a1 + len, a3 = a2 + len;
    for (let m = 0; m <= k + 2; m += 2) {
      const b0 = m * len, b1 = b0 + len;
      let s00 = 0, s01 = 0, s10 = 0, s11 = 0, s20 = 0, s21 = 0, s30 = 0, s31 = 0;
      for (let i = 0; i < len; i++) {
        const y0 = z[b0 + i], y1 = z[b1 + i];
        const x0 = u[a0 + i], x1 = u[a1 + i], x2 = u[a2 + i], x3 = u[a3 + i];
        s00 += x0 * y0; s01 += x0 * y1; s10 += x1 * y0; s11 += x1 * y1;
        s20 += x2 * y0; s21 += x2 * y1; s30 += x3 * y0; s31 += x3 * y1;
      }
      const r0 = k * n + m, r1 = r0 + n, r2 = r1 + n, r3 = r2 + n;
      M[r0] = s00; M[r0 + 1] = s01; M[r1] = s10; M[r1 + 1] = s11;
      M[r2] = s20; M[r2 + 1] = s21; M[r3] = s30; M[r3 + 1] = s31;
    }
  }
  // the last rows (at most three): two rows against two columns, then one row against two
  for (; k + 1 < n; k += 2) {
    const a0 = k * len, a1 = a0 + len;
    for (let m = 0; m <= k + 1; m += 2) {
      const b0 = m * len, b1 = b0 + len;
      let s00 = 0, s01 = 0, s10 = 0, s11 = 0;
      for (let i = 0; i < len; i++) {
        const y0 = z[b0 + i], y1 = z[b1 + i], x0 = u[a0 + i], x1 = u[a1 + i];
        s00 += x0 * y0; s01 += x0 * y1; s10 += x1 * y0; s11 += x1 * y1;
      }
      const r0 = k * n + m, r1 = r0 + n;
      M[r0] = s00; M[r0 + 1] = s01; M[r1] = s10; M[r1 + 1] = s11;
    }
  }
  if (k < n) {
    const a0 = k * len;
    let m = 0;
    for (; m + 1 <= k; m += 2) {
      const b0 = m * len, b1 = b0 + len;
      let s0 = 0, s1 = 0;
      for (let i = 0; i < len; i++) { const x = u[a0 + i]; s0 += x * z[b0 + i]; s1 += x * z[b1 + i]; }
      M[k * n + m] = s0; M[k * n + m + 1] = s1;
    }
    if (m === k) {
      const b0 = m * len;
      let s0 = 0;
      for (let i = 0; i < len; i++) s0 += u[a0 + i] * z[b0 + i];
      M[k * n + m] = s0;
    }
  }
  for (let r = 0; r < n; r++) for (let c = r + 1; c < n; c++) M[r * n + c] = M[c * n + r];
  return M;
}
