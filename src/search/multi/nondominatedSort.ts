/**
 * Fast non-dominated sorting (Deb et al., IEEE TEC 6(2), 2002, section III-A): splits points into
 * fronts F1, F2, ... where F1 is non-dominated and each next front is non-dominated once the earlier
 * ones are removed. O(M N^2). Domination is given by the caller (constrained domination in NSGA-II).
 */
export function nondominatedSort<T>(items: readonly T[], dominates: (a: T, b: T) => boolean): number[][] {
  const n = items.length;
  const dominatedBy: number[][] = Array.from({ length: n }, () => []);
  const count = new Int32Array(n);
  const fronts: number[][] = [[]];
  for (let p = 0; p < n; p++) {
    for (let q = p + 1; q < n; q++) {
      if (dominates(items[p], items[q])) {
        dominatedBy[p].push(q);
        count[q]++;
      } else if (dominates(items[q], items[p])) {
        dominatedBy[q].push(p);
        count[p]++;
      }
    }
  }
  for (let p = 0; p < n; p++) if (count[p] === 0) fronts[0].push(p);
  for (let i = 0; fronts[i].length > 0; i++) {
    const next: number[] = [];
    for (const p of fronts[i]) {
      for (const q of dominatedBy[p]) {
        count[q]--;
        if (count[q] === 0) next.push(q);
      }
    }
    fronts.push(next);
  }
  fronts.pop();
  return fronts;
}
