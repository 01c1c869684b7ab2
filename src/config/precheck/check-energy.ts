import type { ConstraintSet } from '../constraints-types.js';
import { impliedBounds, negativeCycle, type DifferenceEdge } from './difference-constraints.js';
import { fieldName, type PrecheckReason } from './reason.js';
import { siteDomains, type SiteDomain } from './site-domains.js';
import { num } from './vector.js';

interface Label {
  /** JSON pointer of the field that states the limit. */
  field: string;
  text: string;
}

const reason = (path: string, message: string): PrecheckReason => ({ in: 'constraints', path, message });

/** Smallest |x| over [lo, hi]: how far the trap must sit from every donor. */
const smallestMagnitude = (lo: number, hi: number) => (lo > 0 ? lo : hi < 0 ? -hi : 0);

/**
 * Can the first dyes.count.min site energies meet the energetics limits? Fewer sites only drop limits, so
 * if these cannot, no count in the range can. Checks, in order: fixed dyes against the site rules; the
 * trap offset against max_span and max_step (plain sentences); then the whole system as difference
 * constraints with every site relaxed to the interval of its allowed energies, and the discrete palette
 * choices pruned to those intervals until nothing changes. Every check is a necessary condition.
 */
export function checkEnergy(c: ConstraintSet): PrecheckReason[] {
  const n = c.dyes.count.min;
  const traps = c.dyes.traps.filter((t) => t < n);
  const donors = [...Array(n).keys()].filter((i) => !traps.includes(i));
  const energyOf = new Map(c.palette.map((d) => [d.name, d.energy]));
  const domains = siteDomains(c, n);
  const reasons: PrecheckReason[] = [];

  for (const [i, f] of c.fixed.entries()) {
    if (f.dye === undefined || f.site >= n || !energyOf.has(f.dye)) continue;
    const domain = domains[f.site];
    const e = energyOf.get(f.dye)!;
    const allowed = domain.choice.kind === 'dyes' ? domain.choice.names.includes(f.dye) : e >= domain.choice.min && e <= domain.choice.max;
    if (!allowed) {
      const rule = domain.choice.kind === 'dyes' ? `allows only ${domain.choice.names.join(', ') || 'no known dye'}` : `allows only ${num(domain.choice.min)} to ${num(domain.choice.max)} cm^-1`;
      reasons.push(reason(`/fixed/${i}/dye`, `fixed[${i}].dye is ${f.dye} (${num(e)} cm^-1), but ${fieldName(domain.source)} ${rule} at site ${f.site}.`));
    }
    domains[f.site] = { site: f.site, choice: { kind: 'dyes', names: [f.dye] }, source: `/fixed/${i}/dye` };
  }
  const empty = domains.filter((d) => d.choice.kind === 'dyes' && d.choice.names.length === 0);
  if (reasons.length > 0 || empty.length > 0 || traps.length === 0 || donors.length === 0) return reasons;

  const { max_step: step, max_span: span, trap_offset: offset } = c.energetics;
  const lo = offset?.min ?? -Infinity;
  const hi = offset?.max ?? Infinity;
  const need = smallestMagnitude(lo, hi);
  if (span !== undefined && need > span) {
    return [reason('/energetics/trap_offset', `energetics.trap_offset needs every trap at least ${num(need)} cm^-1 from every donor, more than energetics.max_span (${num(span)} cm^-1) allows.`)];
  }
  if (step !== undefined && need > step) {
    const t = traps.find((x) => donors.includes(x - 1) || donors.includes(x + 1));
    if (t !== undefined) {
      const neighbour = donors.includes(t + 1) ? t + 1 : t - 1;
      return [
        reason(
          '/energetics/trap_offset',
          `energetics.trap_offset needs trap site ${t} at least ${num(need)} cm^-1 from every donor, but its neighbour, site ${neighbour}, is a donor and energetics.max_step allows at most ${num(step)} cm^-1 between neighbouring sites.`,
        ),
      ];
    }
  }
  return solveRelaxed(c, domains, energyOf, traps, donors);
}

function solveRelaxed(c: ConstraintSet, domains: SiteDomain[], energyOf: Map<string, number>, traps: number[], donors: number[]): PrecheckReason[] {
  const n = domains.length;
  const zero = n;
  const { max_step: step, max_span: span, trap_offset: offset } = c.energetics;
  const limits: DifferenceEdge<Label>[] = [];
  const add = (from: number, to: number, weight: number, field: string, text: string) => limits.push({ from, to, weight, label: { field, text } });
  if (step !== undefined) {
    for (let i = 0; i + 1 < n; i++) {
      const text = `sites ${i} and ${i + 1} differ by at most ${num(step)} cm^-1`;
      add(i, i + 1, step, '/energetics/max_step', text);
      add(i + 1, i, step, '/energetics/max_step', text);
    }
  }
  if (span !== undefined) {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) if (i !== j) add(i, j, span, '/energetics/max_span', `all site energies lie within ${num(span)} cm^-1`);
  }
  for (const t of traps) {
    for (const d of donors) {
      if (offset?.max !== undefined) add(d, t, offset.max, '/energetics/trap_offset/max', `E(site ${t}) - E(site ${d}) is at most ${num(offset.max)} cm^-1`);
      if (offset?.min !== undefined) add(t, d, -offset.min, '/energetics/trap_offset/min', `E(site ${t}) - E(site ${d}) is at least ${num(offset.min)} cm^-1`);
    }
  }
  const energies = (d: SiteDomain) => (d.choice.kind === 'dyes' ? d.choice.names.map((name) => energyOf.get(name)!) : [d.choice.min, d.choice.max]);
  const allowed = domains.map(energies);
  for (let round = 0; round <= n + 1; round++) {
    const edges = [...limits];
    allowed.forEach((values, i) => {
      const field = domains[i].source;
      edges.push({ from: zero, to: i, weight: Math.max(...values), label: { field, text: `site ${i} is at most ${num(Math.max(...values))} cm^-1` } });
      edges.push({ from: i, to: zero, weight: -Math.min(...values), label: { field, text: `site ${i} is at least ${num(Math.min(...values))} cm^-1` } });
    });
    const cycle = negativeCycle(n + 1, edges);
    if (cycle !== undefined) return [reason('/energetics', describeCycle(cycle))];
    const bounds = impliedBounds(n + 1, edges, zero);
    let pruned = false;
    for (let i = 0; i < n; i++) {
      if (domains[i].choice.kind !== 'dyes') continue;
      const fits = allowed[i].filter((e) => e >= bounds.lo[i] - 1e-6 && e <= bounds.hi[i] + 1e-6);
      if (fits.length === 0) {
        const source = fieldName(domains[i].source === '/palette' ? '/palette' : domains[i].source);
        return [
          reason(
            domains[i].source,
            `site ${i} may take only energies ${allowed[i].map(num).join(', ')} cm^-1 (${source}), but the energetics limits confine it to ${num(bounds.lo[i])} to ${num(bounds.hi[i])} cm^-1.`,
          ),
        ];
      }
      if (fits.length < allowed[i].length) {
        allowed[i] = fits;
        pruned = true;
      }
    }
    if (!pruned) return [];
  }
  return [];
}

function describeCycle(cycle: DifferenceEdge<Label>[]): string {
  const byField = new Map<string, string[]>();
  for (const { label } of cycle) {
    const texts = byField.get(label.field) ?? [];
    if (!texts.includes(label.text)) texts.push(label.text);
    byField.set(label.field, texts);
  }
  const parts = [...byField].map(([field, texts]) => `${fieldName(field)}: ${texts.slice(0, 3).join('; ')}${texts.length > 3 ? '; ...' : ''}`);
  return `The energy limits cannot all hold at once: ${parts.join(' | ')}.`;
}
