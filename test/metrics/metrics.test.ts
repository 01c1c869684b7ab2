import { describe, expect, it } from 'vitest';
import { KB_CM_PER_K } from '../../src/physics/constants.js';
import { forsterRate } from '../../src/physics/models/forster.js';
import { makeEnsemble } from '../../src/metrics/disorder.js';
import { computeMetrics, designSystem, type Design, type MetricSettings } from '../../src/metrics/evaluate.js';
import { quantile } from '../../src/metrics/stats.js';
import { lowestDonorExciton, uphillEfficiency, uphillMaxStep, withTrapStep } from '../../src/metrics/uphill.js';
import { transportOptions } from '../../src/physics/transport.js';

const pair = (r: number, dE: number): Design => ({
  sites: [
    { position: [0, 0, 0], direction: [0, 0, 1], dipole: 6, energy: 16000, reorganization: 150, lifetime: 2000 },
    { position: [r, 0, 0], direction: [0, 0, 1], dipole: 6, energy: 16000 + dE, reorganization: 150, lifetime: 2000 },
  ],
  traps: [1],
});
const settings = (over: Partial<MetricSettings> = {}): MetricSettings => ({
  transport: { model: 'forster', temperature: 295, trapRate: 5, start: { kind: 'site', site: 0 } },
  system: { couplingMethod: 'point-dipole' },
  shareThreshold: 0.5,
  uphill: { step: 100, threshold: 0.5, limit: 2000 },
  baselineTemperature: 295,
  ...over,
});

/** Exact efficiency of D <-> A with A trapped at kT, both decaying at kL (two-state kinetics, worked by hand). */
function twoState(kf: number, kb: number, kT: number, kL: number): number {
  const XD = 1 / (kf + kL - (kb * kf) / (kb + kT + kL));
  return kT * ((kf * XD) / (kb + kT + kL));
}

describe('metrics of a donor-acceptor pair worked by hand', () => {
  it('efficiency follows the Foerster rate and the two-state kinetics (IUPAC Gold Book, FRET efficiency)', () => {
    const d = pair(3, -300);
    const J = designSystem(d, settings()).hamiltonian[1];
    const kT = KB_CM_PER_K * 295;
    const kf = forsterRate(J, -300, 300, kT), kb = forsterRate(J, 300, 300, kT);
    expect(kb / kf).toBeCloseTo(Math.exp(-300 / kT), 12); // detailed balance
    const m = computeMetrics(d, settings(), ['efficiency', 'transfer_time']);
    expect(m.values.efficiency).toBeCloseTo(twoState(kf, kb, 5, 1 / 2000), 12);
    expect(m.values.transfer_time).toBeGreaterThan(0);
  });
  it('uphill step: trap s above the donor, forward rate slowed by exp(-s/kT) against the downhill one (detailed balance)', () => {
    const d = pair(2.5, 0);
    const s = settings();
    const sys = designSystem(d, s);
    expect(lowestDonorExciton(sys)).toBe(16000);
    const t = transportOptions(s.transport);
    const kT = KB_CM_PER_K * 295;
    for (const step of [0, 100, 300, 600]) {
      const J = sys.hamiltonian[1];
      const up = forsterRate(J, step, 300, kT), down = forsterRate(J, -step, 300, kT);
      expect(up / down).toBeCloseTo(Math.exp(-step / kT), 12);
      expect(uphillEfficiency(sys, t, step)).toBeCloseTo(twoState(up, down, 5, 1 / 2000), 12);
    }
    const max = uphillMaxStep(sys, t, 0.5, 2000);
    expect(uphillEfficiency(sys, t, max)).toBeGreaterThanOrEqual(0.5);
    expect(uphillEfficiency(sys, t, max + 0.5)).toBeLessThan(0.5);
    expect(withTrapStep(sys, 250).hamiltonian[3]).toBe(16250);
  });
  it('refuses uphill metrics under hsr (infinite temperature)', () => {
    expect(() => computeMetrics(pair(2, 0), settings({ transport: { model: 'hsr' } }), ['uphill_efficiency'])).toThrow(/finite-temperature model/);
  });
  it('coherence gain is zero for forster itself and the difference to forster otherwise', () => {
    const d = pair(1.5, -200);
    expect(computeMetrics(d, settings(), ['coherence_gain']).values.coherence_gain).toBe(0);
    const red = settings({ transport: { model: 'redfield', temperature: 295, cutoff: 100, trapRate: 5, start: { kind: 'site', site: 0 } } });
    const a = computeMetrics(d, red, ['efficiency', 'coherence_gain']).values;
    const f = computeMetrics(d, settings(), ['efficiency']).values;
    expect(a.coherence_gain).toBeCloseTo(a.efficiency! - f.efficiency!, 14);
  });
});

describe('robustness over static disorder', () => {
  it('uses the same draws for every candidate (common random numbers) and reduces to the efficiency without disorder', () => {
    const d = pair(2.5, -300);
    const none = settings({ disorder: makeEnsemble({ energySigma: 0, positionJitter: 0, orientationJitter: 0, samples: 5, seed: 3 }, 2) });
    const eta = computeMetrics(d, none, ['efficiency']).values.efficiency!;
    const r0 = computeMetrics(d, none, ['robust_mean', 'robust_p10', 'robust_share']).values;
    expect(r0.robust_mean).toBeCloseTo(eta, 14);
    expect(r0.robust_p10).toBeCloseTo(eta, 14);
    const ens = makeEnsemble({ energySigma: 150, positionJitter: 0.2, orientationJitter: 15, samples: 40, seed: 9 }, 2);
    const a = computeMetrics(d, settings({ disorder: ens }), ['robust_mean', 'robust_p10']).values;
    const b = computeMetrics(d, settings({ disorder: ens }), ['robust_mean', 'robust_p10']).values;
    expect(a).toEqual(b);
    expect(a.robust_mean).not.toBeCloseTo(r0.robust_mean!, 3); // the disorder does change the efficiency
  });
  it('quantile is the linear-interpolation (type 7) estimator, numpy.percentile\'s default (Hyndman and Fan 1996)', () => {
    expect(quantile([5, 1, 4, 2, 3], 0.1)).toBeCloseTo(1.4, 14);
    expect(quantile([1, 2, 3, 4], 0.5)).toBe(2.5);
  });
});
