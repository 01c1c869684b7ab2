/** The archive of a single-objective run: the `size` best points seen, best first (Deb's rules). */
import { compareSingle } from './compare.js';
import { EvaluatedList } from './evaluatedList.js';
import type { Evaluated } from './types.js';

export class BestArchive extends EvaluatedList {
  constructor(readonly size = 10) {
    super();
  }

  insert(e: Evaluated): void {
    const items = this.items;
    if (items.length === this.size && compareSingle(e, items[items.length - 1]) >= 0) return;
    let lo = 0;
    let hi = items.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (compareSingle(items[mid], e) <= 0) lo = mid + 1;
      else hi = mid;
    }
    items.splice(lo, 0, e);
    if (items.length > this.size) items.pop();
  }

  best(): Evaluated | undefined {
    return this.items[0];
  }
}
