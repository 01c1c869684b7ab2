/**
 * The archive of a multi-objective run: the non-dominated points seen (constrained domination, so
 * once a feasible point is known only feasible points stay). When it grows past `size`, the most
 * crowded point (smallest crowding distance, Deb et al. 2002) is dropped, one at a time.
 */
import { dominates } from './compare.js';
import { EvaluatedList } from './evaluatedList.js';
import type { Evaluated } from './types.js';
import { crowdingDistance } from '../multi/crowding.js';

function sameScores(a: Evaluated, b: Evaluated): boolean {
  if (a.violation !== b.violation) return false;
  for (let i = 0; i < a.f.length; i++) if (a.f[i] !== b.f[i]) return false;
  return true;
}

export class ParetoArchive extends EvaluatedList {
  /** Increases whenever the archive changes (lets callers cache the hypervolume). */
  version = 0;

  constructor(readonly size = 500) {
    super();
  }

  /** Adds `e` unless an archived point dominates it or has the same scores. */
  insert(e: Evaluated): boolean {
    for (const a of this.items) if (dominates(a, e) || sameScores(a, e)) return false;
    this.items = this.items.filter((a) => !dominates(e, a));
    this.items.push(e);
    this.version++;
    return true;
  }

  /** Drops the most crowded points until at most `size` remain. */
  prune(): void {
    while (this.items.length > this.size) {
      const d = crowdingDistance(this.items.map((e) => e.f));
      let worst = 0;
      for (let i = 1; i < d.length; i++) if (d[i] < d[worst]) worst = i;
      this.items.splice(worst, 1);
      this.version++;
    }
  }
}
