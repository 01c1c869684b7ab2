import { identity, matMul, norm1 } from './dense.js';
import { luFactor, luSolve } from './lu.js';

// Coefficients of the [13/13] Pade approximant and the theta_13 bound: Higham, "The scaling and squaring
// method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26, 1179 (2005), table 2.3/2.4.
const B13 = [
  64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000,
  10559470521600, 670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
];
const THETA13 = 5.371920351148152;

/** exp(A) of a dense row-major n x n real matrix by scaling and squaring with the [13/13] Pade approximant. */
export function expm(a: Float64Array, n: number): Float64Array {
  const nrm = norm1(a, n);
  let s = 0;
  if (nrm > THETA13) s = Math.max(0, Math.ceil(Math.log2(nrm / THETA13)));
  const scale = 2 ** -s;
  const A = new Float64Array(n * n);
  for (let i = 0; i < n * n; i++) A[i] = a[i] * scale;
  const I = identity(n);
  const A2 = matMul(A, A, n);
  const A4 = matMul(A2, A2, n);
  const A6 = matMul(A4, A2, n);
  const nn = n * n;
  const tmpU = new Float64Array(nn);
  const tmpV = new Float64Array(nn);
  // U = A [A6 (b13 A6 + b11 A4 + b9 A2) + b7 A6 + b5 A4 + b3 A2 + b1 I]
  for (let i = 0; i < nn; i++) tmpU[i] = B13[13] * A6[i] + B13[11] * A4[i] + B13[9] * A2[i];
  const u1 = matMul(A6, tmpU, n);
  for (let i = 0; i < nn; i++) u1[i] += B13[7] * A6[i] + B13[5] * A4[i] + B13[3] * A2[i] + B13[1] * I[i];
  const U = matMul(A, u1, n);
  // V = A6 (b12 A6 + b10 A4 + b8 A2) + b6 A6 + b4 A4 + b2 A2 + b0 I
  for (let i = 0; i < nn; i++) tmpV[i] = B13[12] * A6[i] + B13[10] * A4[i] + B13[8] * A2[i];
  const V = matMul(A6, tmpV, n);
  for (let i = 0; i < nn; i++) V[i] += B13[6] * A6[i] + B13[4] * A4[i] + B13[2] * A2[i] + B13[0] * I[i];
  // R = (V - U)^-1 (V + U)
  const P = new Float64Array(nn);
  const Q = new Float64Array(nn);
  for (let i = 0; i < nn; i++) { P[i] = V[i] + U[i]; Q[i] = V[i] - U[i]; }
  const f = luFactor(Q, n, false);
  let R = new Float64Array(nn);
  const col = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) col[i] = P[i * n + j];
    const x = luSolve(f, col);
    for (let i = 0; i < n; i++) R[i * n + j] = x[i];
  }
  const scratch = new Float64Array(nn);
  for (let k = 0; k < s; k++) {
    matMul(R, R, n, scratch);
    R.set(scratch);
  }
  return R;
}
