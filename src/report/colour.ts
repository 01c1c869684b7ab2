/**
 * The colour scale of site energies: low energy red, high energy blue, through orange, gold and green
 * (the order of the colours of light, so a downhill funnel reads from blue to red). Our own stops.
 */
export const ENERGY_STOPS: readonly string[] = ['#a11d33', '#e0702a', '#e3bd2f', '#3f9a5c', '#2c66b8'];

function rgb(hex: string): [number, number, number] {
  return [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16)) as [number, number, number];
}

/** The colour at fraction t in [0, 1] of the scale (clamped). */
export function scaleColour(t: number): string {
  const c = Math.min(1, Math.max(0, Number.isFinite(t) ? t : 0.5)) * (ENERGY_STOPS.length - 1);
  const i = Math.min(ENERGY_STOPS.length - 2, Math.floor(c));
  const a = rgb(ENERGY_STOPS[i]), b = rgb(ENERGY_STOPS[i + 1]);
  const f = c - i;
  return '#' + a.map((v, k) => Math.round(v + (b[k] - v) * f).toString(16).padStart(2, '0')).join('');
}

/** The colour of an energy on a scale from min to max (all one colour, the middle, when min = max). */
export function energyColour(energy: number, min: number, max: number): string {
  return scaleColour(max > min ? (energy - min) / (max - min) : 0.5);
}

/** Colour of the trap marker and of trap labels. */
export const TRAP_COLOUR = '#1d1d1f';
/** Colour of coupling lines. */
export const COUPLING_COLOUR = '#5b6b7f';
