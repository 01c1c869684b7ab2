/**
 * The self-contained HTML run report: one file, every library inlined, the data in a JSON block, a Content
 * Security Policy that allows no network access at all.
 */
import type { TopLevelSpec } from 'vega-lite';
import type { DesignRecord } from '../output/record.js';
import type { ModelParameter } from './dynamics.js';
import type { InlineLibrary } from './libraries.js';
import { PAGE_SCRIPT } from './page-script.js';
import { collapsible, parameterTable, rankingTable, summaryTable } from './sections.js';
import { REPORT_CSS } from './style.js';
import { esc } from './svg.js';

export interface ReportChart {
  readonly id: string;
  readonly heading: string;
  /** Caption (plain text). */
  readonly caption: string;
  readonly spec?: TopLevelSpec;
  /** Shown instead of the chart when there is none (plain text). */
  readonly missing?: string;
}

export interface ReportDynamics extends ReportChart {
  readonly parameters: readonly ModelParameter[];
}

/** A dye of the 3-D view: residue number, centre atom name, colour, label and label position (Å). */
export interface ViewerSite {
  readonly id: number;
  readonly centre: string;
  readonly colour: string;
  readonly trap: boolean;
  readonly label: string;
  readonly at: { readonly x: number; readonly y: number; readonly z: number };
}

export interface ReportContent {
  readonly title: string;
  readonly subtitle: string;
  readonly summary: readonly (readonly [string, string])[];
  readonly configs: readonly { readonly heading: string; readonly detail: string; readonly text: string }[];
  readonly ranked: readonly DesignRecord[];
  /** Metrics the objective scores (highlighted in the table). */
  readonly scoreMetrics: readonly string[];
  readonly pictures: readonly { readonly id: string; readonly heading: string; readonly caption: string; readonly svg: string }[];
  readonly searchCharts: readonly ReportChart[];
  readonly dynamics: readonly ReportDynamics[];
  readonly viewer: { readonly pdb: string; readonly sites: readonly ViewerSite[]; readonly caption: string } | { readonly missing: string };
  readonly libraries: readonly InlineLibrary[];
  readonly generated: string;
}

/** JSON safe inside a <script> element. */
function jsonScript(value: unknown): string {
  return JSON.stringify(value).replace(/</g, '\\u003c').replace(/\u2028/g, '\\u2028').replace(/\u2029/g, '\\u2029');
}

const CSP = "default-src 'none'; script-src 'unsafe-inline'; style-src 'unsafe-inline'; img-src data: blob:; font-src data:; worker-src blob:";

/** The box a chart is drawn into, or the reason there is no chart. */
function chartBody(c: ReportChart): string {
  return c.spec ? `<div class="chart" id="${esc(c.id)}" role="img" aria-label="${esc(c.heading)}"></div>` : `<p class="note" id="${esc(c.id)}">${esc(c.missing ?? 'not available')}</p>`;
}

function chartFigure(c: ReportChart): string {
  return `<figure><h3>${esc(c.heading)}</h3>${chartBody(c)}<figcaption>${esc(c.caption)}</figcaption></figure>`;
}

function dynamicsFigure(d: ReportDynamics): string {
  return `<figure class="dynamics"><h3>${esc(d.heading)}</h3><div class="side">${chartBody(d)}<div>${parameterTable(d.parameters)}</div></div><figcaption>${esc(d.caption)}</figcaption></figure>`;
}

function pictureFigure(p: ReportContent['pictures'][number]): string {
  const href = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(p.svg)}`;
  return `<figure id="${esc(p.id)}" aria-label="${esc(p.heading)}">${p.svg}<figcaption>${esc(p.caption)} <a class="save" download="${esc(p.id)}.svg" href="${esc(href)}">save SVG</a></figcaption></figure>`;
}

export function reportHtml(c: ReportContent): string {
  const charts = [...c.searchCharts, ...c.dynamics].filter((x) => x.spec).map((x) => ({ id: x.id, spec: x.spec }));
  const viewer = 'pdb' in c.viewer
    ? `<div id="viewer" aria-label="3-D view of the best design"></div><p class="note">${esc(c.viewer.caption)} <button type="button" id="viewer-reset">reset view</button></p>`
    : `<p class="note" id="viewer-missing">${esc(c.viewer.missing)}</p>`;
  const data = { charts, viewer: 'pdb' in c.viewer ? { pdb: c.viewer.pdb, sites: c.viewer.sites } : null };
  return [
    '<!doctype html>',
    '<html lang="en"><head><meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${CSP}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    `<title>${esc(c.title)}</title>`,
    `<style>${REPORT_CSS}</style>`,
    '</head><body>',
    `<header><h1>${esc(c.title)}</h1><p>${esc(c.subtitle)}</p></header>`,
    '<main>',
    `<section id="summary"><h2>Run</h2>${summaryTable(c.summary)}</section>`,
    `<section id="configs"><h2>Constraint set and objective (as resolved, defaults filled in)</h2>${c.configs.map((x) => collapsible(x.heading, x.detail, x.text)).join('')}</section>`,
    `<section id="ranking"><h2>Ranked designs</h2>${rankingTable(c.ranked, c.scoreMetrics)}<p class="note">Highlighted metrics enter the objective. Margins are distances to the constraint limits (negative would be a violation).</p></section>`,
    `<section id="pictures"><h2>Best design</h2><div class="grid">${c.pictures.map(pictureFigure).join('')}</div></section>`,
    `<section id="view3d"><h2>3-D view of the best design</h2>${viewer}</section>`,
    `<section id="search"><h2>Search and robustness</h2><div class="grid">${c.searchCharts.map(chartFigure).join('')}</div></section>`,
    `<section id="dynamics"><h2>Population dynamics of the best design</h2><p class="note">The same design under each transport model; parameters the objective does not set take the stated defaults.</p>${c.dynamics.map(dynamicsFigure).join('')}</section>`,
    '</main>',
    `<footer>Written by lumenfold on ${esc(c.generated)}. Works offline: ${c.libraries.map((l) => `${esc(l.name)} ${esc(l.version)} (${esc(l.license)})`).join(', ')} are inlined with their licences.</footer>`,
    `<script type="application/json" id="lumenfold-data">${jsonScript(data)}</script>`,
    ...c.libraries.map((l) => `<script data-library="${esc(l.name)}">${l.code}</script>`),
    `<script>${PAGE_SCRIPT}</script>`,
    '</body></html>',
    '',
  ].join('\n');
}
