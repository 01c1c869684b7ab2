import type { ConstraintSet, Dye, DipoleRule, EnergyRule, HelixDipoleRule, SiteSelector } from '../config/constraints-types.js';
import { isAnchorScaffold } from '../config/constraints-types.js';
import { InputError } from '../errors.js';
import { degToRad } from '../physics/constants.js';
import type { Site, Vec3 } from '../physics/types.js';
import { SearchSpace } from '../search/space/space.js';
import { scaffoldAnchors } from '../config/anchors.js';
import { coneDirection, normalize } from './geometry.js';
import { feasibility, type Feasibility } from './feasibility.js';
import { norm3 } from '../physics/norm3.js';

/** An anchor point of a scaffold (nm) with its local frame on a helical lattice. */
export interface Anchor {
  readonly index: number;
  readonly position: Vec3;
  readonly helix?: number;
  readonly step?: number;
  readonly frame?: { readonly axial: Vec3; readonly radial: Vec3; readonly tangent: Vec3 };
}

/** Anchors of an anchor scaffold, as vectors. */
function anchorsOf(c: ConstraintSet): Anchor[] | undefined {
  if (!isAnchorScaffold(c.scaffold)) return undefined;
  return scaffoldAnchors(c.scaffold).map((a) => ({
    index: a.index,
    position: v3(a.position),
    helix: a.helix,
    step: a.step,
    frame: a.frame ? { axial: v3(a.frame.axial), radial: v3(a.frame.radial), tangent: v3(a.frame.tangent) } : undefined,
  }));
}

/** A decoded candidate: the dyes as the physics sees them plus what a chemist needs to build it. */
export interface DesignPoint {
  readonly sites: Site[];
  readonly traps: number[];
  readonly dyes: string[];
  /** Anchor of each site on anchor scaffolds. */
  readonly anchors?: Anchor[];
}

type Point = Record<string, unknown>;

/** The search space of a constraint set: every free choice as a standardized variable. */
export interface DesignSpace {
  readonly space: SearchSpace<Point>;
  readonly constraints: ConstraintSet;
  readonly maxSites: number;
  readonly anchors?: readonly Anchor[];
  decode(point: Point): DesignPoint;
  feasibility(d: DesignPoint): Feasibility;
}

function selects(sel: SiteSelector, site: number, traps: readonly number[]): boolean {
  if (sel === 'all') return true;
  if (sel === 'donors') return !traps.includes(site);
  if (sel === 'traps') return traps.includes(site);
  return sel.includes(site);
}

function dyeByName(c: ConstraintSet, name: string): Dye {
  const d = c.palette.find((p) => p.name === name);
  if (!d) throw new InputError(`dye '${name}' is not in the palette (${c.palette.map((p) => p.name).join(', ')})`);
  return d;
}

function siteFromDye(d: Dye, position: Vec3, direction: Vec3, energy = d.energy): Site {
  return { position, direction, energy, dipole: d.dipole, reorganization: d.reorganization, lifetime: d.lifetime, length: d.length > 0 ? d.length : undefined, label: d.name };
}

const v3 = (p: { x: number; y: number; z: number }): Vec3 => [p.x, p.y, p.z];

/** Build the design space of a constraint set (assumed to have passed the config pre-checks). */
export function designSpace(c: ConstraintSet): DesignSpace {
  const N = c.dyes.count.max;
  const traps = c.dyes.traps;
  const sc = c.scaffold;
  const anchors = anchorsOf(c);
  const s: any = new SearchSpace<Point>();
  if (c.dyes.count.min < c.dyes.count.max) s.integer('count', c.dyes.count.min, c.dyes.count.max);
  // per site: its fixed entry and the names of its variables, looked up once (decode runs for every candidate)
  const fixedOf = Array.from({ length: N }, (_, i) => c.fixed.find((f) => f.site === i));
  const fixed = (i: number) => fixedOf[i];
  const key = (name: string) => Array.from({ length: N }, (_, i) => `${name}_${i}`);
  const paletteNames = c.palette.map((d) => d.name);
  const K = { anchor: key('anchor'), offset: key('offset'), pos: key('pos'), dir: key('dir'), cos: key('cos'), phi: key('phi'), energy: key('energy'), dye: key('dye') };
  const rules: (EnergyRule | undefined)[] = [];
  for (let i = 0; i < N; i++) {
    const f = fixed(i);
    if (anchors && f?.position === undefined && f?.anchor === undefined) s.integer(K.anchor[i], 0, anchors.length - 1);
    const linker = isAnchorScaffold(sc) ? sc.linker.length : 0;
    if (anchors && linker > 0 && f?.position === undefined) s.reals(K.offset[i], 3, -1, 1);
    if (!anchors && f?.position === undefined) s.reals(K.pos[i], 3, 0, 1);
    const rule = sc.dipole;
    if (f?.direction === undefined) {
      if (rule.kind === 'free') s.unitVector(K.dir[i]);
      else { s.real(K.cos[i], Math.cos(degToRad(rule.half_angle)), 1); s.real(K.phi[i], 0, 2 * Math.PI); }
    }
    const er = c.energetics.rules.find((r) => selects(r.sites, i, traps));
    rules.push(er);
    if (f?.dye === undefined) {
      if (!er) throw new InputError(`constraints: no energetics rule covers site ${i}`);
      if ('range' in er) s.real(K.energy[i], er.range.min, er.range.max);
      else {
        const names = er.dyes === 'all' ? c.palette.map((d) => d.name) : er.dyes;
        if (names.length > 1) s.choice(K.dye[i], names);
      }
    }
  }

  const position = (i: number, p: Point): { position: Vec3; anchor?: Anchor } => {
    const f = fixed(i);
    if (f?.position) return { position: v3(f.position) };
    if (anchors) {
      const a = anchors[f?.anchor ?? (p[K.anchor[i]] as number)];
      const L = isAnchorScaffold(sc) ? sc.linker.length : 0;
      if (L === 0) return { position: a.position, anchor: a };
      let o = p[K.offset[i]] as number[];
      const len = norm3(o[0], o[1], o[2]);
      if (len > 1) o = o.map((x) => x / len);
      return { position: [a.position[0] + L * o[0], a.position[1] + L * o[1], a.position[2] + L * o[2]], anchor: a };
    }
    const u = p[K.pos[i]] as number[];
    switch (sc.kind) {
      case 'box': return { position: [(u[0] - 0.5) * sc.size.x, (u[1] - 0.5) * sc.size.y, (u[2] - 0.5) * sc.size.z] };
      case 'slab': return { position: [(u[0] - 0.5) * sc.size.x, (u[1] - 0.5) * sc.size.y, (u[2] - 0.5) * sc.thickness] };
      case 'cylinder': {
        const r = sc.radius * Math.sqrt(u[0]), t = 2 * Math.PI * u[1];
        return { position: [r * Math.cos(t), r * Math.sin(t), (u[2] - 0.5) * sc.length] };
      }
      case 'sphere': {
        // radius by the cube root (uniform in volume), direction from two uniform numbers (Archimedes)
        const r = sc.radius * Math.cbrt(u[0]), z = 2 * u[1] - 1, t = 2 * Math.PI * u[2], q = Math.sqrt(1 - z * z);
        return { position: [r * q * Math.cos(t), r * q * Math.sin(t), r * z] };
      }
      default: throw new InputError(`unsupported scaffold kind`);
    }
  };
  const coneAxis = (rule: DipoleRule | HelixDipoleRule, anchor?: Anchor): Vec3 => {
    if (rule.kind !== 'cone') return [0, 0, 1];
    if (typeof rule.axis === 'string') {
      if (!anchor?.frame) throw new InputError(`constraints: the cone axis '${rule.axis}' needs a helical lattice anchor`);
      return anchor.frame[rule.axis];
    }
    return normalize(v3(rule.axis));
  };

  const decode = (p: Point): DesignPoint => {
    const n = (p.count as number | undefined) ?? N;
    const sites: Site[] = [];
    const dyes: string[] = [];
    const used: Anchor[] = [];
    for (let i = 0; i < n; i++) {
      const f = fixed(i);
      const { position: pos, anchor } = position(i, p);
      if (anchor) used.push(anchor);
      let dir: Vec3;
      if (f?.direction) dir = normalize(v3(f.direction));
      else if (sc.dipole.kind === 'free') dir = p[K.dir[i]] as Vec3;
      else dir = coneDirection(coneAxis(sc.dipole, anchor), p[K.cos[i]] as number, p[K.phi[i]] as number);
      const er = rules[i];
      let dye: Dye;
      let energy: number | undefined;
      if (f?.dye) dye = dyeByName(c, f.dye);
      else if (er && 'range' in er) { dye = dyeByName(c, er.range.like); energy = p[K.energy[i]] as number; }
      else {
        const names = !er || er.dyes === 'all' ? paletteNames : er.dyes;
        dye = dyeByName(c, names.length > 1 ? (p[K.dye[i]] as string) : names[0]);
      }
      sites.push(siteFromDye(dye, pos, dir, energy));
      dyes.push(dye.name);
    }
    return { sites, traps: traps.filter((t) => t < n), dyes, anchors: anchors ? used : undefined };
  };

  // cheap constraints on decoded points, memoized per point object
  const memo = new WeakMap<Point, { d: DesignPoint; f: Feasibility }>();
  const check = (p: Point) => {
    let m = memo.get(p);
    if (!m) {
      const d = decode(p);
      m = { d, f: feasibility(c, d) };
      memo.set(p, m);
    }
    return m.f;
  };
  s.constraint('minimum spacing', (p: Point) => check(p).spacing >= 0, (p: Point) => Math.max(0, -check(p).spacing));
  if (anchors) s.constraint('one dye per anchor', (p: Point) => check(p).sharedAnchors === 0, (p: Point) => check(p).sharedAnchors);
  if (c.energetics.max_step !== undefined) s.constraint('maximum energy step', (p: Point) => check(p).step >= 0, (p: Point) => Math.max(0, -check(p).step) / 100);
  if (c.energetics.max_span !== undefined) s.constraint('maximum energy span', (p: Point) => check(p).span >= 0, (p: Point) => Math.max(0, -check(p).span) / 100);
  if (c.energetics.trap_offset) s.constraint('trap offset', (p: Point) => check(p).trapOffset >= 0, (p: Point) => Math.max(0, -check(p).trapOffset) / 100);
  return { space: s as SearchSpace<Point>, constraints: c, maxSites: N, anchors, decode, feasibility: (d) => feasibility(c, d) };
}

