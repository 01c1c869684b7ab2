/** CSV tables of designs: the site table, the anchor map for ordering labelled strands, and a ranking. */
import { METRIC_NAMES } from '../metrics/evaluate.js';
import { unit } from '../physics/couplings.js';
import { InputError } from '../errors.js';
import { formatCsv, type Cell } from './rfc4180.js';
import { designToJson } from './design-json.js';
import { siteRoles, type DesignRecord } from './record.js';

export const SITE_TABLE_COLUMNS = [
  'id', 'dye', 'role', 'x_nm', 'y_nm', 'z_nm', 'ux', 'uy', 'uz', 'energy_cm', 'dipole_D', 'reorganization_cm', 'lifetime_ps', 'anchor', 'helix', 'step',
] as const;

export const ANCHOR_MAP_COLUMNS = ['site', 'dye', 'anchor', 'helix', 'step'] as const;

function checked(record: DesignRecord, what: string): DesignRecord {
  designToJson(record, { label: `${what} of "${String(record?.name)}"` });
  return record;
}

/**
 * One row per dye: 1-based id, dye, role, centre (nm), unit dipole direction, energy (cm^-1), dipole (D),
 * reorganization (cm^-1), lifetime (ps), anchor, helix, step (0-based, empty when not on an anchor scaffold).
 */
export function siteTableCsv(record: DesignRecord): string {
  const r = checked(record, 'site table');
  const roles = siteRoles(r);
  const rows = r.sites.map((s, i): Cell[] => {
    const u = unit(s.direction, `site ${i + 1} direction`);
    const a = r.anchors?.[i];
    return [i + 1, r.dyes[i], roles[i], ...s.position, ...u, s.energy, s.dipole, s.reorganization, s.lifetime, a?.index, a?.helix, a?.step];
  });
  return formatCsv(SITE_TABLE_COLUMNS, rows);
}

/**
 * The anchor map of a design on an anchor scaffold (a helix lattice or an anchor list), sorted by anchor:
 * which dye goes on which anchor (helix and step on a lattice, numbered from 0 as in the constraint set).
 */
export function anchorMapCsv(record: DesignRecord): string {
  const r = checked(record, 'anchor map');
  const anchors = r.anchors;
  if (anchors === undefined) throw new InputError(`design "${r.name}" has no anchors: an anchor map needs a design on an anchor scaffold (anchors or helix_lattice)`);
  const rows = anchors.map((a, i): Cell[] => [i + 1, r.dyes[i], a.index, a.helix, a.step]);
  rows.sort((p, q) => (p[2] as number) - (q[2] as number));
  return formatCsv(ANCHOR_MAP_COLUMNS, rows);
}

/**
 * A ranking of records in the order given: rank (1-based position), name, score, then one column per
 * metric that any record has (the known metrics in METRIC_NAMES order, then others alphabetically);
 * a value a record lacks is an empty field.
 */
export function rankingCsv(records: readonly DesignRecord[]): string {
  records.forEach((r, k) => checked(r, `ranking row ${k + 1}`));
  const present = new Set(records.flatMap((r) => Object.keys(r.metrics ?? {})));
  const known: string[] = METRIC_NAMES.filter((m) => present.has(m));
  const others = [...present].filter((m) => !known.includes(m)).sort();
  const metrics = [...known, ...others];
  const rows = records.map((r, k): Cell[] => [k + 1, r.name, r.score, ...metrics.map((m) => r.metrics?.[m])]);
  return formatCsv(['rank', 'name', 'score', ...metrics], rows);
}
