import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { DEMO } from '../../src/actions/demo.js';
import { makeEvaluator } from '../../src/actions/evaluator.js';
import { loadConfigFile } from '../../src/config/load.js';
import { Rng } from '../../src/search/rng.js';
import { designSpace } from '../../src/space/design-space.js';

// The pool runs the built worker script (npm test builds first), so it is imported from dist.
const { EvaluationPool, startWorkers } = await import(new URL('../../dist/actions/pool.js', import.meta.url).href) as typeof import('../../src/actions/pool.js');

const constraints = loadConfigFile(DEMO.constraints, 'constraints');
const objective = loadConfigFile(DEMO.objective, 'objective');
const ds = designSpace(constraints);
const local = makeEvaluator(constraints, objective);
// the 2-thread pool takes a worker started before the job was known (as optimize starts them)
startWorkers(1);
const pools = [1, 2, 3].map((k) => new EvaluationPool(k, constraints, objective));
afterAll(async () => { await Promise.all(pools.map((p) => p.close())); });

describe('evaluation does not depend on the number of workers (fast-check)', () => {
  it('gives the in-process scores, in order, for 1, 2 and 3 workers', async () => {
    await fc.assert(fc.asyncProperty(fc.integer({ min: 0, max: 2 ** 31 }), fc.integer({ min: 1, max: 9 }), async (seed, count) => {
      const rng = Rng.fromSeed(seed);
      const x = new Float64Array(ds.space.dim);
      const points = Array.from({ length: count }, () => { ds.space.sampleInto(rng, x); return ds.space.decode(x); });
      const expected = points.map(local);
      for (const pool of pools) expect(await pool.evaluate(points)).toEqual(expected);
    }), { numRuns: 15 });
  });
});

describe('workers given back by a closed pool', () => {
  it('score the next pool\'s job, a different one, as the main thread does', async () => {
    // another job: hsr transport and other disorder draws (the thread must drop the first job's settings)
    const other = { ...objective, model: { ...objective.model, kind: 'hsr' as const }, disorder: { ...objective.disorder!, seed: 7, samples: 5 } };
    const first = new EvaluationPool(2, constraints, objective);
    const rng = Rng.fromSeed(11);
    const x = new Float64Array(ds.space.dim);
    // a full batch, so that the returned worker takes some of the second pool's tasks
    const points = Array.from({ length: 16 }, () => { ds.space.sampleInto(rng, x); return ds.space.decode(x); });
    expect(await first.evaluate(points)).toEqual(points.map(local));
    await first.close();
    const second = new EvaluationPool(2, constraints, other);
    expect(await second.evaluate(points)).toEqual(points.map(makeEvaluator(constraints, other)));
    await second.close();
  });
});

describe('workers started ahead of a job', () => {
  it('do not keep the process alive when no pool takes them (a command that fails early still exits)', () => {
    // a script file, not --input-type=module -e: workers inherit the parent's flags, and that one breaks them
    const dir = mkdtempSync(join(tmpdir(), 'lumenfold-spare-'));
    const script = join(dir, 'spare.mjs');
    const pool = new URL('../../dist/actions/pool.js', import.meta.url).href;
    writeFileSync(script, `const m = await import(${JSON.stringify(pool)}); m.startWorkers(2); setTimeout(() => console.log('started'), 500);\n`);
    // the workers sleep until a pool gives them a job, forever: held, the process would hit the timeout
    const out = execFileSync(process.execPath, [script], { encoding: 'utf8', timeout: 20_000 });
    expect(out.trim()).toBe('started');
  });

  it('do not keep the process alive once the pool that took them is closed', () => {
    const dir = mkdtempSync(join(tmpdir(), 'lumenfold-parked-'));
    const script = join(dir, 'parked.mjs');
    const url = (f: string) => JSON.stringify(new URL(`../../dist/${f}`, import.meta.url).href);
    writeFileSync(script, [
      `const { EvaluationPool } = await import(${url('actions/pool.js')});`,
      `const { loadConfigFile } = await import(${url('config/load.js')});`,
      `const { DEMO } = await import(${url('actions/demo.js')});`,
      `const pool = new EvaluationPool(3, loadConfigFile(DEMO.constraints, 'constraints'), loadConfigFile(DEMO.objective, 'objective'));`,
      `await pool.evaluate([]);`,
      `await pool.close();`,
      `console.log('closed');`,
    ].join('\n') + '\n');
    const out = execFileSync(process.execPath, [script], { encoding: 'utf8', timeout: 20_000 });
    expect(out.trim()).toBe('closed');
  });
});
