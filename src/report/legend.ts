/** The site-energy colour legend: a vertical bar from the lowest (bottom) to the highest (top) energy, cm^-1. */
import { energyColour } from './colour.js';
import { el, label, text } from './svg.js';
import { niceTicks } from './ticks.js';

/** Number of colour bands in the bar (bands, not a gradient, so that no element needs a document-wide id). */
const BANDS = 48;

export function energyLegend(min: number, max: number, x: number, y: number, height: number, width = 16): string {
  const parts: string[] = [text(x - 4, y - 12, 'site energy (cm^-1)', { 'font-weight': 'bold' })];
  for (let k = 0; k < BANDS; k++) {
    const e = max - ((k + 0.5) / BANDS) * (max - min);
    parts.push(el('rect', { x, y: y + (k * height) / BANDS, width, height: height / BANDS + 0.5, fill: energyColour(e, min, max) }));
  }
  parts.push(el('rect', { x, y, width, height, fill: 'none', stroke: '#444', 'stroke-width': 0.8 }));
  const Y = (e: number) => (max > min ? y + ((max - e) / (max - min)) * height : y + height / 2);
  const ends = max > min ? [max, min] : [min];
  const inner = niceTicks(min, max, 4).filter((t) => max > min && Math.abs(Y(t) - Y(max)) > 14 && Math.abs(Y(t) - Y(min)) > 14);
  for (const e of ends) parts.push(text(x + width + 6, Y(e) + 4, label(e, 6), { class: max === min ? 'legend-min legend-max' : e === max ? 'legend-max' : 'legend-min', 'font-weight': 'bold' }));
  for (const e of inner) {
    parts.push(el('line', { x1: x + width, y1: Y(e), x2: x + width + 4, y2: Y(e), stroke: '#444' }), text(x + width + 6, Y(e) + 4, label(e, 6), { fill: '#555' }));
  }
  return el('g', { class: 'legend', 'data-min': String(min), 'data-max': String(max) }, parts);
}
