/**
 * Box-constraint handling for CMA-ES by a linear-quadratic transformation: the strategy samples an
 * unbounded genotype y and the candidate is T(y) in [0, 1]. T is the identity inside
 * [MARGIN, 1 - MARGIN], bends quadratically onto the bound within MARGIN of it (so T is continuously
 * differentiable and reaches the bound with zero slope), and is periodic with period 2 (1 + 2 MARGIN)
 * through reflection, so any genotype maps into the box. After the boundary handling of Hansen's
 * pycma package (BoxConstraintsLinQuadTransformation, described here from memory), with a fixed
 * margin for our standardized [0, 1] box.
 */
export const MARGIN = 0.05;

const LOW = -MARGIN;
const HIGH = 1 + MARGIN;
const PERIOD = 2 * (HIGH - LOW);

export function boxTransform(y: number): number {
  if (y >= MARGIN && y <= 1 - MARGIN) return y; // the identity part, by far the most common case
  // Fold y into [LOW, HIGH] by periodicity and reflection.
  let t = (y - LOW) % PERIOD;
  if (t < 0) t += PERIOD;
  let v = t <= PERIOD / 2 ? LOW + t : LOW + (PERIOD - t);
  // Quadratic bends within MARGIN of each bound.
  if (v < MARGIN) v = ((v - LOW) * (v - LOW)) / (4 * MARGIN);
  else if (v > 1 - MARGIN) v = 1 - ((v - HIGH) * (v - HIGH)) / (4 * MARGIN);
  return v;
}
