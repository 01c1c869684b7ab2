import { describe, expect, it } from 'vitest';
import { ModelError, NumericalError } from '../../src/errors.js';
import { makeEnsemble } from '../../src/metrics/disorder.js';
import { computeMetrics, type MetricSettings } from '../../src/metrics/evaluate.js';
import { luFactor } from '../../src/physics/linalg/lu.js';
import { systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { evaluateTransport } from '../../src/physics/transport.js';

const settings = (jitter: number): MetricSettings => ({
  transport: { model: 'hsr', dephasing: 10, trapRate: 1, start: { kind: 'site', site: 0 } },
  system: { couplingMethod: 'point-dipole' },
  disorder: makeEnsemble({ energySigma: 0, positionJitter: jitter, orientationJitter: 0, samples: 200, seed: 2 }, 2),
  shareThreshold: 0.5,
  uphill: { step: 0, threshold: 0.5, limit: 100 },
  baselineTemperature: 295,
});

describe('numerical guards: a clear error or a counted warning, never a NaN', () => {
  it('counts and leaves out disorder samples that push two dyes onto each other', () => {
    // two dyes 0.1 nm apart with 0.05 nm jitter: some samples come closer than the 0.05 nm "same place" limit
    const d = { sites: [0, 0.1].map((x) => ({ position: [x, 0, 0] as const, direction: [0, 0, 1] as const, dipole: 1, energy: 15000, lifetime: 1000 })), traps: [1] };
    const m = computeMetrics(d, settings(0.05), ['robust_mean', 'robust_p10']);
    expect(m.skippedSamples).toBeGreaterThan(0);
    expect(m.skippedSamples).toBeLessThan(200);
    expect(m.warnings[0]).toMatch(/disorder samples put two dyes on top of each other/);
    expect(Number.isFinite(m.values.robust_mean)).toBe(true);
    expect(Number.isFinite(m.values.robust_p10)).toBe(true);
  });
  it('refuses a nominal design whose dyes share a place, naming the sites', () => {
    const tight = { ...settings(0), disorder: makeEnsemble({ energySigma: 0, positionJitter: 0, orientationJitter: 0, samples: 3, seed: 1 }, 2) };
    const same = { sites: [0, 0.01].map((x) => ({ position: [x, 0, 0] as const, direction: [0, 0, 1] as const, dipole: 1, energy: 15000, lifetime: 1000 })), traps: [1] };
    expect(() => computeMetrics(same, tight, ['robust_mean'])).toThrow(/cannot share a place/);
  });
  it('refuses a singular generator with a NumericalError naming the pivot', () => {
    expect(() => luFactor(new Float64Array([1, 2, 2, 4]), 2)).toThrow(NumericalError);
    expect(() => luFactor(new Float64Array([1, 2, 2, 4]), 2)).toThrow(/singular to working precision \(pivot 2 of 2/);
  });
  it('reports an excitation that cannot leave as a ModelError, not a NaN', () => {
    const sys = systemFromHamiltonian([[0, 0], [0, 100]], { traps: [1], lossRate: 0 });
    expect(() => evaluateTransport(sys, { model: 'hsr', start: { kind: 'site', site: 0 } })).toThrow(ModelError);
  });
});
