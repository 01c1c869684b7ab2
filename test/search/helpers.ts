/** Shared helpers of the search-layer tests. */
import { execFileSync } from 'node:child_process';
import { bbob, createOptimizer, Rng, SearchSpace, type BbobName, type Optimizer } from '../../src/search/index.js';

/** Debian's python with numpy and SciPy (the `python3` on PATH may lack them). */
export const PYTHON = '/usr/bin/python3';

/** Runs a Python snippet that reads JSON from stdin and prints JSON; returns the parsed output. */
export function python<T>(script: string, input: unknown): T {
  const out = execFileSync(PYTHON, ['-c', script], { input: JSON.stringify(input), encoding: 'utf8', maxBuffer: 64 << 20 });
  return JSON.parse(out) as T;
}

/** The BBOB search space [-5, 5]^dim as one vector variable. */
export function boxSpace(dim: number) {
  return new SearchSpace().reals('x', dim, -5, 5);
}

export interface BbobRun {
  /** Best f - f_opt reached. */
  best: number;
  /** Evaluations used until the target was first reached (undefined if never). */
  hit: number | undefined;
  optimizer: Optimizer;
}

/** Runs optimizer `name` on a BBOB function with the plain ask/tell loop; stops at `target`. */
export function runBbob(name: string, fn: BbobName, dim: number, budget: number, seed: number, target = -Infinity, batch = 1): BbobRun {
  const f = bbob(fn, dim, 1000 + seed);
  const space = boxSpace(dim);
  const optimizer = createOptimizer(name, { space, rng: Rng.fromSeed(seed), batch, budget, objectives: 'single' });
  let used = 0;
  let best = Infinity;
  let hit: number | undefined;
  while (used < budget && hit === undefined) {
    const cands = optimizer.ask(Math.min(batch, budget - used));
    const scores = cands.map((c) => f.evaluate(space.decode(c.x).x) - f.fopt);
    optimizer.tell(cands, scores);
    for (const s of scores) {
      used++;
      best = Math.min(best, s);
      if (hit === undefined && best <= target) hit = used;
    }
  }
  return { best, hit, optimizer };
}
