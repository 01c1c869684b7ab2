/** HTML pieces of the report: key-value summary, collapsible config blocks, the ranking table, parameter lists. */
import { METRIC_NAMES } from '../metrics/evaluate.js';
import type { DesignRecord } from '../output/record.js';
import type { ModelParameter } from './dynamics.js';
import { esc, label } from './svg.js';

/** Units of the metrics and margins in files (snake_case names). */
export const METRIC_UNITS: Readonly<Record<string, string>> = {
  transfer_time: 'ps', uphill_max_step: 'cm^-1', spacing_margin_nm: 'nm', step_margin_cm: 'cm^-1', span_margin_cm: 'cm^-1', trap_offset_margin_cm: 'cm^-1',
};

const cell = (x: number | string | undefined) =>
  x === undefined ? '<td></td>' : typeof x === 'number' ? `<td class="num">${esc(Number.isFinite(x) ? label(x, 5) : String(x))}</td>` : `<td>${esc(x)}</td>`;

/** A two-column table of labelled values. */
export function summaryTable(rows: readonly (readonly [string, string])[]): string {
  return `<table class="summary">${rows.map(([k, v]) => `<tr><th scope="row">${esc(k)}</th><td>${esc(v)}</td></tr>`).join('')}</table>`;
}

/** A collapsible block of preformatted text. */
export function collapsible(heading: string, detail: string, body: string, open = false): string {
  return `<details${open ? ' open' : ''}><summary>${esc(heading)} <span class="tag">${esc(detail)}</span></summary><pre>${esc(body)}</pre></details>`;
}

/** Metric columns present in any record: the known metrics in METRIC_NAMES order, then the others alphabetically. */
export function metricColumns(records: readonly DesignRecord[]): string[] {
  const present = new Set(records.flatMap((r) => Object.keys(r.metrics ?? {})));
  const known: string[] = METRIC_NAMES.filter((m) => present.has(m));
  return [...known, ...[...present].filter((m) => !known.includes(m)).sort()];
}

/** The ranked designs with score, number of dyes and every metric. */
export function rankingTable(records: readonly DesignRecord[], scoreMetrics: readonly string[]): string {
  const metrics = metricColumns(records);
  const head = ['rank', 'design', 'dyes', 'score', ...metrics.map((m) => (METRIC_UNITS[m] ? `${m} (${METRIC_UNITS[m]})` : m))];
  const mark = (m: string) => (scoreMetrics.includes(m) ? ' class="tag objective" title="used by the objective"' : '');
  const th = head.map((h, k) => (k >= 4 ? `<th><span${mark(metrics[k - 4])}>${esc(h)}</span></th>` : `<th>${esc(h)}</th>`)).join('');
  const rows = records.map((r, k) => `<tr>${[k + 1, r.name, r.sites.length, r.score, ...metrics.map((m) => r.metrics?.[m])].map(cell).join('')}</tr>`);
  return `<div class="scroll"><table class="ranking"><thead><tr>${th}</tr></thead><tbody>${rows.join('')}</tbody></table></div>`;
}

/** The parameters of a transport model and where each comes from. */
export function parameterTable(parameters: readonly ModelParameter[]): string {
  const source = { objective: 'from the objective', default: 'default', dyes: 'from the dyes' } as const;
  const rows = parameters.map((p) => `<tr><td>${esc(p.name)}</td><td>${esc(p.value)}</td><td><span class="tag${p.source === 'objective' ? ' objective' : ''}">${source[p.source]}</span></td></tr>`);
  return `<table class="parameters"><thead><tr><th>parameter</th><th>value</th><th>source</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}
