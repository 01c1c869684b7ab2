/**
 * Crowding distance of a set of objective vectors (Deb et al., "A fast and elitist multiobjective
 * genetic algorithm: NSGA-II", IEEE TEC 6(2), 2002, section III-B): for each objective the points are
 * sorted, the two extremes get Infinity and the others the normalized gap between their neighbours.
 * A missing component (a point not evaluated) counts as Infinity.
 */
export function crowdingDistance(scores: readonly ArrayLike<number>[]): Float64Array {
  const n = scores.length;
  const d = new Float64Array(n);
  if (n === 0) return d;
  const m = Math.max(...scores.map((s) => s.length));
  const f = scores.map((s) => Float64Array.from({ length: m }, (_, k) => (k < s.length ? s[k] : Infinity)));
  const order = Array.from({ length: n }, (_, i) => i);
  for (let k = 0; k < m; k++) {
    order.sort((a, b) => f[a][k] - f[b][k] || a - b);
    const lo = f[order[0]][k];
    const hi = f[order[n - 1]][k];
    d[order[0]] = Infinity;
    d[order[n - 1]] = Infinity;
    const span = hi - lo;
    if (!(span > 0) || !Number.isFinite(span)) continue;
    for (let i = 1; i < n - 1; i++) d[order[i]] += (f[order[i + 1]][k] - f[order[i - 1]][k]) / span;
  }
  return d;
}
