/**
 * Default strategy parameters of CMA-ES with positive recombination weights, from Hansen,
 * "The CMA Evolution Strategy: A Tutorial", arXiv:1604.00772 (2016), Table 1 / Appendix A:
 *   lambda = 4 + floor(3 ln n), mu = floor(lambda / 2), w_i ~ ln((lambda + 1) / 2) - ln i,
 *   c_sigma = (mu_eff + 2) / (n + mu_eff + 5), d_sigma = 1 + 2 max(0, sqrt((mu_eff - 1)/(n + 1)) - 1) + c_sigma,
 *   c_c = (4 + mu_eff/n) / (n + 4 + 2 mu_eff/n), c_1 = 2 / ((n + 1.3)^2 + mu_eff),
 *   c_mu = min(1 - c_1, 2 (mu_eff - 2 + 1/mu_eff) / ((n + 2)^2 + mu_eff)),
 *   E||N(0, I)|| ~ sqrt(n) (1 - 1/(4n) + 1/(21 n^2)).
 */
export interface CmaParams {
  n: number;
  lambda: number;
  mu: number;
  weights: Float64Array;
  mueff: number;
  cs: number;
  ds: number;
  cc: number;
  c1: number;
  cmu: number;
  chiN: number;
}

export function defaultPopulation(n: number): number {
  return 4 + Math.floor(3 * Math.log(n));
}

export function cmaParams(n: number, lambda: number): CmaParams {
  const mu = Math.floor(lambda / 2);
  const raw = Float64Array.from({ length: mu }, (_, i) => Math.log((lambda + 1) / 2) - Math.log(i + 1));
  const sum = raw.reduce((a, b) => a + b, 0);
  const weights = raw.map((w) => w / sum);
  const mueff = 1 / weights.reduce((a, w) => a + w * w, 0);
  const cs = (mueff + 2) / (n + mueff + 5);
  const ds = 1 + 2 * Math.max(0, Math.sqrt((mueff - 1) / (n + 1)) - 1) + cs;
  const cc = (4 + mueff / n) / (n + 4 + (2 * mueff) / n);
  const c1 = 2 / ((n + 1.3) ** 2 + mueff);
  const cmu = Math.min(1 - c1, (2 * (mueff - 2 + 1 / mueff)) / ((n + 2) ** 2 + mueff));
  const chiN = Math.sqrt(n) * (1 - 1 / (4 * n) + 1 / (21 * n * n));
  return { n, lambda, mu, weights, mueff, cs, ds, cc, c1, cmu, chiN };
}
