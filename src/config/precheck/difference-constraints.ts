/**
 * Systems of difference constraints x[to] - x[from] <= weight, solved as shortest paths (Bellman-Ford;
 * Cormen, Leiserson, Rivest and Stein, Introduction to Algorithms, section 24.4): the system has a
 * solution if and only if the constraint graph has no negative cycle.
 */
export interface DifferenceEdge<L> {
  from: number;
  to: number;
  weight: number;
  label: L;
}

const TOL = 1e-9;

/** The edges of a negative cycle (constraints that cannot hold together), or undefined when solvable. */
export function negativeCycle<L>(nodes: number, edges: readonly DifferenceEdge<L>[]): DifferenceEdge<L>[] | undefined {
  const dist = new Array<number>(nodes).fill(0);
  const via = new Array<DifferenceEdge<L> | undefined>(nodes).fill(undefined);
  let last = -1;
  for (let round = 0; round < nodes; round++) {
    last = -1;
    for (const e of edges) {
      if (dist[e.from] + e.weight < dist[e.to] - TOL) {
        dist[e.to] = dist[e.from] + e.weight;
        via[e.to] = e;
        last = e.to;
      }
    }
    if (last < 0) return undefined;
  }
  // Still relaxing after `nodes` rounds: walk back `nodes` steps to land on the cycle, then collect it.
  let v = last;
  for (let i = 0; i < nodes; i++) v = via[v]!.from;
  const cycle: DifferenceEdge<L>[] = [];
  for (let u = v; ; ) {
    const e = via[u]!;
    cycle.push(e);
    u = e.from;
    if (u === v) break;
  }
  return cycle.reverse();
}

/** Shortest distances from `source` (assumes no negative cycle); Infinity where unreachable. */
export function shortestFrom<L>(nodes: number, edges: readonly DifferenceEdge<L>[], source: number): number[] {
  const dist = new Array<number>(nodes).fill(Infinity);
  dist[source] = 0;
  for (let round = 0; round < nodes; round++) {
    let changed = false;
    for (const e of edges) {
      if (dist[e.from] + e.weight < dist[e.to] - TOL) {
        dist[e.to] = dist[e.from] + e.weight;
        changed = true;
      }
    }
    if (!changed) break;
  }
  return dist;
}

/**
 * Tightest bounds lo[i] <= x[i] - x[source] <= hi[i] implied by the system: hi from shortest paths from
 * the source, lo from shortest paths to it.
 */
export function impliedBounds<L>(nodes: number, edges: readonly DifferenceEdge<L>[], source: number): { lo: number[]; hi: number[] } {
  const hi = shortestFrom(nodes, edges, source);
  const reversed = edges.map((e) => ({ ...e, from: e.to, to: e.from }));
  const lo = shortestFrom(nodes, reversed, source).map((d) => -d);
  return { lo, hi };
}
