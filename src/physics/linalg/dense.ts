/** Small dense helpers on row-major Float64Array matrices. */

/** C = A B for n x n matrices. */
export function matMul(a: Float64Array, b: Float64Array, n: number, out = new Float64Array(n * n)): Float64Array {
  out.fill(0);
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    for (let k = 0; k < n; k++) {
      const aik = a[ri + k];
      if (aik === 0) continue;
      const rk = k * n;
      for (let j = 0; j < n; j++) out[ri + j] += aik * b[rk + j];
    }
  }
  return out;
}

/** y = A x for an n x n matrix. */
export function matVec(a: Float64Array, x: Float64Array, n: number, out = new Float64Array(n)): Float64Array {
  for (let i = 0; i < n; i++) {
    const ri = i * n;
    let s = 0;
    for (let j = 0; j < n; j++) s += a[ri + j] * x[j];
    out[i] = s;
  }
  return out;
}

/** Identity matrix of order n. */
export function identity(n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  return m;
}

/** Maximum absolute row sum (the infinity norm). */
export function normInf(a: Float64Array, n: number): number {
  let best = 0;
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += Math.abs(a[i * n + j]);
    best = Math.max(best, s);
  }
  return best;
}

/** Maximum absolute column sum (the 1-norm). */
export function norm1(a: Float64Array, n: number): number {
  let best = 0;
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += Math.abs(a[i * n + j]);
    best = Math.max(best, s);
  }
  return best;
}
