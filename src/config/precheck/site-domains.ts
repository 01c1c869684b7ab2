import type { ConstraintSet, SiteSelector } from '../constraints-types.js';

/** What energies one site may take, and which field says so. */
export interface SiteDomain {
  site: number;
  /** Palette dyes the site may take (names present in the palette), or a continuous range in cm^-1. */
  choice: { kind: 'dyes'; names: string[] } | { kind: 'range'; min: number; max: number; like: string };
  /** JSON pointer of the rule that decides the site, or '/palette' when no rule names it. */
  source: string;
}

/** The sites a selector names among n sites (indices outside 0..n-1 are dropped). */
export function selectSites(selector: SiteSelector, n: number, traps: readonly number[]): number[] {
  const all = [...Array(n).keys()];
  if (selector === 'all') return all;
  if (selector === 'traps') return all.filter((i) => traps.includes(i));
  if (selector === 'donors') return all.filter((i) => !traps.includes(i));
  return selector.filter((i) => i < n);
}

/**
 * The choice of each of the first n sites: the last energetics rule that names the site, else any palette
 * dye. Dye names missing from the palette are dropped here (the index checks report them).
 */
export function siteDomains(c: ConstraintSet, n: number): SiteDomain[] {
  const known = new Set(c.palette.map((d) => d.name));
  const domains: SiteDomain[] = [...Array(n).keys()].map((site) => ({
    site,
    choice: { kind: 'dyes', names: [...known] },
    source: '/palette',
  }));
  c.energetics.rules.forEach((rule, r) => {
    for (const site of selectSites(rule.sites, n, c.dyes.traps)) {
      domains[site] =
        'range' in rule
          ? { site, choice: { kind: 'range', min: rule.range.min, max: rule.range.max, like: rule.range.like }, source: `/energetics/rules/${r}` }
          : { site, choice: { kind: 'dyes', names: rule.dyes === 'all' ? [...known] : rule.dyes.filter((d) => known.has(d)) }, source: `/energetics/rules/${r}` };
    }
  });
  return domains;
}
