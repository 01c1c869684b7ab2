/**
 * The ask/tell contract, checked over every registered optimizer: candidates stay in the
 * standardized box, the same seed gives the identical run (batch sizes 1 and 8), a run stopped half
 * way and resumed from its JSON state ends exactly like a run straight through, NaN and infinite
 * scores never crash a run nor win it, constraints make the recommendation feasible, and bad input
 * gives typed errors that name the alternatives. These are interface properties required by the
 * issue (common practice for ask/tell libraries); the references they check against are runs of the
 * same code, so each equality check is paired with a case that must differ (another seed).
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { createOptimizer, minimize, optimizerNames, Rng, SearchSpace } from '../../src/search/index.js';

/** A mixed space exercising every kind of variable. */
function mixedSpace() {
  return new SearchSpace()
    .reals('x', 3, -5, 5)
    .logReal('rate', 1e-3, 10)
    .integer('n', 0, 6)
    .choice('dye', ['A', 'B', 'C'])
    .unitVector('u');
}
type Mixed = ReturnType<ReturnType<typeof mixedSpace>['decode']>;

/** Minimum 0 at x = (1, -2, 0.5), rate = 0.1, n = 3, dye 'B', u = +z. */
function mixedObjective(p: Mixed): number {
  const [a, b, c] = p.x;
  return (a - 1) ** 2 + (b + 2) ** 2 + (c - 0.5) ** 2 + Math.log10(p.rate / 0.1) ** 2 + 0.1 * (p.n - 3) ** 2 + (p.dye === 'B' ? 0 : 1) + (1 - p.u[2]);
}

const NAMES = optimizerNames();

describe('ask/tell contract of every registered optimizer', () => {
  it('lists the built-in optimizers', () => {
    for (const n of ['random', 'halton', 'cmaes', 'de-rand1bin', 'de-current-to-best1', 'one-plus-one', 'nsga2', 'auto']) expect(NAMES).toContain(n);
  });

  it('an unknown optimizer name gives an InputError that lists the available ones', () => {
    const space = mixedSpace();
    const ctx = { space, rng: Rng.fromSeed(1), batch: 1, budget: 100, objectives: 'single' as const };
    expect(() => createOptimizer('nelder-mead', ctx)).toThrow(InputError);
    expect(() => createOptimizer('nelder-mead', ctx)).toThrow(NAMES.join(', '));
  });

  for (const name of NAMES) {
    describe(name, () => {
      it('asks points inside [0, 1]^d with fresh ids and refuses unknown or repeated ids', () => {
        const space = mixedSpace();
        const opt = createOptimizer(name, { space, rng: Rng.fromSeed(3), batch: 4, budget: 400, objectives: 'single' });
        const ids = new Set<number>();
        for (let round = 0; round < 30; round++) {
          const cands = opt.ask(4);
          expect(cands.length).toBeGreaterThan(0);
          for (const c of cands) {
            expect(c.x.length).toBe(space.dim);
            for (const v of c.x) expect(v >= 0 && v <= 1).toBe(true);
            expect(ids.has(c.id)).toBe(false);
            ids.add(c.id);
          }
          opt.tell(cands, cands.map((c) => mixedObjective(space.decode(c.x))));
          expect(() => opt.tell(cands, cands.map(() => 0))).toThrow(InputError);
        }
        expect(() => opt.tell([{ id: 999999, x: new Float64Array(space.dim) }], [1])).toThrow(InputError);
        expect(opt.progress().evaluations).toBe(ids.size);
      });

      it('rejects an unknown option key, naming the known ones', () => {
        const space = mixedSpace();
        const ctx = { space, rng: Rng.fromSeed(1), batch: 1, budget: 100, objectives: 'single' as const };
        expect(() => createOptimizer(name, ctx, { stepSize: 3 })).toThrow(/unknown option "stepSize"/);
      });

      for (const batch of [1, 8]) {
        it(`gives the identical recommendation for the same seed (batch ${batch})`, async () => {
          const run = (seed: number) => minimize(mixedObjective, mixedSpace(), { optimizer: name, budget: 300, seed, batch });
          const [a, b, c] = await Promise.all([run(11), run(11), run(12)]);
          expect(a.best).toEqual(b.best);
          expect(a.archive).toEqual(b.archive);
          expect(a.evaluations).toBe(300);
          // Another seed gives another run (so the equality above is not vacuous).
          expect(c.archive).not.toEqual(a.archive);
        });

        it(`resumes a run stopped half way to the same result as a run straight through (batch ${batch})`, async () => {
          const space = mixedSpace();
          const straight = await minimize(mixedObjective, space, { optimizer: name, budget: 400, seed: 5, batch });
          // Stop (as a user would, from the progress callback) after 173 evaluations: not a multiple
          // of any population size, so the stop falls inside a generation.
          const half = await minimize(mixedObjective, space, {
            optimizer: name,
            budget: 400,
            seed: 5,
            batch,
            onProgress: (p) => p.evaluations < 173,
          });
          expect(half.stopped).toBe(true);
          expect(half.evaluations).toBeLessThan(400);
          const saved = JSON.parse(JSON.stringify(half.state));
          const resumed = await minimize(mixedObjective, mixedSpace(), { budget: 400, resume: saved });
          expect(resumed.evaluations).toBe(400);
          expect(resumed.best).toEqual(straight.best);
          expect(resumed.archive).toEqual(straight.archive);
          expect(resumed.state).toEqual(JSON.parse(JSON.stringify(straight.state)));
        });
      }

      it('treats NaN and infinite scores as worst and keeps running', async () => {
        const space = mixedSpace();
        let broken = 0;
        const result = await minimize(
          (p) => {
            if (p.x[0] > 0) {
              broken++;
              return [NaN, Infinity, -Infinity][broken % 3];
            }
            return mixedObjective(p);
          },
          space,
          { optimizer: name, budget: 400, seed: 2, batch: 4 },
        );
        expect(broken).toBeGreaterThan(0);
        expect(result.evaluations).toBe(400);
        expect(Number.isFinite(result.best!.score)).toBe(true);
        expect(result.best!.point.x[0]).toBeLessThanOrEqual(0);
      });

      it('recommends a feasible point when the unconstrained optimum is infeasible', async () => {
        // Sphere around the origin, constrained to x0 + x1 >= 1: the optimum (0, 0) is cut off.
        const space = new SearchSpace()
          .reals('x', 2, -5, 5)
          .constraint('x0 + x1 >= 1', (p) => p.x[0] + p.x[1] >= 1, (p) => 1 - p.x[0] - p.x[1]);
        let infeasibleEvaluated = 0;
        const result = await minimize(
          (p) => {
            if (p.x[0] + p.x[1] < 1) infeasibleEvaluated++;
            return p.x[0] ** 2 + p.x[1] ** 2;
          },
          space,
          { optimizer: name, budget: 600, seed: 4 },
        );
        expect(infeasibleEvaluated).toBe(0); // cheap constraints are checked before the objective
        expect(result.best!.feasible).toBe(true);
        expect(result.best!.point.x[0] + result.best!.point.x[1]).toBeGreaterThanOrEqual(1);
        // The constrained optimum is (1/2, 1/2) with value 1/2; every optimizer gets below the
        // value 12.5 of a typical random feasible point.
        expect(result.best!.score).toBeGreaterThanOrEqual(0.5 - 1e-12);
        expect(result.best!.score).toBeLessThan(2);
      });
    });
  }
});
