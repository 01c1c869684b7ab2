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

/**
 * Grow-only scratch arrays by name, for routines called many times on small problems: in V8 a typed array of
 * more than 64 bytes has an off-heap backing store that costs several hundred nanoseconds to create, and
 * worker threads creating them at once slow each other down. `f64(name, length)` and `i32(name, length)`
 * return an array of at least `length` entries (only the first `length` are meant) with whatever it last
 * held; it is reallocated only when a longer one is asked for (unlike linalg/workspace.ts, whose arrays have an
 * exact length, so that sizes varying from call to call do not reallocate; Int32 arrays too). Each worker thread
 * has its own module instances, so a module-level Scratch is never shared between threads.
 */
export class Scratch {
  private readonly f = new Map<string, Float64Array<ArrayBuffer>>();
  private readonly i = new Map<string, Int32Array<ArrayBuffer>>();

  f64(name: string, length: number): Float64Array<ArrayBuffer> {
    let a = this.f.get(name);
    if (a === undefined || a.length < length) { a = new Float64Array(Math.max(length, 2 * (a?.length ?? 0))); this.f.set(name, a); }
    return a;
  }

  /** f64 with its first `length` entries zeroed. */
  zeros(name: string, length: number): Float64Array<ArrayBuffer> {
    const a = this.f64(name, length);
    a.fill(0, 0, length);
    return a;
  }

  i32(name: string, length: number): Int32Array<ArrayBuffer> {
    let a = this.i.get(name);
    if (a === undefined || a.length < length) { a = new Int32Array(Math.max(length, 2 * (a?.length ?? 0))); this.i.set(name, a); }
    return a;
  }
}
