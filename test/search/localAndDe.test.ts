/** The (1+1)-ES success rule and the binomial crossover of differential evolution. */
import { describe, expect, it } from 'vitest';
import { createOptimizer, Rng, SearchSpace } from '../../src/search/index.js';

describe('(1+1)-ES with the one-fifth success rule', () => {
  it('changes the step size by exp(1/3) per success and exp(-1/12) per failure, and converges linearly on the sphere', () => {
    // With these factors the step size is stationary exactly at a success rate of 1/5; converging
    // needs a shrinking step, so the observed rate sits a little below 1/5.
    const dim = 10;
    const space = new SearchSpace().reals('x', dim, 0, 1);
    const opt = createOptimizer('one-plus-one', { space, rng: Rng.fromSeed(3), batch: 1, budget: 1e5, objectives: 'single' });
    const f = (x: ArrayLike<number>) => Array.from(x).reduce((s, v) => s + (v - 0.4) ** 2, 0);
    const bestAt: number[] = [];
    // Spans of 400 steps; f stays far above the rounding floor (~1e-33 for x near 0.4).
    for (let k = 1; k <= 1600; k++) {
      const c = opt.ask(1);
      opt.tell(c, c.map((p) => f(p.x)));
      if (k % 400 === 0) bestAt.push(Math.log10(opt.recommend()!.f[0]));
    }
    const { successRate, sigma } = opt.progress().detail as { successRate: number; sigma: number };
    const trials = 1599; // the first evaluation scores the start point
    const successes = Math.round(successRate * trials);
    expect(Math.log((sigma as number) / 0.1)).toBeCloseTo(successes / 3 - (trials - successes) / 12, 9);
    expect(successRate).toBeGreaterThan(0.1);
    expect(successRate).toBeLessThan(0.2);
    // Linear convergence: equal decreases of log10 f over equal spans (within 30 %).
    const d1 = bestAt[1] - bestAt[2];
    const d2 = bestAt[2] - bestAt[3];
    expect(d1).toBeGreaterThan(1);
    expect(Math.abs(d2 - d1) / d1).toBeLessThan(0.3);
  });
});

describe('differential evolution crossover', () => {
  it('with CR = 0 each trial differs from its target in exactly one unit (the forced one)', () => {
    // Storn and Price (1997): binomial crossover always takes the mutant at one random index.
    const space = new SearchSpace().reals('x', 6, 0, 1).choice('c', ['a', 'b', 'c', 'd']);
    for (const optimizer of ['de-rand1bin', 'de-current-to-best1']) {
      const opt = createOptimizer(optimizer, { space, rng: Rng.fromSeed(5), batch: 1, budget: 1000, objectives: 'single' }, { CR: 0, popsize: 20 });
      const first = opt.ask(20);
      opt.tell(first, first.map((c) => c.x[0]));
      const trials = opt.ask(20);
      expect(trials.length).toBe(20);
      trials.forEach((t, i) => {
        const target = first[i].x;
        const realChanged = [0, 1, 2, 3, 4, 5].filter((j) => t.x[j] !== target[j]).length;
        const blockChanged = [6, 7, 8, 9].some((j) => t.x[j] !== target[j]) ? 1 : 0;
        // The forced unit is a real coordinate or the categorical block (which may redraw the same option).
        expect(realChanged + blockChanged).toBeLessThanOrEqual(1);
        expect(realChanged).toBeLessThanOrEqual(1);
      });
      // Over the population, the forced unit falls on real coordinates in most trials.
      const moved = trials.filter((t, i) => [0, 1, 2, 3, 4, 5].some((j) => t.x[j] !== first[i].x[j])).length;
      expect(moved).toBeGreaterThan(10);
    }
  });

  it('replaces a target only by a trial that is not worse (one-to-one selection)', () => {
    const space = new SearchSpace().reals('x', 3, 0, 1);
    const opt = createOptimizer('de-rand1bin', { space, rng: Rng.fromSeed(9), batch: 1, budget: 1000, objectives: 'single' }, { popsize: 10 });
    const f = (x: ArrayLike<number>) => x[0] + x[1] + x[2];
    let pop = opt.ask(10);
    let scores = pop.map((c) => f(c.x));
    opt.tell(pop, scores);
    for (let g = 0; g < 20; g++) {
      const trials = opt.ask(10);
      const ts = trials.map((c) => f(c.x));
      opt.tell(trials, ts);
      const survivors = ts.map((s, i) => (s <= scores[i] ? trials[i] : pop[i]));
      scores = ts.map((s, i) => Math.min(s, scores[i]));
      pop = survivors;
      const popState = (opt.dump().data as { search: { family: { population: { x: number[] }[] } } }).search.family.population;
      popState.forEach((p, i) => expect(p.x).toEqual(Array.from(pop[i].x)));
    }
  });
});
