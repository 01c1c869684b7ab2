import { scratch, type Workspace } from '../linalg/workspace.js';
import type { Eigenbasis } from './eigenbasis.js';

/** What a probe needs of the generator L(X) = A X + X A^H + gamma diag(X), A = -i H - K'/2. */
export interface ProbeOperator {
  readonly n: number;
  /** H in rad/ps (row-major, real symmetric; a multiple of I may be taken out: it cancels in L). */
  readonly h: Float64Array;
  /** K' = K + gamma per site, ps^-1. */
  readonly decay: Float64Array;
  readonly gamma: number;
}

/** A probe vector z and X z for a solution X = V Y V^H. */
export interface ProbeImage {
  readonly zr: Float64Array;
  readonly zi: Float64Array;
  /** X z */
  readonly xr: Float64Array;
  readonly xi: Float64Array;
  /** z^H X z (real for Hermitian X). */
  readonly quadratic: number;
}

/** Fixed pseudo-random complex probe vectors (an LCG with a fixed seed: runs are reproducible). */
export function probeVector(n: number, index: number, ws?: Workspace): { zr: Float64Array; zi: Float64Array } {
  const zr = scratch(ws, 'probe.zr', n), zi = scratch(ws, 'probe.zi', n);
  let s = (0x2545f491 + 977 * index) >>> 0;
  const next = () => { s = (Math.imul(s, 1664525) + 1013904223) >>> 0; return s / 4294967296 - 0.5; };
  for (let k = 0; k < n; k++) { zr[k] = next(); zi[k] = next(); }
  return { zr, zi };
}

/** X z for X = V Y V^H with Y packed (eigenbasis.ts), in O(N^2). With a workspace, the next call reuses its arrays. */
export function probeImage(e: Eigenbasis, y: Float64Array, z: { zr: Float64Array; zi: Float64Array }, ws?: Workspace): ProbeImage {
  const { n } = e;
  const { re: vr, im: vi } = e.vectors;
  const { zr, zi } = z;
  // a = V^H z
  const ar = scratch(ws, 'probe.ar', n), ai = scratch(ws, 'probe.ai', n);
  for (let k = 0; k < n; k++) {
    const rk = k * n, cr = zr[k], ci = zi[k];
    for (let i = 0; i < n; i++) {
      const pr = vr[rk + i], pi = -vi[rk + i];
      ar[i] += pr * cr - pi * ci;
      ai[i] += pr * ci + pi * cr;
    }
  }
  // b = Y a, Y Hermitian packed
  const br = scratch(ws, 'probe.br', n), bi = scratch(ws, 'probe.bi', n);
  for (let i = 0; i < n; i++) { br[i] = y[i] * ar[i]; bi[i] = y[i] * ai[i]; }
  let p = n;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++, p += 2) {
      const yr = y[p], yi = y[p + 1];
      // b_i += Y_ij a_j ; b_j += conj(Y_ij) a_i
      br[i] += yr * ar[j] - yi * ai[j];
      bi[i] += yr * ai[j] + yi * ar[j];
      br[j] += yr * ar[i] + yi * ai[i];
      bi[j] += yr * ai[i] - yi * ar[i];
    }
  }
  // X z = V b
  const xr = scratch(ws, 'probe.xr', n), xi = scratch(ws, 'probe.xi', n);
  let quadratic = 0;
  for (let k = 0; k < n; k++) {
    const rk = k * n;
    let sr = 0, si = 0;
    for (let i = 0; i < n; i++) {
      const pr = vr[rk + i], pi = vi[rk + i];
      sr += pr * br[i] - pi * bi[i];
      si += pr * bi[i] + pi * br[i];
    }
    xr[k] = sr; xi[k] = si;
    quadratic += zr[k] * sr + zi[k] * si;
  }
  return { zr, zi, xr, xi, quadratic };
}

/**
 * Relative residual of L(X) = B seen by one probe: |z^H (L(X) - B) z| divided by the sum of the sizes of
 * the terms, where z^H L(X) z = 2 Re((A^H z)^H X z) + gamma sum_k |z_k|^2 X_kk, A^H = i H - K'/2.
 * For Hermitian R = L(X) - B and a random z, E|z^H R z|^2 = |tr R|^2 + ||R||_F^2, so a few probes estimate
 * the residual's size in O(N^2) each (randomized verification in the manner of Freivalds, 1977; Hutchinson,
 * Commun. Stat. Simul. Comput. 18, 1059 (1989), for trace estimation by quadratic forms).
 * `rhs` is z^H B z, `diagonal` the site populations X_kk.
 */
export function probeResidual(op: ProbeOperator, img: ProbeImage, diagonal: Float64Array, rhs: number): number {
  const { n, h, decay, gamma } = op;
  const { zr, zi, xr, xi } = img;
  let cross = 0, az2 = 0, xz2 = 0, deph = 0, dephSize = 0;
  for (let k = 0; k < n; k++) {
    // (A^H z)_k = i (H z)_k - K'_k / 2 z_k
    let hr = 0, hi = 0;
    const rk = k * n;
    for (let j = 0; j < n; j++) { const c = h[rk + j]; hr += c * zr[j]; hi += c * zi[j]; }
    const wr = -hi - 0.5 * decay[k] * zr[k], wi = hr - 0.5 * decay[k] * zi[k];
    // Re(conj(w) x)
    cross += wr * xr[k] + wi * xi[k];
    az2 += wr * wr + wi * wi;
    xz2 += xr[k] * xr[k] + xi[k] * xi[k];
    const z2 = zr[k] * zr[k] + zi[k] * zi[k];
    deph += z2 * diagonal[k];
    dephSize += z2 * Math.abs(diagonal[k]);
  }
  const lhs = 2 * cross + gamma * deph;
  const scale = 2 * Math.sqrt(az2 * xz2) + gamma * dephSize + Math.abs(rhs);
  return scale > 0 ? Math.abs(lhs - rhs) / scale : 0;
}
