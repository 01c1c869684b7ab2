/**
 * Multi-objective search on ZDT1 and ZDT2 (Zitzler, Deb and Thiele, Evol. Comput. 8(2), 2000) with
 * 30 variables: the hypervolume of the final front with reference (1, 1) must come within 2 % of the
 * true front's, which is int_0^1 sqrt(f1) df1 = 2/3 (ZDT1) and int_0^1 f1^2 df1 = 1/3 (ZDT2).
 * Budget 25 000 evaluations = 250 generations of 100, the setting of Deb et al. (IEEE TEC 2002).
 */
import { describe, expect, it } from 'vitest';
import { InputError } from '../../src/errors.js';
import { hypervolume, minimizeMulti, SearchSpace, zdt, type ZdtName } from '../../src/search/index.js';

const TRUE_HV: Record<ZdtName, number> = { zdt1: 2 / 3, zdt2: 1 / 3 };

function zdtSpace() {
  return new SearchSpace().reals('x', 30, 0, 1);
}

describe('NSGA-II on ZDT1 and ZDT2', () => {
  for (const name of ['zdt1', 'zdt2'] as const) {
    it(`${name}: final front hypervolume within 2% of the true front's`, async () => {
      const result = await minimizeMulti((p) => zdt(name, p.x), zdtSpace(), {
        optimizer: 'nsga2',
        budget: 25000,
        seed: 7,
        batch: 100,
        reference: [1, 1],
      });
      const hv = hypervolume(result.front.map((f) => f.score), [1, 1]);
      expect(hv).toBeGreaterThan(0.98 * TRUE_HV[name]);
      expect(hv).toBeLessThanOrEqual(TRUE_HV[name]); // no finite set can beat the true front
      expect(result.hypervolume).toBeCloseTo(hv, 12); // the tracked value is the same measure
      // Tracked over the run: it grows from the first generations to the end.
      expect(result.history.length).toBeGreaterThan(50);
      const early = result.history.find((h) => h.evaluations >= 2500)!;
      expect(early.hypervolume).toBeLessThan(0.9 * hv);
      // Every front member is non-dominated within the front.
      const f = result.front.map((e) => e.score);
      for (const a of f) for (const b of f) expect(b[0] <= a[0] && b[1] <= a[1] && (b[0] < a[0] || b[1] < a[1])).toBe(false);
    });
  }

  it('resumes a multi-objective run to the same front as a run straight through', async () => {
    const objective = (p: { x: number[] }) => zdt('zdt1', p.x);
    const straight = await minimizeMulti(objective, zdtSpace(), { optimizer: 'nsga2', budget: 1500, seed: 3, batch: 10 });
    const half = await minimizeMulti(objective, zdtSpace(), { optimizer: 'nsga2', budget: 1500, seed: 3, batch: 10, onProgress: (p) => p.evaluations < 730 });
    const resumed = await minimizeMulti(objective, zdtSpace(), { budget: 1500, resume: JSON.parse(JSON.stringify(half.state)) });
    expect(resumed.front).toEqual(straight.front);
    expect(resumed.hypervolume).toBe(straight.hypervolume);
  });

  it('single-objective optimizers refuse several objectives and name the ones that accept them', async () => {
    await expect(minimizeMulti((p) => zdt('zdt1', p.x), zdtSpace(), { optimizer: 'cmaes', budget: 10 })).rejects.toThrow(InputError);
    await expect(minimizeMulti((p) => zdt('zdt1', p.x), zdtSpace(), { optimizer: 'cmaes', budget: 10 })).rejects.toThrow(/auto, halton, nsga2, random/);
  });

  it('auto picks NSGA-II for several objectives and says so', async () => {
    const result = await minimizeMulti((p) => zdt('zdt2', p.x), zdtSpace(), { budget: 200, seed: 1 });
    expect(result.choice?.name).toBe('nsga2');
    expect(result.choice?.reason).toMatch(/several objectives/);
  });

  it('keeps only feasible points in the front once one is known (constrained domination)', async () => {
    const space = zdtSpace().constraint('f1 >= 0.5', (p) => p.x[0] >= 0.5, (p) => 0.5 - p.x[0]);
    const result = await minimizeMulti((p) => zdt('zdt1', p.x), space, { optimizer: 'nsga2', budget: 3000, seed: 2, batch: 50 });
    expect(result.front.length).toBeGreaterThan(5);
    for (const e of result.front) {
      expect(e.feasible).toBe(true);
      expect(e.point.x[0]).toBeGreaterThanOrEqual(0.5);
    }
  });
});
