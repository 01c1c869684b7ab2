import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { batchTasks } from '../../src/actions/tasks.js';

// The task table must hand out every piece of work exactly once, whatever the sizes; the pool's results
// depend only on that (workers.test.ts checks the results themselves against the in-process evaluator).
describe('batch task table (guided self-scheduling)', () => {
  it('covers each nominal and each disorder sample once, in order, with chunks that shrink towards the end', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 200 }), fc.integer({ min: 1, max: 8 }), (P, S, threads) => {
      const { tasks, first } = batchTasks(P, S, threads);
      const count = tasks.length / 3;
      // the P nominal tasks first, point by point
      for (let j = 0; j < P; j++) expect([tasks[3 * j], tasks[3 * j + 1]]).toEqual([j, -1]);
      expect(first[0]).toBe(P);
      expect(first[P]).toBe(count);
      const most = Math.max(1, Math.ceil(S / (2 * threads)));
      let last = Infinity;
      for (let j = 0; j < P; j++) {
        let next = 0;
        for (let t = first[j]; t < first[j + 1]; t++) {
          const [point, from, to] = [tasks[3 * t], tasks[3 * t + 1], tasks[3 * t + 2]];
          expect(point).toBe(j);
          expect(from).toBe(next); // contiguous, in sample order
          expect(to - from).toBeGreaterThanOrEqual(1);
          expect(to - from).toBeLessThanOrEqual(most);
          // a chunk is never larger than the one before it, unless it was cut short by the end of a point
          if (to < S) { expect(to - from).toBeLessThanOrEqual(last); last = to - from; }
          next = to;
        }
        expect(next).toBe(S);
      }
    }), { numRuns: 300 });
  });

  it('ends a demo-sized batch with one-sample tasks', () => {
    // 16 points of 24 samples on 2 threads: chunks of 6 while much is left, then smaller
    const { tasks } = batchTasks(16, 24, 2);
    const sizes = [];
    for (let t = 16; t < tasks.length / 3; t++) sizes.push(tasks[3 * t + 2] - tasks[3 * t + 1]);
    expect(sizes[0]).toBe(6);
    expect(sizes[sizes.length - 1]).toBe(1);
    expect(sizes.reduce((a, b) => a + b, 0)).toBe(16 * 24);
  });
});
