import { Workspace } from './workspace.js';

/** Eigen-decomposition of a real symmetric matrix, eigenvalues ascending. */
export interface SymmetricEigen {
  readonly n: number;
  /** Eigenvalues in ascending order. */
  readonly values: Float64Array;
  /** Eigenvectors as columns, row-major: vectors[m * n + a] = c_ma (component on basis m of state a). */
  readonly vectors: Float64Array;
}

const scratch = new Workspace();

/**
 * Eigenvalues and orthonormal eigenvectors of a symmetric row-major matrix: Householder tridiagonalization with
 * the transformations accumulated, then the implicit QL algorithm with shifts (EISPACK tred2 and tql2: Martin,
 * Reinsch and Wilkinson, Numer. Math. 11, 181 (1968); Bowdler, Martin, Reinsch and Wilkinson, Numer. Math. 11,
 * 293 (1968); Golub and Van Loan, Matrix Computations, 4th ed., sec. 8.3), in the arithmetic order of the JAMA
 * translation, on flat arrays kept between calls. Each eigenvector's sign is fixed so that its largest-magnitude
 * component is positive, which makes results independent of the solver's sign choice. The returned arrays are
 * fresh.
 */
export function symmetricEigen(a: Float64Array, n: number): SymmetricEigen {
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  if (n === 0) return { n, values, vectors };
  const W = scratch.f64('W', n * n), d = scratch.zeros('d', n), e = scratch.zeros('e', n);
  symmetricEigenRows(a, n, W, d, e);
  for (let k = 0; k < n; k++) {
    values[k] = d[k];
    const o = k * n;
    let big = 0;
    for (let m = 0; m < n; m++) {
      const c = W[o + m];
      if (Math.abs(c) > Math.abs(big) + 1e-12) big = c;
    }
    const sign = big < 0 ? -1 : 1;
    for (let m = 0; m < n; m++) vectors[m * n + k] = sign * W[o + m];
  }
  return { n, values, vectors };
}

/**
 * The same decomposition into the caller's arrays, without the sign rule: eigenvalue k ascending in d[k], its
 * eigenvector in row k of W (W[k * n + m] is its component on basis m; rows are what the column sweeps of tred2
 * and tql2 run along). `e` (length n) is scratch; a is not modified.
 */
export function symmetricEigenRows(a: Float64Array, n: number, W: Float64Array, d: Float64Array, e: Float64Array): void {
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) W[j * n + i] = a[i * n + j];
  for (let i = 0; i < n; i++) { d[i] = 0; e[i] = 0; }
  tred2(n, e, d, W);
  tql2(n, e, d, W);
}

/**
 * sqrt(a^2 + b^2) without overflow or underflow: the plain formula where the sum of squares is safely inside
 * the normal range (one square root, no division), else the scaled JAMA form.
 */
function hypotenuse(a: number, b: number): number {
  const s = a * a + b * b;
  if (s > 1e-290 && s < 1e290) return Math.sqrt(s);
  if (Math.abs(a) > Math.abs(b)) {
    const r = b / a;
    return Math.abs(a) * Math.sqrt(1 + r * r);
  }
  if (b !== 0) {
    const r = a / b;
    return Math.abs(b) * Math.sqrt(1 + r * r);
  }
  return 0;
}

/** Householder reduction to tridiagonal form (d diagonal, e sub-diagonal), accumulating the transformations in W. */
function tred2(n: number, e: Float64Array, d: Float64Array, W: Float64Array): void {
  for (let j = 0; j < n; j++) d[j] = W[j * n + n - 1];
  for (let i = n - 1; i > 0; i--) {
    let scale = 0, h = 0;
    for (let k = 0; k < i; k++) scale = scale + Math.abs(d[k]);
    if (scale === 0) {
      e[i] = d[i - 1];
      for (let j = 0; j < i; j++) {
        d[j] = W[j * n + i - 1];
        W[j * n + i] = 0;
        W[i * n + j] = 0;
      }
    } else {
      for (let k = 0; k < i; k++) {
        d[k] /= scale;
        h += d[k] * d[k];
      }
      let f = d[i - 1];
      let g = Math.sqrt(h);
      if (f > 0) g = -g;
      e[i] = scale * g;
      h = h - f * g;
      d[i - 1] = f - g;
      for (let j = 0; j < i; j++) e[j] = 0;
      for (let j = 0; j < i; j++) {
        f = d[j];
        W[i * n + j] = f;
        const rj = j * n;
        g = e[j] + W[rj + j] * f;
        for (let k = j + 1; k <= i - 1; k++) {
          g += W[rj + k] * d[k];
          e[k] += W[rj + k] * f;
        }
        e[j] = g;
      }
      f = 0;
      for (let j = 0; j < i; j++) {
        e[j] /= h;
        f += e[j] * d[j];
      }
      const hh = f / (h + h);
      for (let j = 0; j < i; j++) e[j] -= hh * d[j];
      for (let j = 0; j < i; j++) {
        f = d[j];
        g = e[j];
        const rj = j * n;
        for (let k = j; k <= i - 1; k++) W[rj + k] = W[rj + k] - (f * e[k] + g * d[k]);
        d[j] = W[rj + i - 1];
        W[rj + i] = 0;
      }
    }
    d[i] = h;
  }
  for (let i = 0; i < n - 1; i++) {
    const ri = i * n, ri1 = ri + n;
    W[ri + n - 1] = W[ri + i];
    W[ri + i] = 1;
    const h = d[i + 1];
    if (h !== 0) {
      for (let k = 0; k <= i; k++) d[k] = W[ri1 + k] / h;
      for (let j = 0; j <= i; j++) {
        const rj = j * n;
        let g = 0;
        for (let k = 0; k <= i; k++) g += W[ri1 + k] * W[rj + k];
        for (let k = 0; k <= i; k++) W[rj + k] = W[rj + k] - g * d[k];
      }
    }
    for (let k = 0; k <= i; k++) W[ri1 + k] = 0;
  }
  for (let j = 0; j < n; j++) {
    d[j] = W[j * n + n - 1];
    W[j * n + n - 1] = 0;
  }
  W[(n - 1) * n + n - 1] = 1;
  e[0] = 0;
}

/** Implicit QL iterations on the tridiagonal (d, e), rotations applied to W; eigenvalues sorted ascending at the end. */
function tql2(n: number, e: Float64Array, d: Float64Array, W: Float64Array): void {
  for (let i = 1; i < n; i++) e[i - 1] = e[i];
  e[n - 1] = 0;
  let f = 0, tst1 = 0;
  const eps = Number.EPSILON;
  for (let l = 0; l < n; l++) {
    tst1 = Math.max(tst1, Math.abs(d[l]) + Math.abs(e[l]));
    let m = l;
    while (m < n) {
      if (Math.abs(e[m]) <= eps * tst1) break;
      m++;
    }
    if (m > l) {
      do {
        let g = d[l];
        let p = (d[l + 1] - g) / (2 * e[l]);
        let r = hypotenuse(p, 1);
        if (p < 0) r = -r;
        d[l] = e[l] / (p + r);
        d[l + 1] = e[l] * (p + r);
        const dl1 = d[l + 1];
        let h = g - d[l];
        for (let i = l + 2; i < n; i++) d[i] -= h;
        f = f + h;
        p = d[m];
        let c = 1, c2 = c, c3 = c, s = 0, s2 = 0;
        const el1 = e[l + 1];
        for (let i = m - 1; i >= l; i--) {
          c3 = c2;
          c2 = c;
          s2 = s;
          g = c * e[i];
          h = c * p;
          r = hypotenuse(p, e[i]);
          e[i + 1] = s * r;
          // r > 0: e[i] is above the deflation threshold
          const inv = 1 / r;
          s = e[i] * inv;
          c = p * inv;
          p = c * d[i] - s * g;
          d[i + 1] = h + s * (c * g + s * d[i]);
          const r0 = i * n, r1 = r0 + n;
          for (let k = 0; k < n; k++) {
            h = W[r1 + k];
            W[r1 + k] = s * W[r0 + k] + c * h;
            W[r0 + k] = c * W[r0 + k] - s * h;
          }
        }
        p = (-s * s2 * c3 * el1 * e[l]) / dl1;
        e[l] = s * p;
        d[l] = c * p;
      } while (Math.abs(e[l]) > eps * tst1);
    }
    d[l] = d[l] + f;
    e[l] = 0;
  }
  for (let i = 0; i < n - 1; i++) {
    let k = i, p = d[i];
    for (let j = i + 1; j < n; j++) {
      if (d[j] < p) { k = j; p = d[j]; }
    }
    if (k !== i) {
      d[k] = d[i];
      d[i] = p;
      const ri = i * n, rk = k * n;
      for (let j = 0; j < n; j++) { p = W[ri + j]; W[ri + j] = W[rk + j]; W[rk + j] = p; }
    }
  }
}
