/** Design records for the output tests: a fixed small one and seeded random ones. */
import type { DesignRecord } from '../../src/output/record.js';
import type { Site } from '../../src/physics/types.js';
import { randomUnit, rng } from '../helpers/random.js';

/** Three invented dyes in a row, the last one the trap, on a two-helix lattice. */
export function smallRecord(): DesignRecord {
  const site = (x: number, energy: number, label?: string): Site => ({
    position: [x, 0.25, -0.5], direction: [1, 1, 0], dipole: 10, energy, reorganization: 200, lifetime: 1500, length: 1.2, ...(label ? { label } : {}),
  });
  return {
    name: 'small, "quoted" wire',
    sites: [site(0, 18000, 'first donor'), site(1.5, 17500), { position: [3, 0, 0], direction: [0, 0, 2], dipole: 12, energy: 16000 }],
    traps: [2],
    dyes: ['Tessin-555', 'Tessin-590', 'Morvane-630'],
    anchors: [{ index: 3, helix: 0, step: 3 }, { index: 7, helix: 0, step: 7 }, { index: 24, helix: 1, step: 3 }],
    metrics: { efficiency: 0.875, transfer_time: 42.5 },
    score: 0.8,
    provenance: { runId: 'run-1', rank: 2, seed: 12345, toolVersion: '0.1.0' },
  };
}

/** A random record: n dyes in a box of `size` nm centred at the origin, random directions and energies. */
export function randomRecord(seed: number, n: number, size = 20): DesignRecord {
  const r = rng(seed);
  const sites: Site[] = Array.from({ length: n }, () => ({
    position: [size * (r() - 0.5), size * (r() - 0.5), size * (r() - 0.5)],
    direction: randomUnit(r),
    dipole: 1 + 20 * r(),
    energy: 15000 + 5000 * r(),
    ...(r() < 0.7 ? { length: 0.2 + 2 * r() } : {}),
  }));
  return {
    name: `random-${seed}`,
    sites,
    traps: [Math.floor(r() * n)],
    dyes: sites.map((_, i) => ['Aurelin-520', 'Tessin-555', 'Tessin-590', 'Morvane-630'][i % 4]),
  };
}
