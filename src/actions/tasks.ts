/**
 * The task table of a batch of P points with S disorder samples each, for `threads` threads taking tasks from a
 * shared counter. Task t is (point tasks[3t], samples tasks[3t+1] .. tasks[3t+2] - 1), or the point's nominal
 * metrics when tasks[3t+1] is -1. The P nominal tasks come first (a point whose nominal evaluation fails needs no
 * samples), then each point's samples in contiguous chunks, points in order. Chunks follow guided
 * self-scheduling (Polychronopoulos and Kuck, IEEE Trans. Comput. C-36, 1425 (1987)): each is about the work
 * still to be handed out divided by 4 x threads, at most ceil(S / (2 x threads)) samples and at least one, so
 * that tasks are few while there is much left (taking a task costs a little: one-sample tasks measured about
 * 5% more CPU on the demo) and small at the end, where a thread that finishes early would otherwise wait for
 * the others' last task. `first[j]` .. `first[j + 1]` - 1 are point j's sample tasks.
 */
export interface TaskTable {
  readonly tasks: Int32Array;
  readonly first: Int32Array;
}

export function batchTasks(P: number, S: number, threads: number): TaskTable {
  const cells: number[] = [];
  for (let j = 0; j < P; j++) cells.push(j, -1, -1);
  const first = new Int32Array(P + 1);
  const most = Math.max(1, Math.ceil(S / (2 * threads)));
  let left = P * S;
  for (let j = 0; j < P; j++) {
    first[j] = cells.length / 3;
    for (let from = 0; from < S;) {
      const size = Math.min(S - from, most, Math.max(1, Math.ceil(left / (4 * threads))));
      cells.push(j, from, from + size);
      from += size;
      left -= size;
    }
  }
  first[P] = cells.length / 3;
  return { tasks: Int32Array.from(cells), first };
}
