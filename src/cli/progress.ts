import type { Progress } from '../search/core/types.js';
import type { CliContext } from './context.js';

/** A one-line progress bar on stderr, drawn only on a terminal and at most ten times a second. */
export function progressBar(ctx: CliContext, budget: number, label: string, quiet: boolean): { update: (p: Progress) => void; done: () => void } {
  if (!ctx.isTTY || quiet) return { update: () => {}, done: () => {} };
  let last = 0;
  const draw = (p: Progress) => {
    const f = Math.min(1, p.evaluations / budget);
    const w = 30;
    const bar = '#'.repeat(Math.round(f * w)).padEnd(w, '.');
    const best = p.best !== undefined ? ` best ${(-p.best).toPrecision(5)}` : p.hypervolume !== undefined ? ` hypervolume ${p.hypervolume.toPrecision(4)}` : '';
    ctx.stderr(`\r${label} [${bar}] ${p.evaluations}/${budget}${best}   `);
  };
  return {
    update: (p) => {
      const now = Date.now();
      if (now - last < 100 && p.evaluations < budget) return;
      last = now;
      draw(p);
    },
    done: () => ctx.stderr('\n'),
  };
}
