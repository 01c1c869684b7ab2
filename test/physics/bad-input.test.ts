import { describe, expect, it } from 'vitest';
import { InputError, ModelError } from '../../src/errors.js';
import { buildSystem, systemFromHamiltonian } from '../../src/physics/hamiltonian.js';
import { evaluateTransport } from '../../src/physics/transport.js';
import type { Site } from '../../src/physics/types.js';

const dye = (x: number, over: Partial<Site> = {}): Site => ({ position: [x, 0, 0], direction: [0, 0, 1], dipole: 8, energy: 15500, ...over });

describe('bad input gives a typed error naming the problem (never a silent NaN)', () => {
  it('non-finite numbers', () => {
    expect(() => buildSystem([dye(0, { energy: NaN }), dye(2)])).toThrow(/site 1 energy must be a finite number/);
    expect(() => buildSystem([dye(0), dye(Infinity)])).toThrow(InputError);
    expect(() => systemFromHamiltonian([[0, NaN], [NaN, 1]], { traps: [1] })).toThrow(/Hamiltonian entry \(1, 2\)/);
  });
  it('zero dipoles, zero directions, two sites at the same place', () => {
    expect(() => buildSystem([dye(0, { dipole: 0 }), dye(2)])).toThrow(/dipole strength must be positive/);
    expect(() => buildSystem([dye(0, { direction: [0, 0, 0] }), dye(2)])).toThrow(/direction must be a finite non-zero vector/);
    expect(() => buildSystem([dye(1), dye(1)])).toThrow(/cannot share a place/);
  });
  it('negative rates, a non-symmetric Hamiltonian, a trap out of range', () => {
    const H = [[0, 50], [50, 100]];
    expect(() => systemFromHamiltonian(H, { traps: [1], lossRate: -1 })).toThrow(/loss rate must not be negative/);
    expect(() => evaluateTransport(systemFromHamiltonian(H, { traps: [1] }), { model: 'hsr', dephasing: -3 })).toThrow(/dephasing rate must not be negative/);
    expect(() => evaluateTransport(systemFromHamiltonian(H, { traps: [1] }), { model: 'hsr', trapRate: -1 })).toThrow(/trap rate of site 2 must not be negative/);
    expect(() => systemFromHamiltonian([[0, 50], [40, 100]], { traps: [1] })).toThrow(/not symmetric: entry \(1, 2\) is 50 but \(2, 1\) is 40/);
    expect(() => systemFromHamiltonian(H, { traps: [2] })).toThrow(/trap site 3 is out of range: sites are numbered 1 to 2/);
  });
  it('an excitation that can never leave (no loss, trap unreachable)', () => {
    const H = [[0, 50, 0], [50, 100, 0], [0, 0, 30]];
    const sys = systemFromHamiltonian(H, { traps: [2], lossRate: 0, reorganization: 40 });
    for (const model of ['hsr', 'redfield', 'forster'] as const) {
      expect(() => evaluateTransport(sys, { model, start: { kind: 'site', site: 0 } })).toThrow(ModelError);
      expect(() => evaluateTransport(sys, { model, start: { kind: 'site', site: 0 } })).toThrow(/sites 1, 2 hold initial population but are not connected to a trap/);
    }
  });
  it('unknown models and unknown options list what is known', () => {
    const sys = systemFromHamiltonian([[0, 50], [50, 100]], { traps: [1] });
    expect(() => evaluateTransport(sys, { model: 'magic' as never })).toThrow(/unknown transport model 'magic' \(available: hsr, redfield, forster\)/);
    expect(() => evaluateTransport(sys, { dephase: 3 } as never)).toThrow(/unknown option 'dephase'/);
  });
  it('forster without reorganization energy', () => {
    const sys = systemFromHamiltonian([[0, 50], [50, 100]], { traps: [1], reorganization: 0 });
    expect(() => evaluateTransport(sys, { model: 'forster' })).toThrow(/forster needs a reorganization energy above zero/);
  });
});
