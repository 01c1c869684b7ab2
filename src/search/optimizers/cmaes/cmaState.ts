/**
 * One run of CMA-ES (no restarts): sampling and the update of mean, evolution paths, step size and
 * covariance matrix, following Hansen, "The CMA Evolution Strategy: A Tutorial" (arXiv:1604.00772),
 * the algorithm summary of Appendix A with positive weights:
 *   y_k = B D z_k,  x_k = m + sigma y_k
 *   <y>_w = sum w_i y_{i:lambda},  m <- m + sigma <y>_w
 *   p_s <- (1 - c_s) p_s + sqrt(c_s (2 - c_s) mu_eff) C^{-1/2} <y>_w
 *   sigma <- sigma exp(c_s/d_s (|p_s| / E|N(0,I)| - 1))
 *   p_c <- (1 - c_c) p_c + h_s sqrt(c_c (2 - c_c) mu_eff) <y>_w
 *   C <- (1 + c_1 d(h_s) - c_1 - c_mu) C + c_1 p_c p_c^T + c_mu sum w_i y_i y_i^T
 * B and D are refreshed every `eigenGap` generations (the lazy update of the tutorial, appendix B.2).
 */
import type { Rng } from '../../rng.js';
import { f64 } from '../../core/state.js';
import { eigenSymmetric } from './eigenSym.js';
import { cmaParams, type CmaParams } from './params.js';

export class CmaState {
  readonly p: CmaParams;
  readonly n: number;
  mean: Float64Array;
  sigma: number;
  C: Float64Array;
  B: Float64Array;
  D: Float64Array;
  pc: Float64Array;
  ps: Float64Array;
  generation = 0;
  private eigenAt = 0;
  /** Set when an eigendecomposition gave non-finite or non-positive values. */
  broken = false;

  constructor(
    n: number,
    lambda: number,
    mean: Float64Array,
    sigma: number,
    private readonly eigenGap: number,
  ) {
    this.n = n;
    this.p = cmaParams(n, lambda);
    this.mean = mean.slice();
    this.sigma = sigma;
    this.C = new Float64Array(n * n);
    this.B = new Float64Array(n * n);
    for (let i = 0; i < n; i++) {
      this.C[i * n + i] = 1;
      this.B[i * n + i] = 1;
    }
    this.D = new Float64Array(n).fill(1);
    this.pc = new Float64Array(n);
    this.ps = new Float64Array(n);
  }

  /** Draws one step y = B D z (z standard normal) into `y`. */
  sampleStep(rng: Rng, y: Float64Array, z: Float64Array): void {
    const { n, B, D } = this;
    for (let j = 0; j < n; j++) z[j] = D[j] * rng.normal();
    const n4 = n - (n % 4);
    for (let i = 0; i < n; i++) {
      // Four partial sums: lets the engine overlap the multiply-adds.
      let s0 = 0;
      let s1 = 0;
      let s2 = 0;
      let s3 = 0;
      const row = i * n;
      let j = 0;
      for (; j < n4; j += 4) {
        s0 += B[row + j] * z[j];
        s1 += B[row + j + 1] * z[j + 1];
        s2 += B[row + j + 2] * z[j + 2];
        s3 += B[row + j + 3] * z[j + 3];
      }
      for (; j < n; j++) s0 += B[row + j] * z[j];
      y[i] = s0 + s1 + (s2 + s3);
    }
  }

  /** Updates the distribution from the steps of the mu best candidates, best first. */
  update(best: readonly Float64Array[]): void {
    const { n, p, C, B, D, pc, ps } = this;
    const { weights, mu, mueff, cs, ds, cc, c1, cmu, chiN } = p;
    const yw = new Float64Array(n);
    for (let k = 0; k < mu; k++) {
      const w = weights[k];
      const y = best[k];
      for (let i = 0; i < n; i++) yw[i] += w * y[i];
    }
    for (let i = 0; i < n; i++) this.mean[i] += this.sigma * yw[i];
    // C^{-1/2} <y>_w = B D^{-1} B^T <y>_w
    const t = new Float64Array(n);
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let i = 0; i < n; i++) s += B[i * n + j] * yw[i];
      t[j] = s / D[j];
    }
    const a = Math.sqrt(cs * (2 - cs) * mueff);
    let norm2 = 0;
    for (let i = 0; i < n; i++) {
      let s = 0;
      const row = i * n;
      for (let j = 0; j < n; j++) s += B[row + j] * t[j];
      ps[i] = (1 - cs) * ps[i] + a * s;
      norm2 += ps[i] * ps[i];
    }
    const normPs = Math.sqrt(norm2);
    this.generation++;
    const hs = normPs / Math.sqrt(1 - Math.pow(1 - cs, 2 * this.generation)) / chiN < 1.4 + 2 / (n + 1) ? 1 : 0;
    const b = hs * Math.sqrt(cc * (2 - cc) * mueff);
    for (let i = 0; i < n; i++) pc[i] = (1 - cc) * pc[i] + b * yw[i];
    const keep = 1 - c1 - cmu + (1 - hs) * c1 * cc * (2 - cc);
    // Upper triangle, row by row with unit stride: C <- keep C + c1 pc pc^T + cmu sum w_k y_k y_k^T.
    for (let i = 0; i < n; i++) {
      const row = i * n;
      const a = c1 * pc[i];
      for (let j = i; j < n; j++) C[row + j] = keep * C[row + j] + a * pc[j];
    }
    for (let k = 0; k < mu; k++) {
      const y = best[k];
      const wk = cmu * weights[k];
      for (let i = 0; i < n; i++) {
        const row = i * n;
        const a = wk * y[i];
        for (let j = i; j < n; j++) C[row + j] += a * y[j];
      }
    }
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) C[j * n + i] = C[i * n + j];
    this.sigma *= Math.exp((cs / ds) * (normPs / chiN - 1));
    if (this.generation - this.eigenAt >= this.eigenGap) this.refreshEigen();
  }

  /** Recomputes B and D from C. */
  refreshEigen(): void {
    const { n } = this;
    const { values, vectors } = eigenSymmetric(this.C, n);
    for (let j = 0; j < n; j++) {
      const v = values[j];
      if (!(v > 0) || !Number.isFinite(v)) {
        this.broken = true;
        return;
      }
    }
    this.B = vectors;
    this.D = values.map(Math.sqrt);
    this.eigenAt = this.generation;
  }

  /** Condition number of C as of the last eigendecomposition. */
  condition(): number {
    let lo = Infinity;
    let hi = 0;
    for (const d of this.D) {
      lo = Math.min(lo, d);
      hi = Math.max(hi, d);
    }
    return (hi / lo) ** 2;
  }

  save(): unknown {
    const { mean, sigma, C, B, D, pc, ps, generation, eigenAt, broken } = this;
    return { lambda: this.p.lambda, mean, sigma, C, B, D, pc, ps, generation, eigenAt, broken, eigenGap: this.eigenGap };
  }

  static load(n: number, v: unknown): CmaState {
    const d = v as Record<string, unknown>;
    const s = new CmaState(n, d.lambda as number, f64(d.mean), d.sigma as number, d.eigenGap as number);
    s.C = f64(d.C);
    s.B = f64(d.B);
    s.D = f64(d.D);
    s.pc = f64(d.pc);
    s.ps = f64(d.ps);
    s.generation = d.generation as number;
    s.eigenAt = d.eigenAt as number;
    s.broken = d.broken as boolean;
    return s;
  }
}
