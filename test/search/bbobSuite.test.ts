/**
 * One suite over every registered optimizer, on the BBOB noiseless functions f1 sphere, f2 separable
 * ellipsoid, f8 Rosenbrock and f3 separable Rastrigin (Hansen, Finck, Ros and Auger 2009, INRIA
 * RR-6829), each run with its own seeded shift x_opt. A row states the dimension, the budget, the
 * target on f - f_opt and how many of 10 seeded runs must reach it (a success rate, as in BBOB).
 *
 * How the thresholds were set: every row was run on seeds 1-10 (the ones used here) and 11-20
 * before the counts were written; where some runs fail, `need` is at or below the lower of the two
 * success counts (the comment gives both). For the samplers (random, halton) the sphere and
 * ellipsoid targets follow from the sublevel-set volume: with n uniform points in [-5, 5]^2 the chance
 * that none lands below t is about exp(-n vol(t) / 100), vol = pi t for the sphere and
 * pi t / 1000 for the ellipsoid (axis ratio 1000), i.e. 0.2 % for t = 0.1 and t = 100 at n = 2000.
 * CMA-ES rows are the checks of the issue: 1e-8 on the 10-D sphere, ellipsoid and Rosenbrock.
 */
import { describe, expect, it } from 'vitest';
import { optimizerNames, type BbobName } from '../../src/search/index.js';
import { runBbob } from './helpers.js';

interface Row {
  fn: BbobName;
  dim: number;
  budget: number;
  target: number;
  /** Successes required out of 10 seeds. */
  need: number;
}

const sampler: Row[] = [
  { fn: 'sphere', dim: 2, budget: 2000, target: 0.1, need: 10 },
  { fn: 'ellipsoid', dim: 2, budget: 2000, target: 100, need: 10 },
  { fn: 'rosenbrock', dim: 2, budget: 2000, target: 1, need: 10 }, // 10/10 and 10/10; median best ~0.1
  { fn: 'rastrigin', dim: 2, budget: 2000, target: 6, need: 10 }, // 10/10 and 10/10; median best ~2
];

const cma: Row[] = [
  { fn: 'sphere', dim: 10, budget: 4000, target: 1e-8, need: 10 }, // typically 1400-2000 evaluations
  { fn: 'ellipsoid', dim: 10, budget: 12000, target: 1e-8, need: 10 }, // typically 5700-6600
  { fn: 'rosenbrock', dim: 10, budget: 40000, target: 1e-8, need: 10 }, // typically 6000-9000; 17000 and 31000 after restarts (seeds 1-20)
  // IPOP on 2-D Rastrigin: in the failure we examined, x_opt lay 1.05 from a bound, where the
  // reflected image of the landscape (box transformation) can mislead large populations (our reading).
  { fn: 'rastrigin', dim: 2, budget: 15000, target: 1e-8, need: 5 }, // 7/10 and 9/10
];

const PROFILES: Record<string, Row[]> = {
  random: sampler,
  halton: sampler,
  cmaes: cma,
  auto: cma, // picks cmaes for real variables with these budgets
  'de-rand1bin': [
    { fn: 'sphere', dim: 5, budget: 5000, target: 1e-6, need: 10 },
    { fn: 'ellipsoid', dim: 5, budget: 5000, target: 1e-3, need: 10 },
    { fn: 'rosenbrock', dim: 2, budget: 3000, target: 1e-8, need: 6 }, // 7/10 and 9/10
    { fn: 'rastrigin', dim: 2, budget: 2000, target: 1e-6, need: 8 }, // 9/10 and 10/10
  ],
  'de-current-to-best1': [
    { fn: 'sphere', dim: 5, budget: 5000, target: 1e-12, need: 10 },
    { fn: 'ellipsoid', dim: 2, budget: 2000, target: 1e-8, need: 6 }, // 8/10 and 7/10 (premature convergence)
    { fn: 'rosenbrock', dim: 2, budget: 2000, target: 1e-8, need: 10 },
    { fn: 'rastrigin', dim: 2, budget: 2000, target: 1e-8, need: 8 }, // 9/10 and 9/10
  ],
  // A local method with isotropic steps: exact on the sphere, slow on the ill-conditioned ellipsoid,
  // trapped in the local minimum nearest its start on Rastrigin (random starts score 20-80 there).
  'one-plus-one': [
    { fn: 'sphere', dim: 5, budget: 3000, target: 1e-8, need: 10 },
    { fn: 'ellipsoid', dim: 2, budget: 2000, target: 50, need: 8 }, // 9/10 and 8/10
    { fn: 'rosenbrock', dim: 2, budget: 2000, target: 1, need: 7 }, // 9/10 and 10/10: may stall in the curved valley
    { fn: 'rastrigin', dim: 2, budget: 2000, target: 30, need: 10 },
  ],
  // With one objective NSGA-II is an elitist genetic algorithm (SBX and polynomial mutation).
  nsga2: [
    { fn: 'sphere', dim: 2, budget: 2000, target: 1e-3, need: 10 },
    { fn: 'ellipsoid', dim: 2, budget: 2000, target: 10, need: 10 },
    { fn: 'rosenbrock', dim: 2, budget: 2000, target: 0.2, need: 10 },
    { fn: 'rastrigin', dim: 2, budget: 2000, target: 0.5, need: 10 },
  ],
};

const SEEDS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];

describe('BBOB suite over every registered optimizer', () => {
  it('has a profile for every registered optimizer', () => {
    expect(Object.keys(PROFILES).sort()).toEqual(optimizerNames());
  });

  for (const name of optimizerNames()) {
    const rows = PROFILES[name] ?? [];
    for (const row of rows) {
      it(`${name}: ${row.fn} ${row.dim}-D reaches ${row.target} within ${row.budget} evaluations in ${row.need}/10 runs`, () => {
        const results = SEEDS.map((seed) => runBbob(name, row.fn, row.dim, row.budget, seed, row.target));
        const successes = results.filter((r) => r.hit !== undefined).length;
        const summary = results.map((r) => (r.hit ? `${r.hit}` : `best ${r.best.toExponential(2)}`)).join(', ');
        expect(successes, summary).toBeGreaterThanOrEqual(row.need);
      });
    }
  }

  it('auto picks CMA-ES for these real-valued problems', () => {
    const run = runBbob('auto', 'sphere', 10, 4000, 1);
    expect(run.optimizer.progress().detail.chosen).toBe('cmaes');
  });
});
