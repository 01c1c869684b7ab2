import { LumenfoldError } from '../../errors.js';
import { type ComplexMatrix, normalizeColumnBilinear } from '../linalg/complex-dense.js';
import { complexEigen } from '../linalg/complex-eigen.js';
import { complexSymmetricEigen } from '../linalg/complex-symmetric-eigen.js';
import { rankOneSymmetricEigen } from '../linalg/rank-one-eigen.js';
import { cabs } from '../linalg/complex-scalar.js';
import { scratch, type Workspace } from '../linalg/workspace.js';

export interface HsrEigen {
  readonly valuesRe: Float64Array;
  readonly valuesIm: Float64Array;
  /** Eigenvectors with V^T V = I. */
  readonly vectors: ComplexMatrix;
  /** ||V||_1 ||V^T||_1 = cond_1(V). */
  readonly condition: number;
  readonly solver: 'rank-one' | 'complex-symmetric' | 'unitary-qr';
}

/** Eigenvalues closer than this fraction of the spectral radius are orthogonalized against each other. */
const DEGENERATE = 1e-6;

/**
 * Eigenvectors of the complex symmetric S = H - i K'/2, normalized so that V^T V = I: where K' is the same on
 * all sites but one (one trap, a loss common to all), by the rank-one update of H's real eigenbasis
 * (rank-one-eigen.ts); otherwise, or when that fails, by the complex symmetric solver (complex orthogonal
 * transformations, about 10 N^3), and when that breaks down or gives a basis worse conditioned than
 * `maxCondition`, by the unitary QR solver (Hessenberg + shifted QR, about
 * 60 N^3) followed by normalization in the bilinear form and, inside groups of (nearly) equal eigenvalues,
 * Gram-Schmidt in that form. Returns a failure reason when neither gives a usable basis. The complex
 * symmetric path works in `ws` when given (its arrays are then the workspace's).
 */
export function hsrEigenvectors(s: ComplexMatrix, maxCondition: number, ws?: Workspace): HsrEigen | { failure: string } {
  const reasons: string[] = [];
  const one = rankOneShape(s);
  if (one) {
    try {
      const e = rankOneSymmetricEigen(s.re, s.n, one.site, 0, one.rhoIm, ws);
      for (let i = 0; i < s.n; i++) e.valuesIm[i] += one.sigma;
      const condition = conditionOf(e.vectors, ws);
      if (condition <= maxCondition) return { valuesRe: e.valuesRe, valuesIm: e.valuesIm, vectors: e.vectors, condition, solver: 'rank-one' };
      reasons.push(`rank-one eigenvectors ill-conditioned (cond ${condition.toExponential(1)})`);
    } catch (err) {
      if (!(err instanceof LumenfoldError)) throw err;
      reasons.push(`rank-one eigen-solver: ${err.message}`);
    }
  }
  try {
    const e = complexSymmetricEigen(s, ws);
    const condition = conditionOf(e.vectors, ws);
    if (condition <= maxCondition) return { valuesRe: e.valuesRe, valuesIm: e.valuesIm, vectors: e.vectors, condition, solver: 'complex-symmetric' };
    reasons.push(`complex symmetric eigenvectors ill-conditioned (cond ${condition.toExponential(1)})`);
  } catch (err) {
    if (!(err instanceof LumenfoldError)) throw err;
    reasons.push(`complex symmetric eigen-solver: ${err.message}`);
  }
  try {
    const e = complexEigen(s);
    const failure = bilinearOrthonormalize(e.vectors, e.valuesRe, e.valuesIm);
    if (failure) {
      reasons.push(`unitary QR eigenvectors: ${failure}`);
    } else {
      const condition = conditionOf(e.vectors, ws);
      if (condition <= maxCondition) return { valuesRe: e.valuesRe, valuesIm: e.valuesIm, vectors: e.vectors, condition, solver: 'unitary-qr' };
      reasons.push(`unitary QR eigenvectors ill-conditioned (cond ${condition.toExponential(1)}): the exciton Hamiltonian with its trap and loss is close to an exceptional point`);
    }
  } catch (err) {
    if (!(err instanceof LumenfoldError)) throw err;
    reasons.push(`unitary QR eigen-solver: ${err.message}`);
  }
  return { failure: reasons.join('; ') };
}

/**
 * S = Re S + i sigma I + i rhoIm e_t e_t^T: a real part and an imaginary part on the diagonal only, shared by
 * every site but one (or by all: rhoIm = 0). Undefined for any other shape.
 */
function rankOneShape(s: ComplexMatrix): { site: number; sigma: number; rhoIm: number } | undefined {
  const { n, im } = s;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j && im[i * n + j] !== 0) return undefined;
  if (n < 2) return undefined;
  // the common value is the one of site 0 unless sites 0 and 1 differ and site 2 (if any) sides with site 1
  const a = im[0], b = im[n + 1];
  const sigma = a === b || n === 2 || im[2 * n + 2] === a ? a : b;
  let site = -1;
  for (let i = 0; i < n; i++) {
    if (im[i * n + i] === sigma) continue;
    if (site >= 0) return undefined;
    site = i;
  }
  return site < 0 ? { site: 0, sigma, rhoIm: 0 } : { site, sigma, rhoIm: im[site * n + site] - sigma };
}

/** ||V||_1 ||V||_inf, which is cond_1(V) when V^-1 = V^T. */
function conditionOf(v: ComplexMatrix, ws?: Workspace): number {
  const { n, re, im } = v;
  const col = scratch(ws, 'cond.col', n);
  let rowMax = 0;
  for (let i = 0; i < n; i++) {
    let row = 0;
    for (let j = 0; j < n; j++) {
      const a = cabs(re[i * n + j], im[i * n + j]);
      row += a;
      col[j] += a;
    }
    rowMax = Math.max(rowMax, row);
  }
  let colMax = 0;
  for (let j = 0; j < n; j++) colMax = Math.max(colMax, col[j]);
  const c = rowMax * colMax;
  return Number.isFinite(c) ? c : Infinity;
}

/** Scale columns to v^T v = 1, orthogonalizing in the bilinear form within groups of close eigenvalues. */
function bilinearOrthonormalize(v: ComplexMatrix, lr: Float64Array, li: Float64Array): string | undefined {
  const { n, re, im } = v;
  let radius = 0;
  for (let i = 0; i < n; i++) radius = Math.max(radius, cabs(lr[i], li[i]));
  for (let c = 0; c < n; c++) {
    for (let p = 0; p < c; p++) {
      if (cabs(lr[p] - lr[c], li[p] - li[c]) > DEGENERATE * radius) continue;
      // v_c -= (v_p^T v_c) v_p with v_p^T v_p = 1
      let sr = 0, si = 0;
      for (let i = 0; i < n; i++) {
        const ar = re[i * n + p], ai = im[i * n + p], br = re[i * n + c], bi = im[i * n + c];
        sr += ar * br - ai * bi; si += ar * bi + ai * br;
      }
      for (let i = 0; i < n; i++) {
        const ar = re[i * n + p], ai = im[i * n + p];
        re[i * n + c] -= sr * ar - si * ai; im[i * n + c] -= sr * ai + si * ar;
      }
    }
    if (!normalizeColumnBilinear(re, im, n, c, 1e-12)) return `eigenvector ${c + 1} is isotropic (v^T v = 0): the matrix is defective or nearly so`;
  }
  return undefined;
}
