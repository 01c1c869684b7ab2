import { type ComplexMatrix, complexCopy, complexIdentity } from './complex-dense.js';

/** A = Q H Q^H with H upper Hessenberg and Q unitary. */
export interface ComplexHessenberg {
  readonly h: ComplexMatrix;
  readonly q: ComplexMatrix;
}

/**
 * Unitary reduction of a complex square matrix to upper Hessenberg form by Householder reflections,
 * accumulating Q (Golub and Van Loan, Matrix Computations, 4th ed., alg. 7.4.2, in complex arithmetic;
 * the reflector P = I - u u^H / h of EISPACK's corth, which sends x to -e^{i arg x_1} |x| e_1).
 * A is not modified. Cost about 16/3 n^3 complex multiply-adds with Q.
 */
export function complexHessenberg(a: ComplexMatrix): ComplexHessenberg {
  const { n } = a;
  const h = complexCopy(a);
  const q = complexIdentity(n);
  const { re: hr, im: hi } = h;
  const ur = new Float64Array(n), ui = new Float64Array(n);
  const wr = new Float64Array(n), wi = new Float64Array(n);
  for (let k = 0; k < n - 2; k++) {
    let scale = 0;
    for (let i = k + 1; i < n; i++) scale += Math.abs(hr[i * n + k]) + Math.abs(hi[i * n + k]);
    if (scale === 0) continue;
    let sigma = 0;
    for (let i = k + 1; i < n; i++) {
      ur[i] = hr[i * n + k] / scale;
      ui[i] = hi[i * n + k] / scale;
      sigma += ur[i] * ur[i] + ui[i] * ui[i];
    }
    const g = Math.sqrt(sigma);
    const f = Math.hypot(ur[k + 1], ui[k + 1]);
    const pr = f > 0 ? ur[k + 1] / f : 1, pi = f > 0 ? ui[k + 1] / f : 0;
    ur[k + 1] += pr * g;
    ui[k + 1] += pi * g;
    const inv = 1 / (sigma + f * g); // u^H u = 2 (sigma + f g)
    // left: H <- P H on rows k+1.., columns k..: w_j = sum_i conj(u_i) H_ij / h
    wr.fill(0, k, n);
    wi.fill(0, k, n);
    for (let i = k + 1; i < n; i++) {
      const xr = ur[i], xi = ui[i], ri = i * n;
      for (let j = k; j < n; j++) {
        const yr = hr[ri + j], yi = hi[ri + j];
        wr[j] += xr * yr + xi * yi;
        wi[j] += xr * yi - xi * yr;
      }
    }
    for (let i = k + 1; i < n; i++) {
      const xr = ur[i], xi = ui[i], ri = i * n;
      for (let j = k; j < n; j++) {
        const yr = wr[j] * inv, yi = wi[j] * inv;
        hr[ri + j] -= xr * yr - xi * yi;
        hi[ri + j] -= xr * yi + xi * yr;
      }
    }
    rightReflect(h, k + 1, ur, ui, inv);
    rightReflect(q, k + 1, ur, ui, inv);
    // the column below the subdiagonal is zero by construction
    hr[(k + 1) * n + k] = -pr * g * scale;
    hi[(k + 1) * n + k] = -pi * g * scale;
    for (let i = k + 2; i < n; i++) { hr[i * n + k] = 0; hi[i * n + k] = 0; }
  }
  return { h, q };
}

/** M <- M P on columns from..n-1 of every row, P = I - u u^H inv. */
function rightReflect(m: ComplexMatrix, from: number, ur: Float64Array, ui: Float64Array, inv: number): void {
  const { n, re, im } = m;
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    let sr = 0, si = 0;
    for (let j = from; j < n; j++) {
      const xr = re[ri + j], xi = im[ri + j];
      sr += xr * ur[j] - xi * ui[j];
      si += xr * ui[j] + xi * ur[j];
    }
    if (sr === 0 && si === 0) continue;
    sr *= inv;
    si *= inv;
    for (let j = from; j < n; j++) {
      // subtract s conj(u_j)
      re[ri + j] -= sr * ur[j] + si * ui[j];
      im[ri + j] -= si * ur[j] - sr * ui[j];
    }
  }
}
