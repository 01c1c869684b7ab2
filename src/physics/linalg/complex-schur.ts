import { NumericalError } from '../../errors.js';
import type { ComplexMatrix } from './complex-dense.js';
import { cdiv, csqrt } from './complex-scalar.js';

const ULP = Number.EPSILON;
const SAFE_MIN = 2.2250738585072014e-308;

const cabs1 = (r: number, i: number) => Math.abs(r) + Math.abs(i);

/**
 * Complex Schur form of an upper Hessenberg matrix in place: H <- Z^H H Z upper triangular, and z <- z Z
 * (pass the Q of the Hessenberg reduction to get A = z T z^H). Single-shift implicit QR sweeps with complex
 * Givens rotations and Wilkinson shifts, exceptional shifts after 10 and 20 sweeps without deflation, and the
 * Ahues-Kressner deflation test: Golub and Van Loan, Matrix Computations, 4th ed., sec. 7.5 (complex Schur,
 * single-shift QR), following the structure of LAPACK's zlahqr (Anderson et al., LAPACK Users' Guide, 3rd ed.).
 * Throws NumericalError when an eigenvalue does not converge in 30 sweeps per eigenvalue.
 */
export function complexSchur(h: ComplexMatrix, z: ComplexMatrix): void {
  const { n, re: hr, im: hi } = h;
  const smlnum = SAFE_MIN * (n / ULP);
  const itmax = 30 * Math.max(10, n);
  let kdefl = 0;
  let i = n - 1;
  while (i >= 0) {
    let l = 0;
    let converged = false;
    for (let its = 0; its <= itmax; its++) {
      // look for a single small subdiagonal element
      let k = i;
      for (; k > l; k--) {
        const s = k * n + k - 1;
        const sub = cabs1(hr[s], hi[s]);
        if (sub <= smlnum) break;
        const d0 = (k - 1) * n + k - 1, d1 = k * n + k;
        let tst = cabs1(hr[d0], hi[d0]) + cabs1(hr[d1], hi[d1]);
        if (tst === 0) {
          if (k - 2 >= 0) tst += cabs1(hr[(k - 1) * n + k - 2], hi[(k - 1) * n + k - 2]);
          if (k + 1 < n) tst += cabs1(hr[(k + 1) * n + k], hi[(k + 1) * n + k]);
        }
        if (sub <= ULP * tst) {
          const sup = cabs1(hr[(k - 1) * n + k], hi[(k - 1) * n + k]);
          const ab = Math.max(sub, sup), ba = Math.min(sub, sup);
          const diff = cabs1(hr[d0] - hr[d1], hi[d0] - hi[d1]);
          const hkk = cabs1(hr[d1], hi[d1]);
          const aa = Math.max(hkk, diff), bb = Math.min(hkk, diff);
          const s2 = aa + ab;
          if (ba * (ab / s2) <= Math.max(smlnum, ULP * (bb * (aa / s2)))) break;
        }
      }
      l = k;
      if (l > 0) { hr[l * n + l - 1] = 0; hi[l * n + l - 1] = 0; }
      if (l >= i) { converged = true; break; }
      kdefl++;
      const [tr, ti] = shift(h, l, i, kdefl);
      sweep(h, z, l, i, tr, ti);
    }
    if (!converged) {
      throw new NumericalError(`complex QR iteration did not converge for eigenvalue ${i + 1} of ${n}`, 'no-convergence');
    }
    kdefl = 0;
    i = l - 1;
  }
  // clear what lies below the diagonal (zero up to rounding after convergence)
  for (let r = 1; r < n; r++) for (let c = 0; c < r; c++) { hr[r * n + c] = 0; hi[r * n + c] = 0; }
}

/** Wilkinson shift of the trailing 2 x 2 block of rows l..i, or an exceptional shift every 10th sweep. */
function shift(h: ComplexMatrix, l: number, i: number, kdefl: number): [number, number] {
  const { n, re: hr, im: hi } = h;
  if (kdefl % 20 === 0) {
    const s = 0.75 * cabs1(hr[i * n + i - 1], hi[i * n + i - 1]);
    return [s + hr[i * n + i], hi[i * n + i]];
  }
  if (kdefl % 10 === 0) {
    const s = 0.75 * cabs1(hr[(l + 1) * n + l], hi[(l + 1) * n + l]);
    return [s + hr[l * n + l], hi[l * n + l]];
  }
  let tr = hr[i * n + i], ti = hi[i * n + i];
  // u = sqrt(H(i-1,i)) sqrt(H(i,i-1))
  const [ar, ai] = csqrt(hr[(i - 1) * n + i], hi[(i - 1) * n + i]);
  const [br, bi] = csqrt(hr[i * n + i - 1], hi[i * n + i - 1]);
  const ur = ar * br - ai * bi, ui = ar * bi + ai * br;
  let s = cabs1(ur, ui);
  if (s === 0) return [tr, ti];
  const xr = 0.5 * (hr[(i - 1) * n + i - 1] - tr), xi = 0.5 * (hi[(i - 1) * n + i - 1] - ti);
  const sx = cabs1(xr, xi);
  s = Math.max(s, sx);
  // y = s sqrt((x/s)^2 + (u/s)^2)
  const xsr = xr / s, xsi = xi / s, usr = ur / s, usi = ui / s;
  let [yr, yi] = csqrt(xsr * xsr - xsi * xsi + usr * usr - usi * usi, 2 * xsr * xsi + 2 * usr * usi);
  yr *= s;
  yi *= s;
  if (sx > 0 && (xr / sx) * yr + (xi / sx) * yi < 0) { yr = -yr; yi = -yi; }
  // t = t - u * (u / (x + y))
  const [qr, qi] = cdiv(ur, ui, xr + yr, xi + yi);
  tr -= ur * qr - ui * qi;
  ti -= ur * qi + ui * qr;
  return [tr, ti];
}

/** One implicit single-shift QR sweep on rows and columns l..i, chasing the bulge with Givens rotations. */
function sweep(h: ComplexMatrix, z: ComplexMatrix, l: number, i: number, tr: number, ti: number): void {
  const { n, re: hr, im: hi } = h;
  const { re: zr, im: zi } = z;
  for (let k = l; k < i; k++) {
    let ar: number, ai: number, br: number, bi: number;
    if (k === l) {
      ar = hr[l * n + l] - tr; ai = hi[l * n + l] - ti;
      br = hr[(l + 1) * n + l]; bi = hi[(l + 1) * n + l];
    } else {
      ar = hr[k * n + k - 1]; ai = hi[k * n + k - 1];
      br = hr[(k + 1) * n + k - 1]; bi = hi[(k + 1) * n + k - 1];
    }
    // G = [c s; -conj(s) c] with G [a; b] = [r; 0], c real
    const na = Math.hypot(ar, ai), nb = Math.hypot(br, bi);
    if (nb === 0) continue;
    const nu = Math.hypot(na, nb);
    let c: number, sr: number, si: number, pr: number, pi: number;
    if (na === 0) {
      c = 0; pr = 1; pi = 0;
      sr = br / nb; si = -bi / nb; // s = conj(b)/|b|, r = |b|
    } else {
      c = na / nu; pr = ar / na; pi = ai / na;
      // s = (a/|a|) conj(b) / nu
      sr = (pr * br + pi * bi) / nu; si = (pi * br - pr * bi) / nu;
    }
    if (k > l) {
      hr[k * n + k - 1] = pr * nu; hi[k * n + k - 1] = pi * nu;
      hr[(k + 1) * n + k - 1] = 0; hi[(k + 1) * n + k - 1] = 0;
    }
    // rows k, k+1, columns k..n-1: [x; y] <- [c x + s y; -conj(s) x + c y]
    const rk = k * n, rk1 = (k + 1) * n;
    for (let j = k; j < n; j++) {
      const xr = hr[rk + j], xi = hi[rk + j], yr = hr[rk1 + j], yi = hi[rk1 + j];
      hr[rk + j] = c * xr + sr * yr - si * yi;
      hi[rk + j] = c * xi + sr * yi + si * yr;
      hr[rk1 + j] = c * yr - (sr * xr + si * xi);
      hi[rk1 + j] = c * yi - (sr * xi - si * xr);
    }
    // columns k, k+1 of rows 0..min(k+2, i) of H and of every row of Z: [x y] <- [c x + conj(s) y, -s x + c y]
    rotateColumns(hr, hi, n, k, Math.min(k + 2, i), c, sr, si);
    rotateColumns(zr, zi, n, k, n - 1, c, sr, si);
  }
}

function rotateColumns(re: Float64Array, im: Float64Array, n: number, k: number, last: number, c: number, sr: number, si: number): void {
  for (let r = 0; r <= last; r++) {
    const p = r * n + k;
    const xr = re[p], xi = im[p], yr = re[p + 1], yi = im[p + 1];
    re[p] = c * xr + sr * yr + si * yi;
    im[p] = c * xi + sr * yi - si * yr;
    re[p + 1] = c * yr - (sr * xr - si * xi);
    im[p + 1] = c * yi - (sr * xi + si * xr);
  }
}
