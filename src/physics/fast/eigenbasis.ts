import type { ComplexMatrix } from '../linalg/complex-dense.js';
import { cabs } from '../linalg/complex-scalar.js';
import { frameOf, scratch, type Workspace } from '../linalg/workspace.js';

/**
 * The eigenbasis of A0 = -i H - K/2 = V Lambda0 V^-1 with V^-1 = V^T (A0 is complex symmetric), and the
 * packed tables the structured hsr solver works with. The Lyapunov part of the generator is
 * L0(X) = A X + X A^H with A = A0 - (gamma/2) I, so in the eigenbasis L0 multiplies entry ij by
 * lambda0_i + conj(lambda0_j) - gamma.
 *
 * A Hermitian N x N matrix Y in the eigenbasis is packed into N^2 reals: Y_ii at [i], then for each pair
 * i < j (row-major order of the upper triangle, pair p) Re Y_ij at [N + 2p] and Im Y_ij at [N + 2p + 1].
 * With U_k,ij = V_ki conj(V_kj):
 *   u[k] = (|V_ki|^2; 2 Re U_k,ij, -2 Im U_k,ij)  so that  u[k] . Y = [V Y V^H]_kk,
 *   q_m  = (|V_mi|^2; Re U_m,ij, Im U_m,ij)        is W E_mm W^H packed (W = V^T),
 *   G_ij = 1 / (lambda0_i + conj(lambda0_j) - gamma)   (L0^-1 in the eigenbasis),
 *   F_ij = (lambda0_i + conj(lambda0_j)) G_ij = 1 + gamma G_ij,
 *   z[m] = F o q_m,  so that  u[k] . z[m] = [I + gamma M]_km,  M_km = [L0^-1(E_mm)]_kk.
 * F is formed from lambda0 directly, not as 1 + gamma G: under strong dephasing I + gamma M is a small
 * difference of order-one numbers, and 1 + gamma G would carry an absolute error of eps in every entry.
 * (Summing the first two orders of F in 1/gamma in closed form was tried and gained nothing measurable
 * up to gamma = 1e5 ps^-1 against a 40-digit reference.)
 */
export interface Eigenbasis {
  readonly n: number;
  readonly vectors: ComplexMatrix;
  /** G packed like a Hermitian matrix (G_ji = conj(G_ij)). */
  readonly g: Float64Array;
  /** u rows, N x N^2 row-major. */
  readonly u: Float64Array;
  /** z rows, N x N^2 row-major. */
  readonly z: Float64Array;
  /** Smallest |lambda_i + conj(lambda_j)| relative to max |lambda| + gamma: how close L0 is to singular. */
  readonly gapRatio: number;
}

/** Build the packed tables from eigenvalues of A0 and V^T-orthonormal eigenvectors. O(N^3). */
export function eigenbasis(valuesRe: Float64Array, valuesIm: Float64Array, vectors: ComplexMatrix, gamma: number, ws?: Workspace): Eigenbasis {
  const { n, re: vr, im: vi } = vectors;
  const len = n * n;
  // every entry of g, f, u and z is written below: no zeroing
  const tab = frameOf(ws, 'eb', n, eigenbasisArrays);
  const { g, f } = tab;
  let minGap = Infinity, maxLam = 0;
  for (let i = 0; i < n; i++) {
    maxLam = Math.max(maxLam, cabs(valuesRe[i], valuesIm[i]));
    const s = 2 * valuesRe[i];
    const d = s - gamma;
    minGap = Math.min(minGap, Math.abs(d));
    g[i] = 1 / d;
    f[i] = s / d;
  }
  let p = n;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++, p += 2) {
      // s = lambda0_i + conj(lambda0_j), G = 1 / (s - gamma), F = s G
      const sr = valuesRe[i] + valuesRe[j], si = valuesIm[i] - valuesIm[j];
      const ar = sr - gamma;
      const d = ar * ar + si * si;
      minGap = Math.min(minGap, Math.sqrt(d));
      const gr = ar / d, gi = -si / d;
      g[p] = gr; g[p + 1] = gi;
      f[p] = sr * gr - si * gi; f[p + 1] = sr * gi + si * gr;
    }
  }
  const { u, z } = tab;
  for (let k = 0; k < n; k++) {
    const rk = k * n, o = k * len;
    for (let i = 0; i < n; i++) {
      const a = vr[rk + i] * vr[rk + i] + vi[rk + i] * vi[rk + i];
      u[o + i] = a;
      z[o + i] = a * f[i];
    }
    let q = o + n, t = n;
    for (let i = 0; i < n; i++) {
      const ar = vr[rk + i], ai = vi[rk + i];
      for (let j = i + 1; j < n; j++, q += 2, t += 2) {
        // U = V_ki conj(V_kj)
        const br = vr[rk + j], bi = vi[rk + j];
        const ur = ar * br + ai * bi, ui = ai * br - ar * bi;
        u[q] = 2 * ur;
        u[q + 1] = -2 * ui;
        const fr = f[t], fi = f[t + 1];
        z[q] = fr * ur - fi * ui;
        z[q + 1] = fr * ui + fi * ur;
      }
    }
  }
  return { n, vectors, g, u, z, gapRatio: minGap / (maxLam + gamma) };
}

/** The tables of an eigenbasis of n sites (kept in the workspace between calls of the same size when there is one). */
function eigenbasisArrays(n: number) {
  const len = n * n;
  return { n, g: new Float64Array(len), f: new Float64Array(len), u: new Float64Array(n * len), z: new Float64Array(n * len) };
}

/** [V Y V^H]_kk for every k: u Y (N^3), four rows of u per pass over Y (then two, then one). */
export function siteDiagonal(e: Eigenbasis, y: Float64Array, out: Float64Array): Float64Array {
  const { n, u } = e;
  const len = n * n;
  let k = 0;
  for (; k + 3 < n; k += 4) {
    const o0 = k * len, o1 = o0 + len, o2 = o1 + len, o3 = o2 + len;
    let s0 = 0, s1 = 0, s2 = 0, s3 = 0;
    for (let i = 0; i < len; i++) { const b = y[i]; s0 += u[o0 + i] * b; s1 += u[o1 + i] * b; s2 += u[o2 + i] * b; s3 += u[o3 + i] * b; }
    out[k] = s0; out[k + 1] = s1; out[k + 2] = s2; out[k + 3] = s3;
  }
  if (k + 1 < n) {
    const o0 = k * len, o1 = o0 + len;
    let s0 = 0, s1 = 0;
    for (let i = 0; i < len; i++) { const b = y[i]; s0 += u[o0 + i] * b; s1 += u[o1 + i] * b; }
    out[k] = s0; out[k + 1] = s1;
    k += 2;
  }
  if (k < n) {
    const o0 = k * len;
    let s0 = 0;
    for (let i = 0; i < len; i++) s0 += u[o0 + i] * y[i];
    out[k] = s0;
  }
  return out;
}

/** siteDiagonal of two packed matrices in one pass over u, two rows of u at a time. */
export function siteDiagonalPair(e: Eigenbasis, y1: Float64Array, y2: Float64Array, out1: Float64Array, out2: Float64Array): void {
  const { n, u } = e;
  const len = n * n;
  let k = 0;
  for (; k + 1 < n; k += 2) {
    const o = k * len, p = o + len;
    let a1 = 0, a2 = 0, b1 = 0, b2 = 0;
    for (let i = 0; i < len; i++) {
      const x1 = y1[i], x2 = y2[i], ua = u[o + i], ub = u[p + i];
      a1 += ua * x1; a2 += ua * x2; b1 += ub * x1; b2 += ub * x2;
    }
    out1[k] = a1; out2[k] = a2; out1[k + 1] = b1; out2[k + 1] = b2;
  }
  if (k < n) {
    const o = k * len;
    let s1 = 0, s2 = 0;
    for (let i = 0; i < len; i++) { const a = u[o + i]; s1 += a * y1[i]; s2 += a * y2[i]; }
    out1[k] = s1; out2[k] = s2;
  }
}

let rowList = new Int32Array(0);

/** Packed W diag(w) W^H = sum_m w_m q_m (N^3), four rows of u per pass over the output. */
export function diagonalInEigenbasis(e: Eigenbasis, w: ArrayLike<number>, out: Float64Array): Float64Array {
  const { n, u } = e;
  const len = n * n;
  // a plain loop: the fill builtin's call costs more than 49 stores
  for (let i = 0; i < len; i++) out[i] = 0;
  // the rows with a non-zero weight (a start on one site has one), in a scratch list
  if (rowList.length < n) rowList = new Int32Array(2 * n);
  const rows = rowList;
  let count = 0;
  for (let m = 0; m < n; m++) if (w[m] !== 0) rows[count++] = m;
  let t = 0;
  for (; t + 3 < count; t += 4) {
    const m0 = rows[t], m1 = rows[t + 1], m2 = rows[t + 2], m3 = rows[t + 3];
    const c0 = w[m0], c1 = w[m1], c2 = w[m2], c3 = w[m3];
    const o0 = m0 * len, o1 = m1 * len, o2 = m2 * len, o3 = m3 * len;
    for (let i = 0; i < len; i++) out[i] += c0 * u[o0 + i] + c1 * u[o1 + i] + c2 * u[o2 + i] + c3 * u[o3 + i];
  }
  for (; t < count; t++) {
    const c = w[rows[t]], o = rows[t] * len;
    for (let i = 0; i < len; i++) out[i] += c * u[o + i];
  }
  // u carries (1; 2, -2) times q
  for (let i = n; i < len; i += 2) { out[i] *= 0.5; out[i + 1] *= -0.5; }
  return out;
}

/** y <- G o y on packed Hermitian matrices. */
export function multiplyByG(e: Eigenbasis, y: Float64Array): Float64Array {
  const { n, g } = e;
  const len = n * n;
  for (let i = 0; i < n; i++) y[i] *= g[i];
  for (let p = n; p < len; p += 2) {
    const yr = y[p], yi = y[p + 1], gr = g[p], gi = g[p + 1];
    y[p] = gr * yr - gi * yi;
    y[p + 1] = gr * yi + gi * yr;
  }
  return y;
}

/** Packed W B W^H = V^T B conj(V) for a real symmetric B (row-major N x N), into `out` (N^2). */
export function symmetricInEigenbasis(e: Eigenbasis, b: Float64Array, out: Float64Array, ws?: Workspace): Float64Array {
  const { n } = e;
  let diagonal = true;
  for (let i = 0; i < n && diagonal; i++) for (let j = 0; j < n; j++) if (i !== j && b[i * n + j] !== 0) { diagonal = false; break; }
  if (diagonal) {
    const w = scratch(ws, 'eb.w', n);
    for (let i = 0; i < n; i++) w[i] = b[i * n + i];
    return diagonalInEigenbasis(e, w, out);
  }
  const { re: vr, im: vi } = e.vectors;
  // T = V^T B: T_ik = sum_m V_mi B_mk
  const tr = scratch(ws, 'eb.tr', n * n), ti = scratch(ws, 'eb.ti', n * n);
  for (let m = 0; m < n; m++) {
    for (let i = 0; i < n; i++) {
      const ar = vr[m * n + i], ai = vi[m * n + i];
      const ri = i * n, rm = m * n;
      for (let k = 0; k < n; k++) { const bb = b[rm + k]; tr[ri + k] += ar * bb; ti[ri + k] += ai * bb; }
    }
  }
  // Y_ij = sum_k T_ik conj(V_kj) for i <= j
  let p = n;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    for (let j = i; j < n; j++) {
      let sr = 0, si = 0;
      for (let k = 0; k < n; k++) {
        const ar = tr[ri + k], ai = ti[ri + k], br = vr[k * n + j], bi = -vi[k * n + j];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      if (j === i) out[i] = sr;
      else { out[p] = sr; out[p + 1] = si; p += 2; }
    }
  }
  return out;
}
