// Time to score one demo candidate the way optimize does: decode, the nominal metrics and the disorder ensemble
// (secular redfield, 7 dyes, 24 samples), single thread, median over seeded random feasible designs.
import { loadDesignProblem } from '../dist/actions/load-configs.js';
import { makeEvaluator } from '../dist/actions/evaluator.js';
import { designSpace } from '../dist/space/design-space.js';

export function demoCandidateMs(count = 40) {
  const { constraints, objective } = loadDesignProblem();
  const space = designSpace(constraints).space;
  const evaluate = makeEvaluator(constraints, objective);
  let s = 2024;
  const rng = { uniform: () => ((s = (Math.imul(s, 1664525) + 1013904223) >>> 0) / 4294967296) };
  const x = new Float64Array(space.size);
  const points = [];
  for (let i = 0; i < 20000 && points.length < count; i++) {
    space.sampleInto(rng, x);
    const p = space.decode(x);
    if (space.violation(p) === 0) points.push(p);
  }
  for (let r = 0; r < 3; r++) for (const p of points) evaluate(p); // warm-up (the JIT compiles the hot path)
  const times = points.map((p) => { const t0 = performance.now(); evaluate(p); return performance.now() - t0; });
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)];
}
