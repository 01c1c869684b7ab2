import { describe, expect, it } from 'vitest';
import { loadConfigFile } from '../../src/config/load.js';
import { Rng } from '../../src/search/rng.js';
import { designSpace } from '../../src/space/design-space.js';
import { axisAngle, distance } from '../../src/space/geometry.js';
import { DEMO } from '../../src/actions/demo.js';

const constraints = loadConfigFile(DEMO.constraints, 'constraints');
const ds = designSpace(constraints);

describe('design space of the demo constraint set', () => {
  it('round-trips standardized vectors: decode(encode(decode(x))) = decode(x)', () => {
    const rng = Rng.fromSeed(4);
    const x = new Float64Array(ds.space.dim);
    for (let k = 0; k < 50; k++) {
      ds.space.sampleInto(rng, x);
      const p = ds.space.decode(x);
      const again = ds.space.decode(ds.space.encode(p));
      const a = ds.decode(p), b = ds.decode(again);
      expect(b.dyes).toEqual(a.dyes);
      a.sites.forEach((s, i) => {
        s.position.forEach((v, j) => expect(b.sites[i].position[j]).toBeCloseTo(v, 9));
        s.direction.forEach((v, j) => expect(b.sites[i].direction[j]).toBeCloseTo(v, 9));
      });
    }
  });
  it('keeps every dye within its linker of its anchor, its dipole inside the cone, and the acceptor pinned', () => {
    const rng = Rng.fromSeed(5);
    const x = new Float64Array(ds.space.dim);
    const sc = constraints.scaffold as { linker: { length: number }; dipole: { half_angle: number } };
    for (let k = 0; k < 100; k++) {
      ds.space.sampleInto(rng, x);
      const d = ds.decode(ds.space.decode(x));
      d.sites.forEach((s, i) => {
        const a = d.anchors![i];
        expect(distance(s.position, a.position)).toBeLessThanOrEqual(sc.linker.length + 1e-12);
        expect(axisAngle(s.direction, a.frame!.tangent)).toBeLessThanOrEqual((sc.dipole.half_angle * Math.PI) / 180 + 1e-9);
        expect(Math.hypot(...s.direction)).toBeCloseTo(1, 12);
      });
      expect(d.anchors![0].index).toBe(0);
      expect(d.dyes[0]).toBe('Morvane-630');
      expect(d.traps).toEqual([0]);
    }
  });
  it('reports feasibility margins that match the geometry', () => {
    const rng = Rng.fromSeed(6);
    const x = new Float64Array(ds.space.dim);
    ds.space.sampleInto(rng, x);
    const d = ds.decode(ds.space.decode(x));
    let dmin = Infinity;
    for (let i = 0; i < d.sites.length; i++) for (let j = i + 1; j < d.sites.length; j++) dmin = Math.min(dmin, distance(d.sites[i].position, d.sites[j].position));
    const f = ds.feasibility(d);
    expect(f.spacing).toBeCloseTo(dmin - constraints.spacing.min, 12);
    expect(ds.space.violation(ds.space.decode(x)) === 0).toBe(f.spacing >= 0 && f.sharedAnchors === 0 && f.step >= 0 && f.span >= 0 && f.trapOffset >= 0);
  });
});
