/**
 * Energy-level diagram: the site energies (left column, coloured as in the array picture, the trap marked)
 * beside the exciton energies (right column, eigenvalues of the Hamiltonian) with bar length by oscillator
 * strength relative to the mean monomer. Thin lines join site m and exciton a where |c_ma|^2 >= 0.1.
 */
import type { MetricSettings } from '../metrics/evaluate.js';
import type { DesignRecord } from '../output/record.js';
import { excitons } from '../physics/excitons.js';
import { buildSystem } from '../physics/hamiltonian.js';
import { energyColour, TRAP_COLOUR } from './colour.js';
import { spreadLabels } from './labels.js';
import { el, esc, label, svgDocument, text } from './svg.js';
import { niceTicks } from './ticks.js';

export interface LevelDiagramOptions {
  /** How couplings are computed (the objective's dipole model and screening); default automatic, vacuum. */
  system?: MetricSettings['system'];
  /** Width and height, px. Default 720 x 520. */
  width?: number;
  height?: number;
}

/** Site-exciton pairs with at least this weight |c_ma|^2 are joined by a line. */
export const COMPOSITION_LINE_WEIGHT = 0.1;

export function levelsSvg(record: DesignRecord, options: LevelDiagramOptions = {}): string {
  const W = options.width ?? 720, H = options.height ?? 520;
  const sys = buildSystem(record.sites, { ...options.system, traps: record.traps });
  const ex = excitons(sys);
  const n = sys.n;
  const siteE = record.sites.map((s) => s.energy);
  const exE = Array.from(ex.energies);
  const strength = Array.from(ex.relativeStrengths!);
  const all = [...siteE, ...exE];
  const lo0 = Math.min(...all), hi0 = Math.max(...all);
  const padE = Math.max(20, 0.06 * (hi0 - lo0));
  const lo = lo0 - padE, hi = hi0 + padE;
  const top = 50, bottom = H - 52;
  const Y = (e: number) => top + ((hi - e) / (hi - lo)) * (bottom - top);
  const col = { axis: 78, siteLabel: 88, site0: 250, site1: 330, ex0: 420, exMax: 560, exLabel: 572 };
  const sMin = Math.min(...siteE), sMax = Math.max(...siteE);

  const axis = [el('line', { x1: col.axis, y1: top, x2: col.axis, y2: bottom, stroke: '#333' })];
  for (const t of niceTicks(lo, hi, 7)) {
    axis.push(el('line', { x1: col.axis - 5, y1: Y(t), x2: col.axis, y2: Y(t), stroke: '#333' }), text(col.axis - 8, Y(t) + 4, label(t, 6), { 'text-anchor': 'end' }));
  }
  axis.push(text(18, (top + bottom) / 2, 'energy (cm^-1)', { transform: `rotate(-90 18 ${(top + bottom) / 2})`, 'text-anchor': 'middle' }));

  const lines: string[] = [];
  for (let m = 0; m < n; m++) for (let a = 0; a < n; a++) {
    const w = ex.coefficients[m * n + a] ** 2;
    if (w >= COMPOSITION_LINE_WEIGHT) {
      lines.push(el('line', { x1: col.site1, y1: Y(siteE[m]), x2: col.ex0, y2: Y(exE[a]), stroke: '#7a8796', 'stroke-width': 0.6 + 1.6 * w, 'stroke-opacity': 0.25 + 0.6 * w, 'stroke-dasharray': '3 2' }));
    }
  }

  const siteLabelY = spreadLabels(siteE.map((e) => Y(e) + 4), 13, top, bottom);
  const sites = record.sites.map((s, m) => {
    const trap = record.traps.includes(m);
    const colour = energyColour(s.energy, sMin, sMax);
    const name = `${m + 1} ${record.dyes[m] ?? ''}${trap ? ' · trap' : ''}`.trim();
    return el('g', { class: trap ? 'site-level trap' : 'site-level', 'data-site': m + 1, 'data-energy': String(s.energy) }, [
      el('line', { x1: col.site0, y1: Y(s.energy), x2: col.site1, y2: Y(s.energy), stroke: colour, 'stroke-width': trap ? 5 : 3.5 }),
      el('line', { x1: col.siteLabel + 142, y1: siteLabelY[m] - 4, x2: col.site0 - 2, y2: Y(s.energy), stroke: '#bbb', 'stroke-width': 0.7 }),
      text(col.siteLabel, siteLabelY[m], name, { fill: trap ? TRAP_COLOUR : '#333', 'font-weight': trap ? 'bold' : undefined }),
      el('title', {}, esc(`site ${m + 1}: ${label(s.energy)} cm^-1`)),
    ]);
  });

  const fMax = Math.max(...strength, 1e-12);
  const exLabelY = spreadLabels(exE.map((e) => Y(e) + 4), 13, top, bottom);
  const levels = exE.map((e, a) => {
    const len = 4 + ((col.exMax - col.ex0 - 4) * strength[a]) / fMax;
    return el('g', { class: 'exciton-level', 'data-state': a + 1, 'data-energy': String(e), 'data-strength': String(strength[a]) }, [
      el('line', { x1: col.ex0, y1: Y(e), x2: col.ex0 + len, y2: Y(e), stroke: '#1f2a44', 'stroke-width': 3.5 }),
      text(col.exLabel, exLabelY[a], `${label(e, 6)} · f ${label(strength[a], 2)}`, { fill: '#333' }),
      el('title', {}, esc(`exciton ${a + 1}: ${label(e, 6)} cm^-1, oscillator strength ${label(strength[a], 3)} (mean monomer = 1)`)),
    ]);
  });

  const title = `${record.name}: site and exciton energies`;
  return svgDocument(W, H, title, `${n} site energies and ${n} exciton energies, cm^-1`, [
    text(20, 24, title, { 'font-size': 15, 'font-weight': 'bold' }),
    text((col.site0 + col.site1) / 2, top - 10, 'site energies', { 'text-anchor': 'middle', 'font-weight': 'bold' }),
    text((col.ex0 + col.exMax) / 2, top - 10, 'exciton states', { 'text-anchor': 'middle', 'font-weight': 'bold' }),
    ...axis,
    el('g', { class: 'composition' }, lines),
    el('g', { class: 'sites' }, sites),
    el('g', { class: 'excitons' }, levels),
    text(20, H - 22, `Bar length of an exciton: its oscillator strength f relative to the mean monomer (the f sum to ${n}).`, { fill: '#444', 'font-size': 11 }),
    text(20, H - 8, `Dashed lines join a site to the exciton states holding at least ${COMPOSITION_LINE_WEIGHT * 100}% of it (|c|^2 ≥ ${COMPOSITION_LINE_WEIGHT}).`, { fill: '#444', 'font-size': 11 }),
  ]);
}
