import type { ComplexMatrix } from './complex-dense.js';

const ULP = Number.EPSILON;
const SMALL = 2.2250738585072014e-308 * (1 / Number.EPSILON);
const BIG = 1e150;

/**
 * Right eigenvectors of an upper triangular complex matrix T, as the columns of an upper triangular X with
 * X_kk = 1: column k solves (T - T_kk I) x = 0 by back substitution (LAPACK's ztrevc, Anderson et al.,
 * LAPACK Users' Guide, 3rd ed.: a pivot (T_jj - T_kk) smaller than ulp |T_kk| is replaced by that bound, which
 * returns an eigenvector of a nearby matrix for repeated eigenvalues). A column that grows past 1e150 is
 * rescaled. Returns X row-major (columns are not normalized).
 */
export function triangularEigenvectors(t: ComplexMatrix): ComplexMatrix {
  const { n, re: tr, im: ti } = t;
  const xr = new Float64Array(n * n), xi = new Float64Array(n * n);
  const vr = new Float64Array(n), vi = new Float64Array(n);
  for (let k = n - 1; k >= 0; k--) {
    const lr = tr[k * n + k], li = ti[k * n + k];
    const smin = Math.max(ULP * (Math.abs(lr) + Math.abs(li)), SMALL);
    vr[k] = 1;
    vi[k] = 0;
    let top = k; // entries top..k are set
    for (let j = k - 1; j >= 0; j--) {
      const rj = j * n;
      let sr = 0, si = 0;
      for (let m = j + 1; m <= k; m++) {
        const ar = tr[rj + m], ai = ti[rj + m], br = vr[m], bi = vi[m];
        sr += ar * br - ai * bi;
        si += ar * bi + ai * br;
      }
      let dr = tr[rj + j] - lr, di = ti[rj + j] - li;
      if (Math.abs(dr) + Math.abs(di) < smin) { dr = smin; di = 0; }
      // v_j = -s / d (Smith's division)
      let qr: number, qi: number;
      if (Math.abs(dr) >= Math.abs(di)) {
        const r = di / dr, d = dr + di * r;
        qr = (sr + si * r) / d; qi = (si - sr * r) / d;
      } else {
        const r = dr / di, d = di + dr * r;
        qr = (sr * r + si) / d; qi = (si * r - sr) / d;
      }
      vr[j] = -qr;
      vi[j] = -qi;
      top = j;
      const size = Math.abs(vr[j]) + Math.abs(vi[j]);
      if (size > BIG) {
        const f = 1 / size;
        for (let m = j; m <= k; m++) { vr[m] *= f; vi[m] *= f; }
      }
    }
    for (let m = top; m <= k; m++) { xr[m * n + k] = vr[m]; xi[m * n + k] = vi[m]; }
  }
  return { n, re: xr, im: xi };
}
