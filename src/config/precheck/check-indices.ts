import type { ConstraintSet } from '../constraints-types.js';
import { fieldName, type PrecheckReason } from './reason.js';

const reason = (path: string, message: string): PrecheckReason => ({ in: 'constraints', path, message });

/** Site indices out of range, a set with no donor, dye names missing from the palette. */
export function checkIndices(c: ConstraintSet): PrecheckReason[] {
  const reasons: PrecheckReason[] = [];
  const { min, max } = c.dyes.count;
  const sites = min === 1 ? 'only site 0' : `only sites 0 to ${min - 1}`;
  const countText = min === max ? `dyes.count is ${min}` : `dyes.count.min is ${min}`;
  c.dyes.traps.forEach((t, i) => {
    if (t >= min) reasons.push(reason(`/dyes/traps/${i}`, `dyes.traps names site ${t}, but ${countText}, so there are ${sites}.`));
  });
  if (c.dyes.traps.filter((t) => t < min).length >= min) {
    reasons.push(reason('/dyes/traps', `dyes.traps makes every one of the ${min} dyes a trap; at least one donor is needed to absorb and pass on light.`));
  }
  c.fixed.forEach((f, i) => {
    if (f.site >= min) reasons.push(reason(`/fixed/${i}/site`, `fixed[${i}].site is ${f.site}, but ${countText}, so there are ${sites}.`));
  });
  c.energetics.rules.forEach((rule, r) => {
    if (Array.isArray(rule.sites)) {
      for (const s of rule.sites) {
        if (s >= max) reasons.push(reason(`/energetics/rules/${r}/sites`, `energetics.rules[${r}].sites names site ${s}, but at most ${max} dyes are placed (sites 0 to ${max - 1}).`));
      }
    }
  });
  const known = new Set(c.palette.map((d) => d.name));
  const knownText = [...known].join(', ');
  const unknown = (pointer: string, name: string) =>
    reasons.push(reason(pointer, `${fieldName(pointer)} names the dye "${name}", which is not in the palette (${knownText}).`));
  c.energetics.rules.forEach((rule, r) => {
    if ('range' in rule) {
      if (!known.has(rule.range.like)) unknown(`/energetics/rules/${r}/range/like`, rule.range.like);
    } else if (rule.dyes !== 'all') {
      rule.dyes.forEach((d, i) => known.has(d) || unknown(`/energetics/rules/${r}/dyes/${i}`, d));
    }
  });
  c.fixed.forEach((f, i) => {
    if (f.dye !== undefined && !known.has(f.dye)) unknown(`/fixed/${i}/dye`, f.dye);
  });
  return reasons;
}
