import { NumericalError } from '../../errors.js';

/** LU factorization with partial pivoting of a dense row-major n x n matrix. */
export interface LuFactors {
  readonly n: number;
  /** L (unit lower, below the diagonal) and U (on and above), row-major, overwritten copy of A. */
  readonly lu: Float64Array;
  readonly pivots: Int32Array;
  /** Smallest |U_kk| / max |A_ij|: a cheap indicator of near-singularity (1 is best). */
  readonly pivotRatio: number;
}

/**
 * Factorize A = P L U (Doolittle, partial pivoting; Golub and Van Loan, Matrix Computations, alg. 3.4.1).
 * A is not modified unless `copy` is false (then it is overwritten by the factors); `pivots` (n entries) may be
 * given to be reused. Throws NumericalError when a pivot is zero relative to the matrix scale.
 */
export function luFactor(a: Float64Array, n: number, copy = true, pivots = new Int32Array(n)): LuFactors {
  const lu = copy ? Float64Array.from(a) : a;
  let scale = 0;
  for (let i = 0; i < n * n; i++) scale = Math.max(scale, Math.abs(lu[i]));
  if (!Number.isFinite(scale)) throw new NumericalError('matrix has non-finite entries');
  if (scale === 0) throw new NumericalError('matrix is zero');
  let minPivot = Infinity;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > best) { best = v; p = i; }
    }
    pivots[k] = p;
    if (best <= scale * n * 1e-15) {
      throw new NumericalError(`matrix is singular to working precision (pivot ${k + 1} of ${n} is ${best.toExponential(2)} against a scale of ${scale.toExponential(2)})`, 'singular');
    }
    minPivot = Math.min(minPivot, best);
    if (p !== k) {
      const rk = k * n, rp = p * n;
      for (let j = 0; j < n; j++) { const t = lu[rk + j]; lu[rk + j] = lu[rp + j]; lu[rp + j] = t; }
    }
    const rk = k * n;
    const inv = 1 / lu[rk + k];
    // rows two at a time (each pivot-row entry loaded once for both); every entry sees the same operations
    let i = k + 1;
    for (; i + 1 < n; i += 2) {
      const ri = i * n, rj = ri + n;
      const f = lu[ri + k] * inv, g = lu[rj + k] * inv;
      if (f !== 0 && g !== 0) {
        lu[ri + k] = f;
        lu[rj + k] = g;
        for (let j = k + 1; j < n; j++) { const u = lu[rk + j]; lu[ri + j] -= f * u; lu[rj + j] -= g * u; }
      } else if (f !== 0) eliminate(lu, n, k, ri, f);
      else if (g !== 0) eliminate(lu, n, k, rj, g);
    }
    if (i < n) {
      const f = lu[i * n + k] * inv;
      if (f !== 0) eliminate(lu, n, k, i * n, f);
    }
  }
  return { n, lu, pivots, pivotRatio: minPivot / scale };
}

/** Row ri -= f (row k) right of column k, with the multiplier f stored in column k. */
function eliminate(lu: Float64Array, n: number, k: number, ri: number, f: number): void {
  const rk = k * n;
  lu[ri + k] = f;
  for (let j = k + 1; j < n; j++) lu[ri + j] -= f * lu[rk + j];
}

/** Solve A x = b with the factors of A. b is not modified; returns x. */
export function luSolve(f: LuFactors, b: Float64Array): Float64Array {
  return luSolveInPlace(f, Float64Array.from(b));
}

/** luSolve overwriting x (holding b on entry, its first n entries) with the solution; returns x. */
export function luSolveInPlace(f: LuFactors, x: Float64Array): Float64Array {
  const { n, lu, pivots } = f;
  for (let k = 0; k < n; k++) {
    const p = pivots[k];
    if (p !== k) { const t = x[k]; x[k] = x[p]; x[p] = t; }
  }
  for (let i = 1; i < n; i++) {
    const ri = i * n;
    let s = x[i];
    for (let j = 0; j < i; j++) s -= lu[ri + j] * x[j];
    x[i] = s;
  }
  for (let i = n - 1; i >= 0; i--) {
    const ri = i * n;
    let s = x[i];
    for (let j = i + 1; j < n; j++) s -= lu[ri + j] * x[j];
    x[i] = s / lu[ri + i];
  }
  return x;
}
