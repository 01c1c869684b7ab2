import type { ConstraintSet } from '../constraints-types.js';
import type { Objective } from '../objective-types.js';
import { checkEnergy } from './check-energy.js';
import { checkGeometry } from './check-geometry.js';
import { checkIndices } from './check-indices.js';
import type { PrecheckReason } from './reason.js';
import { siteDomains } from './site-domains.js';

/**
 * Reasons why no design can satisfy a constraint set, found before any search: indices out of range,
 * unknown dye names, scaffolds without room for the dyes at the minimum spacing, pinned sites that
 * clash, energetics that contradict each other. Every check is a necessary condition, so an empty list
 * does not promise a feasible design. Checked with dyes.count.min dyes: fewer dyes only drop limits.
 */
export function precheckConstraints(c: ConstraintSet): PrecheckReason[] {
  const indices = checkIndices(c);
  const geometry = checkGeometry(c);
  // The energy check assumes the indices and names are sound; with index reasons it would only repeat them.
  return [...indices, ...geometry, ...(indices.length > 0 ? [] : checkEnergy(c))];
}

/** precheckConstraints, plus what the objective asks of the constraint set. */
export function precheck(c: ConstraintSet, o: Objective): PrecheckReason[] {
  const reasons = precheckConstraints(c);
  const n = c.dyes.count.min;
  if (o.excitation.kind === 'site' && o.excitation.site >= n) {
    reasons.push({
      in: 'objective',
      path: '/excitation/site',
      message: `excitation.site is ${o.excitation.site}, but the constraint set's dyes.count${c.dyes.count.min === c.dyes.count.max ? '' : '.min'} is ${n}, so there are only sites 0 to ${n - 1}.`,
    });
  }
  if (o.model.kind === 'forster') {
    const usable = new Set(siteDomains(c, n).flatMap((d) => (d.choice.kind === 'dyes' ? d.choice.names : [d.choice.like])));
    const dyes = c.palette.filter((d) => usable.has(d.name));
    if (dyes.length > 0 && dyes.every((d) => d.reorganization === 0)) {
      reasons.push({
        in: 'objective',
        path: '/model/kind',
        message: `model.kind is forster, whose line shape needs a reorganization energy, but every dye the constraint set allows (${dyes.map((d) => d.name).join(', ')}) has reorganization 0 in the palette.`,
      });
    }
  }
  return reasons;
}
