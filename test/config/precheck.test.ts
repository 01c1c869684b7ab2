import { describe, expect, it } from 'vitest';
import { parse } from 'yaml';
import type { ConstraintSet } from '../../src/config/constraints-types.js';
import { loadConfigFile, parseConfigText } from '../../src/config/load.js';
import { precheck, precheckConstraints } from '../../src/config/precheck/precheck.js';
import { merged, MINIMAL_CONSTRAINTS, MINIMAL_OBJECTIVE, repoFile } from './helpers.js';

const BASE = parse(MINIMAL_CONSTRAINTS) as Record<string, unknown>;
/** The minimal constraint set with changes merged in, loaded (validated, defaults applied). */
const make = (override: Record<string, unknown>): ConstraintSet => parseConfigText(JSON.stringify(merged(BASE, override)), 'constraints');
const objective = (override: Record<string, unknown> = {}) =>
  parseConfigText(JSON.stringify(merged(parse(MINIMAL_OBJECTIVE) as Record<string, unknown>, override)), 'objective');
const paths = (c: ConstraintSet) => precheckConstraints(c).map((r) => r.path);
const line = (n: number, step: number) => [...Array(n).keys()].map((i) => ({ x: step * i, y: 0, z: 0 }));

describe('precheck passes what can be satisfied', () => {
  it('passes the demo constraint set with both demo objectives', () => {
    const c = loadConfigFile(repoFile('constraints/demo-helix.yaml'), 'constraints');
    expect(precheck(c, loadConfigFile(repoFile('objectives/demo-robust.yaml'), 'objective'))).toEqual([]);
    expect(precheck(c, loadConfigFile(repoFile('objectives/demo-uphill.yaml'), 'objective'))).toEqual([]);
  });

  it('passes the minimal set, and a set whose limits are just met', () => {
    expect(precheck(make({}), objective())).toEqual([]);
    // DyeA 18000 and DyeB 17000 cm^-1: trap DyeB 1000 below donor DyeA, consecutive steps of 1000.
    const tight = make({ fixed: [{ site: 2, dye: 'DyeB' }], energetics: { rules: [{ sites: 'donors', dyes: ['DyeA'] }], max_step: 1000, max_span: 1000, trap_offset: { min: -1000, max: -1000 } } });
    expect(precheckConstraints(tight)).toEqual([]);
  });
});

describe('precheck names what cannot be satisfied at all', () => {
  it('a trap index out of range, and a set with no donor', () => {
    const out = precheckConstraints(make({ dyes: { traps: [3] } }));
    expect(out).toMatchObject([{ in: 'constraints', path: '/dyes/traps/0' }]);
    expect(out[0].message).toMatch(/dyes\.traps names site 3, but dyes\.count is 3, so there are only sites 0 to 2/);
    expect(precheckConstraints(make({ dyes: { traps: [0, 1, 2] } }))[0].message).toMatch(/every one of the 3 dyes a trap/);
    expect(paths(make({ dyes: { count: { min: 2, max: 4 }, traps: [2] } }))).toEqual(['/dyes/traps/0']);
  });

  it('fixed sites and rule sites out of range', () => {
    expect(paths(make({ fixed: [{ site: 5, dye: 'DyeA' }] }))).toEqual(['/fixed/0/site']);
    expect(paths(make({ energetics: { rules: [{ sites: [0, 7], dyes: ['DyeA'] }] } }))).toEqual(['/energetics/rules/0/sites']);
  });

  it('palette names that do not exist', () => {
    const c = make({ fixed: [{ site: 2, dye: 'Nope' }], energetics: { rules: [{ sites: 'donors', dyes: ['DyeA', 'Gone'] }, { sites: [1], range: { min: 17000, max: 17500, like: 'Lost' } }] } });
    const out = precheckConstraints(c);
    expect(out.map((r) => r.path)).toEqual(['/energetics/rules/0/dyes/1', '/energetics/rules/1/range/like', '/fixed/0/dye']);
    expect(out[0].message).toBe('energetics.rules[0].dyes[1] names the dye "Gone", which is not in the palette (DyeA, DyeB).');
  });

  it('more dyes than a free region holds at the minimum spacing', () => {
    const out = precheckConstraints(make({ dyes: { count: 100 }, scaffold: { kind: 'sphere', radius: 1, size: undefined } }));
    expect(out).toMatchObject([{ path: '/dyes/count' }]);
    expect(out[0].message).toMatch(/asks for 100 dyes, but the scaffold, a sphere of radius 1 nm, holds at most \d+ dyes kept spacing\.min = 1 nm apart/);
    // A line 3 nm long holds 4 dyes 1 nm apart and not 5.
    const rod = { kind: 'cylinder', radius: 0, length: 3, size: undefined };
    expect(paths(make({ dyes: { count: 4 }, scaffold: rod }))).toEqual([]);
    expect(paths(make({ dyes: { count: 5 }, scaffold: rod }))).toEqual(['/dyes/count']);
  });

  it('fewer anchors than dyes, and anchors too close for the spacing', () => {
    const anchors = (points: object[], linker = 0) => ({ scaffold: { kind: 'anchors', anchors: points, linker: { length: linker }, size: undefined } });
    expect(precheckConstraints(make({ dyes: { count: 4 }, ...anchors(line(3, 2)) }))[0].message).toMatch(/only 3 anchor points/);
    // Ten anchors 0.3 nm apart: three can be 1 nm apart (0, 1.2, 2.4 nm), not four.
    expect(paths(make({ dyes: { count: 3 }, ...anchors(line(10, 0.3)) }))).toEqual([]);
    const four = precheckConstraints(make({ dyes: { count: 4, traps: [0] }, ...anchors(line(10, 0.3)) }));
    expect(four).toMatchObject([{ path: '/dyes/count' }]);
    expect(four[0].message).toMatch(/no 4 anchors of the scaffold are at least 1 nm apart/);
    // A 0.2 nm linker lets dyes on anchors 0.6 nm apart reach 1 nm: five fit, six do not.
    expect(paths(make({ dyes: { count: 5, traps: [0] }, ...anchors(line(10, 0.3), 0.2) }))).toEqual([]);
    expect(paths(make({ dyes: { count: 6, traps: [0] }, ...anchors(line(10, 0.3), 0.2) }))).toEqual(['/dyes/count']);
  });

  it('a helical lattice with zero steps, or with overlapping helices', () => {
    const helix = (extra: object) => ({ scaffold: { kind: 'helix_lattice', steps: 10, size: undefined, ...extra } });
    expect(precheckConstraints(make(helix({ steps: 0 })))).toMatchObject([{ path: '/scaffold/steps', message: expect.stringMatching(/no anchor points/) }]);
    expect(paths(make(helix({ helices: 2, spacing: 1.5 })))).toEqual(['/scaffold/spacing']);
    expect(paths(make(helix({ helices: 2, spacing: 2.0 })))).toEqual([]);
  });

  it('pinned sites that cannot be placed', () => {
    const anchorSet = { scaffold: { kind: 'anchors', anchors: line(4, 2), linker: { length: 0.1 }, size: undefined } };
    expect(paths(make({ ...anchorSet, fixed: [{ site: 0, anchor: 4 }] }))).toEqual(['/fixed/0/anchor']);
    expect(paths(make({ ...anchorSet, fixed: [{ site: 0, anchor: 1 }, { site: 1, anchor: 1 }] }))).toEqual(['/fixed/1/anchor']);
    expect(paths(make({ ...anchorSet, fixed: [{ site: 0, anchor: 1, position: { x: 2, y: 0.5, z: 0 } }] }))).toEqual(['/fixed/0/position']);
    expect(paths(make({ fixed: [{ site: 0, anchor: 0 }] }))).toEqual(['/fixed/0/anchor']);
    expect(paths(make({ fixed: [{ site: 0, position: { x: 3, y: 0, z: 0 } }] }))).toEqual(['/fixed/0/position']);
    const close = make({ fixed: [{ site: 0, position: { x: 0, y: 0, z: 0 } }, { site: 1, position: { x: 0.5, y: 0, z: 0 } }] });
    expect(precheckConstraints(close)[0].message).toBe('fixed[0] and fixed[1] are 0.5 nm apart, closer than spacing.min (1 nm).');
    const cone = { scaffold: { dipole: { kind: 'cone', axis: { x: 0, y: 0, z: 1 }, half_angle: 30 } } };
    expect(paths(make({ ...cone, fixed: [{ site: 0, direction: { x: 1, y: 0, z: 1 } }] }))).toEqual(['/fixed/0/direction']);
    // A dipole has no sign: pointing along -z is inside a cone around +z.
    expect(paths(make({ ...cone, fixed: [{ site: 0, direction: { x: 0, y: 0.1, z: -1 } }] }))).toEqual([]);
  });

  it('a required trap offset beyond the span or the step limits', () => {
    const span = precheckConstraints(make({ energetics: { max_span: 500, trap_offset: { max: -800 } } }));
    expect(span).toMatchObject([{ path: '/energetics/trap_offset' }]);
    expect(span[0].message).toMatch(/at least 800 cm\^-1 from every donor, more than energetics\.max_span \(500 cm\^-1\)/);
    const step = precheckConstraints(make({ energetics: { max_step: 500, trap_offset: { min: 600 } } }));
    expect(step[0].message).toMatch(/trap site 2 at least 600 cm\^-1 .* site 1, is a donor and energetics\.max_step allows at most 500/);
  });

  it('palette energies that the step limit cannot bridge', () => {
    // Donors can only be DyeA (18000), the trap only DyeB (17000): consecutive sites 1 and 2 differ by 1000 > 600.
    const c = make({ energetics: { rules: [{ sites: 'donors', dyes: ['DyeA'] }, { sites: 'traps', dyes: ['DyeB'] }], max_step: 600 } });
    const out = precheckConstraints(c);
    expect(out).toMatchObject([{ path: '/energetics' }]);
    expect(out[0].message).toMatch(/cannot all hold at once: .*energetics\.max_step: sites 1 and 2 differ by at most 600/);
    expect(out[0].message).toMatch(/energetics\.rules\[0\]: site 1 is at least 18000/);
  });

  it('a continuous range that contradicts the trap offset, through the step limit', () => {
    // Donors (sites 0 and 1) in 17500..18500, the trap (site 2) in 17000..17100: site 1 would have to
    // come within 300 cm^-1 of the trap, i.e. at most 17400.
    const c = make({ energetics: { rules: [{ sites: 'donors', range: { min: 17500, max: 18500, like: 'DyeA' } }, { sites: 'traps', range: { min: 17000, max: 17100, like: 'DyeB' } }], max_step: 300 } });
    expect(paths(c)).toEqual(['/energetics']);
  });

  it('a fixed dye that its site rule does not allow', () => {
    const c = make({ fixed: [{ site: 2, dye: 'DyeA' }], energetics: { rules: [{ sites: 'traps', dyes: ['DyeB'] }] } });
    expect(precheckConstraints(c)).toMatchObject([{ path: '/fixed/0/dye', message: expect.stringMatching(/energetics\.rules\[0\] allows only DyeB at site 2/) }]);
  });

  it('discrete dye choices that all fall outside the window the other limits leave', () => {
    // Site 1 may be DyeA (18000) or DyeC (15000); the trap DyeB (17000) must sit 300 to 700 below every donor,
    // so site 1 must lie in 17300..17700: neither dye fits, though the interval 15000..18000 does.
    const palette = [...(BASE.palette as object[]), { name: 'DyeC', energy: 15000, dipole: 10, reorganization: 200, lifetime: 1000, length: 1 }];
    const c = make({ palette, dyes: { count: 2, traps: [0] }, fixed: [{ site: 0, dye: 'DyeB' }], energetics: { rules: [{ sites: 'donors', dyes: ['DyeA', 'DyeC'] }], trap_offset: { min: -700, max: -300 } } });
    const out = precheckConstraints(c);
    expect(out).toMatchObject([{ path: '/energetics/rules/0' }]);
    expect(out[0].message).toMatch(/site 1 may take only energies 18000, 15000 cm\^-1 .* confine it to 17300 to 17700 cm\^-1/);
  });

  it('an excitation site out of range, and forster without any reorganization energy', () => {
    const out = precheck(make({}), objective({ excitation: { kind: 'site', site: 3 } }));
    expect(out).toMatchObject([{ in: 'objective', path: '/excitation/site' }]);
    const rigid = make({ palette: (BASE.palette as object[]).map((d) => ({ ...d, reorganization: 0 })) });
    expect(precheck(rigid, objective({ model: { kind: 'forster' } }))).toMatchObject([{ in: 'objective', path: '/model/kind' }]);
    expect(precheck(rigid, objective())).toEqual([]);
  });

  it('reports every reason found, not only the first', () => {
    const c = make({ dyes: { count: 50, traps: [60] }, fixed: [{ site: 0, anchor: 0 }], scaffold: { size: { x: 1, y: 1, z: 1 } } });
    expect(paths(c).sort()).toEqual(['/dyes/count', '/dyes/traps/0', '/fixed/0/anchor']);
  });
});
