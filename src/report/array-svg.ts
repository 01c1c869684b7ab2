/**
 * Picture of an array on its best-fit plane: each dye an arrow along the in-plane part of its transition
 * dipole, coloured by site energy (legend in cm^-1), the trap ringed, couplings |J| above a threshold as
 * lines whose width and opacity grow with |J|. Distances in the plane are true to scale (one nm scale).
 */
import { InputError } from '../errors.js';
import type { MetricSettings } from '../metrics/evaluate.js';
import type { DesignRecord } from '../output/record.js';
import { unit } from '../physics/couplings.js';
import { buildSystem } from '../physics/hamiltonian.js';
import { COUPLING_COLOUR, energyColour, TRAP_COLOUR } from './colour.js';
import { energyLegend } from './legend.js';
import { bestFitPlane, projectDirection, projectPoint } from './plane.js';
import { el, esc, label, svgDocument, text } from './svg.js';
import { niceStep } from './ticks.js';

export interface ArrayPictureOptions {
  /** How couplings are computed (the objective's dipole model and screening); default automatic, vacuum. */
  system?: MetricSettings['system'];
  /** Couplings with |J| at or above this are drawn, cm^-1. Default 20. */
  threshold?: number;
  /** Width and height of the picture, px. Default 720 x 540. */
  width?: number;
  height?: number;
}

export const ARRAY_PICTURE_DEFAULTS = { threshold: 20, width: 720, height: 540 } as const;

/** Median distance from each point to its nearest neighbour (0 for a single point). */
function medianNearest(p: readonly [number, number][]): number {
  if (p.length < 2) return 0;
  const d = p.map((a, i) => Math.min(...p.filter((_, j) => j !== i).map((b) => Math.hypot(a[0] - b[0], a[1] - b[1]))));
  d.sort((x, y) => x - y);
  return d[Math.floor(d.length / 2)];
}

/** The array picture as standalone SVG text. */
export function arraySvg(record: DesignRecord, options: ArrayPictureOptions = {}): string {
  const threshold = options.threshold ?? ARRAY_PICTURE_DEFAULTS.threshold;
  if (!(threshold >= 0)) throw new InputError(`the coupling threshold must be a non-negative number of cm^-1, got ${threshold}`);
  const W = options.width ?? ARRAY_PICTURE_DEFAULTS.width, H = options.height ?? ARRAY_PICTURE_DEFAULTS.height;
  const { sites, traps } = record;
  const sys = buildSystem(sites, { ...options.system, traps });
  const n = sites.length;
  const plane = bestFitPlane(sites.map((s) => s.position));
  const centres = sites.map((s) => projectPoint(plane, s.position));
  const dirs = sites.map((s, i) => projectDirection(plane, unit(s.direction, `site ${i + 1} direction`)));
  const half = 0.4 * (medianNearest(centres) || 1);
  const ends = centres.map((c, i) => [[c[0] - half * dirs[i][0], c[1] - half * dirs[i][1]], [c[0] + half * dirs[i][0], c[1] + half * dirs[i][1]]] as const);
  const xs = ends.flatMap(([a, b]) => [a[0], b[0]]), ys = ends.flatMap(([a, b]) => [a[1], b[1]]);
  const pad = half * 0.8;
  const [x0, x1, y0, y1] = [Math.min(...xs) - pad, Math.max(...xs) + pad, Math.min(...ys) - pad, Math.max(...ys) + pad];
  const box = { left: 20, top: 44, right: W - 140, bottom: H - 64 };
  const scale = Math.min((box.right - box.left) / (x1 - x0), (box.bottom - box.top) / (y1 - y0));
  const ox = box.left + ((box.right - box.left) - scale * (x1 - x0)) / 2, oy = box.top + ((box.bottom - box.top) - scale * (y1 - y0)) / 2;
  const X = (u: number) => ox + (u - x0) * scale, Y = (v: number) => oy + (y1 - v) * scale;
  const energies = sites.map((s) => s.energy);
  const eMin = Math.min(...energies), eMax = Math.max(...energies);

  const pairs: { i: number; j: number; J: number }[] = [];
  for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
    const J = sys.hamiltonian[i * n + j];
    if (Math.abs(J) >= threshold && Math.abs(J) > 0) pairs.push({ i, j, J });
  }
  const jMax = Math.max(0, ...pairs.map((p) => Math.abs(p.J)));
  const couplings = pairs.sort((a, b) => Math.abs(a.J) - Math.abs(b.J)).map(({ i, j, J }) => {
    const f = Math.abs(J) / jMax;
    return el('line', {
      class: 'coupling', 'data-sites': `${i + 1} ${j + 1}`, 'data-coupling': String(J), x1: X(centres[i][0]), y1: Y(centres[i][1]), x2: X(centres[j][0]), y2: Y(centres[j][1]),
      stroke: COUPLING_COLOUR, 'stroke-width': 0.8 + 5 * f, 'stroke-opacity': 0.2 + 0.55 * f, 'stroke-linecap': 'round',
    }, el('title', {}, esc(`coupling J(${i + 1},${j + 1}) = ${label(J)} cm^-1`)));
  });

  const headLen = Math.max(6, Math.min(14, 0.35 * half * scale));
  const dyes = sites.map((s, i) => {
    const [a, b] = ends[i];
    const [ax, ay, bx, by] = [X(a[0]), Y(a[1]), X(b[0]), Y(b[1])];
    const colour = energyColour(s.energy, eMin, eMax);
    const len = Math.hypot(bx - ax, by - ay);
    const parts = [el('circle', { cx: X(centres[i][0]), cy: Y(centres[i][1]), r: 3.2, fill: colour })];
    if (len > 1e-6) {
      const [tx, ty] = [(bx - ax) / len, (by - ay) / len];
      const h = Math.min(headLen, 0.6 * len);
      const [hx, hy] = [bx - tx * h, by - ty * h];
      parts.push(
        el('line', { x1: ax, y1: ay, x2: hx, y2: hy, stroke: colour, 'stroke-width': 3, 'stroke-linecap': 'round' }),
        el('polygon', { points: [[bx, by], [hx - ty * h * 0.45, hy + tx * h * 0.45], [hx + ty * h * 0.45, hy - tx * h * 0.45]].map((q) => q.map((v) => Math.round(v * 100) / 100).join(',')).join(' '), fill: colour }),
      );
    }
    const id = `site ${i + 1}${record.dyes[i] ? ` (${record.dyes[i]})` : ''}`;
    parts.push(el('title', {}, esc(`${id}: site energy ${label(s.energy)} cm^-1, transition dipole ${label(s.dipole)} D, ${traps.includes(i) ? 'trap' : 'donor'}`)));
    if (n <= 60) parts.push(text(X(centres[i][0]) + 6, Y(centres[i][1]) - 6, String(i + 1), { 'font-size': 11, fill: '#333' }));
    return el('g', { class: 'dye', 'data-site': i + 1, 'data-energy': String(s.energy), 'data-colour': colour }, parts);
  });

  const trapMarks = traps.map((t) => {
    const [cx, cy] = [X(centres[t][0]), Y(centres[t][1])];
    const r = Math.max(10, 0.55 * half * scale);
    return el('g', { class: 'trap', 'data-site': t + 1 }, [
      el('circle', { cx, cy, r, fill: 'none', stroke: TRAP_COLOUR, 'stroke-width': 1.6, 'stroke-dasharray': '4 3' }),
      text(cx, cy + r + 13, 'trap', { 'text-anchor': 'middle', 'font-weight': 'bold', fill: TRAP_COLOUR }),
    ]);
  });

  const bar = niceStep((box.right - box.left) / scale, 5);
  const scaleBar = el('g', { class: 'scale-bar' }, [
    el('line', { x1: box.left, y1: H - 44, x2: box.left + bar * scale, y2: H - 44, stroke: '#222', 'stroke-width': 2 }),
    text(box.left + (bar * scale) / 2, H - 50, `${label(bar)} nm`, { 'text-anchor': 'middle' }),
  ]);
  const jNote = pairs.length ? `couplings |J| ≥ ${label(threshold)} cm^-1 as lines (widest ${label(jMax, 3)} cm^-1)` : `no coupling reaches |J| ≥ ${label(threshold)} cm^-1`;
  const caption = [
    text(box.left, H - 24, `Projected on the best-fit plane (principal axes 1 and 2); spread off the plane ${label(plane.spread[2], 2)} nm rms.`, { fill: '#444' }),
    text(box.left, H - 9, `Arrows: in-plane part of each transition dipole; ${jNote}.`, { fill: '#444' }),
  ];
  const title = `${record.name}: ${n} dyes on the best-fit plane`;
  return svgDocument(W, H, title, `${n} dyes, ${traps.length} trap(s); site energies ${label(eMin)} to ${label(eMax)} cm^-1`, [
    text(box.left, 24, title, { 'font-size': 15, 'font-weight': 'bold' }),
    el('g', { class: 'couplings' }, couplings),
    el('g', { class: 'dyes' }, dyes),
    ...trapMarks,
    energyLegend(eMin, eMax, W - 110, box.top + 20, box.bottom - box.top - 60),
    scaleBar,
    ...caption,
  ]);
}
