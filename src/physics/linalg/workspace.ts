/**
 * Reusable scratch arrays by name, so that repeated calls on matrices of the same size allocate nothing:
 * in V8 a Float64Array of more than 8 entries lives outside the heap and costs a few hundred nanoseconds to
 * create and zero, as much as the arithmetic of a small eigenproblem, and worker threads creating them at once
 * slow each other down. `take` and `zeros` give arrays of exactly the length asked; `f64` and `i32` grow-only
 * ones of at least that length, for sizes that vary from call to call. Each worker thread has its own module
 * instances, so a module-level Workspace is never shared between threads. Arrays of up to MAX_CACHED entries
 * are kept between calls; larger ones are allocated each time (their cost is small against the work on them).
 * A routine given a workspace may return arrays that live in it: they are overwritten by the next call that
 * uses the same workspace and names.
 */
export class Workspace {
  /** Largest array kept between calls (4 Mi entries, 32 MiB). */
  static readonly MAX_CACHED = 4 * 1024 * 1024;
  private readonly arrays = new Map<string, Float64Array>();
  private readonly grown = new Map<string, Float64Array<ArrayBuffer>>();
  private readonly ints = new Map<string, Int32Array<ArrayBuffer>>();
  private readonly frames = new Map<string, { readonly n: number }>();

  /** Array `name` of exactly `length` entries with whatever it last held. */
  take(name: string, length: number): Float64Array {
    if (length > Workspace.MAX_CACHED) return new Float64Array(length);
    let a = this.arrays.get(name);
    if (a === undefined || a.length !== length) {
      a = new Float64Array(length);
      this.arrays.set(name, a);
    }
    return a;
  }

  /**
   * Array `name` of at least `length` entries (grow-only, doubling: a shorter or equal later request reuses it,
   * so sizes that change between calls do not reallocate). Read and write only the first `length`.
   */
  f64(name: string, length: number): Float64Array<ArrayBuffer> {
    let a = this.grown.get(name);
    if (a === undefined || a.length < length) { a = new Float64Array(Math.max(length, 2 * (a?.length ?? 0))); this.grown.set(name, a); }
    return a;
  }

  /** Int32 counterpart of f64. */
  i32(name: string, length: number): Int32Array<ArrayBuffer> {
    let a = this.ints.get(name);
    if (a === undefined || a.length < length) { a = new Int32Array(Math.max(length, 2 * (a?.length ?? 0))); this.ints.set(name, a); }
    return a;
  }

  /**
   * The object `make(n)` built for `name`, kept until a call with another n: one lookup for a routine's whole
   * set of arrays instead of one per array (each lookup costs some 15 ns, as much as a pass over a 7 x 7 matrix).
   * Its arrays hold whatever the last call left in them.
   */
  frame<T extends { readonly n: number }>(name: string, n: number, make: (n: number) => T): T {
    const f = this.frames.get(name) as T | undefined;
    if (f !== undefined && f.n === n) return f;
    const g = make(n);
    this.frames.set(name, g);
    return g;
  }

  /** Array `name` of `length` zeros. */
  zeros(name: string, length: number): Float64Array {
    const a = this.take(name, length);
    // a plain loop beats the fill builtin's call overhead on the short arrays of small systems
    if (length <= 64) for (let i = 0; i < length; i++) a[i] = 0;
    else a.fill(0);
    return a;
  }
}

/** `length` zeros from the workspace when there is one, else a fresh array. */
export function scratch(ws: Workspace | undefined, name: string, length: number): Float64Array {
  return ws ? ws.zeros(name, length) : new Float64Array(length);
}

/** Like scratch, but not zeroed: for arrays the caller writes in full before reading. */
export function fresh(ws: Workspace | undefined, name: string, length: number): Float64Array {
  return ws ? ws.take(name, length) : new Float64Array(length);
}

/** ws.frame(name, n, make) when there is a workspace, else a new make(n). */
export function frameOf<T extends { readonly n: number }>(ws: Workspace | undefined, name: string, n: number, make: (n: number) => T): T {
  return ws ? ws.frame(name, n, make) : make(n);
}
