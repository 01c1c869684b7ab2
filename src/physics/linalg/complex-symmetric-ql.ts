import { NumericalError } from '../../errors.js';
import { cabs, cdiv, csqrt } from './complex-scalar.js';

const EPS = Number.EPSILON;

/**
 * Eigenvalues of an unreduced or reducible complex symmetric tridiagonal matrix by the implicit QL algorithm
 * with complex orthogonal rotations (c^2 + s^2 = 1): EISPACK's imtql1 (Dubrulle, Martin and Wilkinson, Numer. Math. 12,
 * 377 (1968)) in complex arithmetic, as proposed for complex symmetric matrices by Cullum and Willoughby,
 * SIAM J. Matrix Anal. Appl. 17, 83 (1996). Diagonal d (length m) and off-diagonal e (e[k] couples k, k+1)
 * are overwritten: d receives the eigenvalues (unordered), e is destroyed.
 * With `z` (m x m row-major, usually I on entry) the rotations are also applied to its columns, as EISPACK's
 * imtql2 does: on return column j of z is the eigenvector of d[j] (of T when z was I), with z^T z unchanged.
 * Throws NumericalError on a near-isotropic rotation (f^2 + g^2 close to 0 while f, g are not) or when an
 * eigenvalue takes more than 30 sweeps; callers fall back to a unitary method.
 */
export function complexSymmetricQl(dr: Float64Array, di: Float64Array, er: Float64Array, ei: Float64Array, z?: { re: Float64Array; im: Float64Array }): void {
  const m = dr.length;
  if (m === 0) return;
  er[m - 1] = 0; ei[m - 1] = 0;
  let norm = 0;
  for (let k = 0; k < m; k++) norm = Math.max(norm, cabs(dr[k], di[k]) + cabs(er[k], ei[k]));
  const floor = EPS * EPS * norm;
  for (let l = 0; l < m; l++) {
    let iter = 0;
    for (;;) {
      let mm = l;
      for (; mm < m - 1; mm++) {
        // |re| + |im| measures, as in LAPACK's complex routines
        const tst = Math.abs(dr[mm]) + Math.abs(di[mm]) + Math.abs(dr[mm + 1]) + Math.abs(di[mm + 1]);
        if (Math.abs(er[mm]) + Math.abs(ei[mm]) <= EPS * tst + floor) break;
      }
      if (mm === l) break;
      if (iter++ === 30) throw new NumericalError(`complex symmetric QL: eigenvalue ${l + 1} of ${m} did not converge in 30 sweeps`, 'no-convergence');
      // shift: g = (d[l+1] - d[l]) / (2 e[l]); r = sqrt(g^2 + 1); g = d[mm] - d[l] + e[l] / (g +- r)
      let [gr, gi] = cdiv(dr[l + 1] - dr[l], di[l + 1] - di[l], 2 * er[l], 2 * ei[l]);
      let [rr, ri] = csqrt(gr * gr - gi * gi + 1, 2 * gr * gi);
      if (gr * rr + gi * ri < 0) { rr = -rr; ri = -ri; }
      const [tr, ti] = cdiv(er[l], ei[l], gr + rr, gi + ri);
      gr = dr[mm] - dr[l] + tr; gi = di[mm] - di[l] + ti;
      let sr = 1, si = 0, cr = 1, ci = 0, pr = 0, pi = 0;
      let underflow = false;
      for (let i = mm - 1; i >= l; i--) {
        const fr = sr * er[i] - si * ei[i], fi = sr * ei[i] + si * er[i];
        const br = cr * er[i] - ci * ei[i], bi = cr * ei[i] + ci * er[i];
        // r = sqrt(f^2 + g^2), the principal root (inlined csqrt: this is the inner loop)
        const qr = fr * fr - fi * fi + gr * gr - gi * gi, qi = 2 * (fr * fi + gr * gi);
        if (qr === 0 && qi === 0) { rr = 0; ri = 0; } else {
          const t = Math.sqrt(0.5 * (Math.sqrt(qr * qr + qi * qi) + Math.abs(qr)));
          if (qr >= 0) { rr = t; ri = qi / (2 * t); } else { rr = Math.abs(qi) / (2 * t); ri = qi >= 0 ? t : -t; }
        }
        const size = fr * fr + fi * fi + gr * gr + gi * gi;
        er[i + 1] = rr; ei[i + 1] = ri;
        if (size === 0) {
          dr[i + 1] -= pr; di[i + 1] -= pi; er[mm] = 0; ei[mm] = 0;
          underflow = true;
          break;
        }
        const r2 = rr * rr + ri * ri;
        if (r2 < 1e-12 * size) {
          throw new NumericalError('complex symmetric QL: a rotation is nearly isotropic (f^2 + g^2 close to 0)', 'isotropic-rotation');
        }
        // s = f / r, c = g / r
        const ir = rr / r2, ii = -ri / r2;
        sr = fr * ir - fi * ii; si = fr * ii + fi * ir;
        cr = gr * ir - gi * ii; ci = gr * ii + gi * ir;
        gr = dr[i + 1] - pr; gi = di[i + 1] - pi;
        // r = (d[i] - g) s + 2 c b
        const ar = dr[i] - gr, ai = di[i] - gi;
        rr = ar * sr - ai * si + 2 * (cr * br - ci * bi);
        ri = ar * si + ai * sr + 2 * (cr * bi + ci * br);
        pr = sr * rr - si * ri; pi = sr * ri + si * rr;
        dr[i + 1] = gr + pr; di[i + 1] = gi + pi;
        gr = cr * rr - ci * ri - br; gi = cr * ri + ci * rr - bi;
        if (z) rotateColumns(z.re, z.im, m, i, sr, si, cr, ci);
      }
      if (underflow) continue;
      dr[l] -= pr; di[l] -= pi;
      er[l] = gr; ei[l] = gi;
      er[mm] = 0; ei[mm] = 0;
    }
  }
}

/** Columns i, i + 1 of z (m x m row-major) <- (c z_i - s z_i+1, s z_i + c z_i+1), complex s and c (imtql2). */
function rotateColumns(zr: Float64Array, zi: Float64Array, m: number, i: number, sr: number, si: number, cr: number, ci: number): void {
  for (let k = i; k < m * m; k += m) {
    const ar = zr[k], ai = zi[k], fr = zr[k + 1], fi = zi[k + 1];
    zr[k + 1] = sr * ar - si * ai + cr * fr - ci * fi;
    zi[k + 1] = sr * ai + si * ar + cr * fi + ci * fr;
    zr[k] = cr * ar - ci * ai - (sr * fr - si * fi);
    zi[k] = cr * ai + ci * ar - (sr * fi + si * fr);
  }
}
