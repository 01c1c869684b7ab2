import { frameOf, type Workspace } from '../linalg/workspace.js';
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

/**
 * A fixed probe vector z with what every check against it shares: a = V^H z (so that X z = V (Y a) for
 * X = V Y V^H), w = A^H z = i H z - K' z / 2 and |w|, and |z_k|^2.
 */
export interface Probe {
  readonly zr: Float64Array;
  readonly zi: Float64Array;
  readonly ar: Float64Array;
  readonly ai: Float64Array;
  readonly wr: Float64Array;
  readonly wi: Float64Array;
  readonly z2: Float64Array;
  readonly wNorm: number;
  /** gamma_phi of the operator. */
  readonly gamma: number;
}

/** X z for a solution X = V Y V^H, and z^H X z (real for Hermitian X). */
export interface ProbeImage {
  readonly xr: Float64Array;
  readonly xi: Float64Array;
  readonly quadratic: number;
}

/**
 * Probe number `index` for an eigenbasis and operator, in O(N^2): z from an LCG with a fixed seed (runs are
 * reproducible). With a workspace, the next call reuses its arrays, and z itself is drawn once per size and index.
 */
export function makeProbe(e: Eigenbasis, op: ProbeOperator, index: number, ws?: Workspace): Probe {
  const { n, h, decay } = op;
  const { re: vr, im: vi } = e.vectors;
  const f = frameOf(ws, 'probe', n, probeArrays);
  const { zr, zi, z2 } = f;
  // z is drawn once per size and index (f.drawn is the index + 1 it holds, 0 before the first draw)
  if (f.drawn !== index + 1) {
    let s = (0x2545f491 + 977 * index) >>> 0;
    for (let k = 0; k < n; k++) {
      s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
      zr[k] = s / 4294967296 - 0.5;
      s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
      zi[k] = s / 4294967296 - 0.5;
      z2[k] = zr[k] * zr[k] + zi[k] * zi[k];
    }
    f.drawn = index + 1;
  }
  // a = V^H z: a_i = sum_k conj(V_ki) z_k
  const { ar, ai } = f;
  for (let i = 0; i < n; i++) {
    let sr = 0, si = 0;
    for (let k = 0, rk = i; k < n; k++, rk += n) {
      const pr = vr[rk], pi = vi[rk], cr = zr[k], ci = zi[k];
      sr += pr * cr + pi * ci;
      si += pr * ci - pi * cr;
    }
    ar[i] = sr; ai[i] = si;
  }
  // w = A^H z: (A^H z)_k = i (H z)_k - K'_k / 2 z_k
  const { wr, wi } = f;
  let w2 = 0;
  for (let k = 0; k < n; k++) {
    let hr = 0, hi = 0;
    const rk = k * n;
    for (let j = 0; j < n; j++) { const c = h[rk + j]; hr += c * zr[j]; hi += c * zi[j]; }
    wr[k] = -hi - 0.5 * decay[k] * zr[k];
    wi[k] = hr - 0.5 * decay[k] * zi[k];
    w2 += wr[k] * wr[k] + wi[k] * wi[k];
  }
  return { zr, zi, ar, ai, wr, wi, z2, wNorm: Math.sqrt(w2), gamma: op.gamma };
}

/** A probe's arrays for n sites, and the image arrays of probeImage (kept in the workspace when there is one). */
function probeArrays(n: number) {
  const v = (): Float64Array => new Float64Array(n);
  return { n, drawn: 0, zr: v(), zi: v(), z2: v(), ar: v(), ai: v(), wr: v(), wi: v(), br: v(), bi: v(), xr: v(), xi: v() };
}

/** X z for X = V Y V^H with Y packed (eigenbasis.ts), in O(N^2). With a workspace, the next call reuses its arrays. */
export function probeImage(e: Eigenbasis, probe: Probe, y: Float64Array, ws?: Workspace): ProbeImage {
  const { n } = e;
  const { re: vr, im: vi } = e.vectors;
  const { ar, ai, zr, zi } = probe;
  // b = Y a, Y Hermitian packed
  const f = frameOf(ws, 'probe', n, probeArrays);
  const { br, bi } = f;
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
  const { xr, xi } = f;
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
  return { xr, xi, quadratic };
}

/**
 * Relative residual of L(X) = B seen by one probe: |z^H (L(X) - B) z| divided by the sum of the sizes of
 * the terms, where z^H L(X) z = 2 Re((A^H z)^H X z) + gamma sum_k |z_k|^2 X_kk. O(N).
 * For Hermitian R = L(X) - B and a random z, E|z^H R z|^2 = |tr R|^2 + ||R||_F^2, so a few probes estimate
 * the residual's size in O(N^2) each (randomized verification in the manner of Freivalds, 1977; Hutchinson,
 * Commun. Stat. Simul. Comput. 18, 1059 (1989), for trace estimation by quadratic forms).
 * `rhs` is z^H B z, `diagonal` the site populations X_kk.
 */
export function probeResidual(probe: Probe, img: ProbeImage, diagonal: Float64Array, rhs: number): number {
  const { wr, wi, z2, gamma } = probe;
  const { xr, xi } = img;
  const n = wr.length;
  let cross = 0, xz2 = 0, deph = 0, dephSize = 0;
  for (let k = 0; k < n; k++) {
    // Re(conj(w) x)
    cross += wr[k] * xr[k] + wi[k] * xi[k];
    xz2 += xr[k] * xr[k] + xi[k] * xi[k];
    deph += z2[k] * diagonal[k];
    dephSize += z2[k] * Math.abs(diagonal[k]);
  }
  const lhs = 2 * cross + gamma * deph;
  const scale = 2 * probe.wNorm * Math.sqrt(xz2) + gamma * dephSize + Math.abs(rhs);
  return scale > 0 ? Math.abs(lhs - rhs) / scale : 0;
}
