import { scaffoldAnchors, type AnchorPoint } from '../anchors.js';
import { isAnchorScaffold, type AnchorScaffold, type ConstraintSet, type RegionScaffold, type Vector3 } from '../constraints-types.js';
import { maxDyesInRegion } from './packing-bound.js';
import type { PrecheckReason } from './reason.js';
import { describeRegion, insideRegion } from './region-geometry.js';
import { spreadSubset } from './spread-subset.js';
import { distance, formatVector, lineAngle, num } from './vector.js';

const reason = (path: string, message: string): PrecheckReason => ({ in: 'constraints', path, message });

/** Where the dyes may sit: room for dyes.count.min dyes at spacing.min, pinned sites that fit. */
export function checkGeometry(c: ConstraintSet): PrecheckReason[] {
  return isAnchorScaffold(c.scaffold) ? checkAnchors(c, c.scaffold) : checkRegion(c, c.scaffold);
}

function checkRegion(c: ConstraintSet, region: RegionScaffold): PrecheckReason[] {
  const reasons: PrecheckReason[] = [];
  const n = c.dyes.count.min;
  const d = c.spacing.min;
  const bound = maxDyesInRegion(region, d);
  if (n > bound) {
    reasons.push(
      reason(
        '/dyes/count',
        `dyes.count asks for ${n} dyes, but the scaffold, ${describeRegion(region)}, holds at most ${bound} dyes kept spacing.min = ${num(d)} nm apart ` +
          '(bound from the densest sphere packing, pi/sqrt(18), from cells smaller than spacing.min and from the size of the region).',
      ),
    );
  }
  c.fixed.forEach((f, i) => {
    if (f.anchor !== undefined) {
      reasons.push(reason(`/fixed/${i}/anchor`, `fixed[${i}].anchor is set, but the scaffold is ${describeRegion(region)}, which has no anchors; give a position instead.`));
    }
    if (f.position !== undefined && !insideRegion(region, f.position)) {
      reasons.push(reason(`/fixed/${i}/position`, `fixed[${i}].position ${formatVector(f.position)} lies outside the scaffold, ${describeRegion(region)} centred at the origin.`));
    }
    if (f.direction !== undefined) reasons.push(...coneReason(c, i, f.direction, region.dipole.kind === 'cone' ? region.dipole.axis : undefined));
  });
  reasons.push(...fixedPairs(c, (i) => c.fixed[i].position, 0));
  return reasons;
}

function checkAnchors(c: ConstraintSet, scaffold: AnchorScaffold): PrecheckReason[] {
  const reasons: PrecheckReason[] = [];
  const n = c.dyes.count.min;
  if (scaffold.kind === 'helix_lattice') {
    if (scaffold.steps === 0) return [reason('/scaffold/steps', 'scaffold.steps is 0: the helical lattice has no anchor points, so no dye can be placed.')];
    if (scaffold.helices > 1 && scaffold.spacing < 2 * scaffold.radius) {
      reasons.push(
        reason('/scaffold/spacing', `scaffold.spacing (${num(scaffold.spacing)} nm) is less than twice scaffold.radius (${num(2 * scaffold.radius)} nm): neighbouring helices would overlap.`),
      );
    }
  }
  const anchors = scaffoldAnchors(scaffold);
  const slack = 2 * scaffold.linker.length;
  if (anchors.length < n) {
    reasons.push(reason('/dyes/count', `dyes.count asks for ${n} dyes, but the scaffold has only ${anchors.length} anchor points (one dye per anchor).`));
    return reasons;
  }
  const pinned = new Map<number, number>();
  c.fixed.forEach((f, i) => {
    if (f.anchor !== undefined) {
      if (f.anchor >= anchors.length) {
        reasons.push(reason(`/fixed/${i}/anchor`, `fixed[${i}].anchor is ${f.anchor}, but the scaffold has only anchors 0 to ${anchors.length - 1}.`));
      } else if (pinned.has(f.anchor)) {
        reasons.push(reason(`/fixed/${i}/anchor`, `fixed[${i}].anchor puts a second dye on anchor ${f.anchor} (also fixed[${pinned.get(f.anchor)}]); an anchor holds one dye.`));
      } else {
        pinned.set(f.anchor, i);
      }
    }
    reasons.push(...positionOnLinker(c, i, anchors, scaffold.linker.length));
    if (f.direction !== undefined && scaffold.dipole.kind === 'cone') {
      const axis = scaffold.dipole.axis;
      const frame = f.anchor !== undefined ? anchors[f.anchor]?.frame : undefined;
      const resolved = typeof axis === 'object' ? axis : frame?.[axis];
      reasons.push(...coneReason(c, i, f.direction, resolved));
    }
  });
  // Only the first entry on each anchor: a second one on the same anchor is reported above.
  const anchorOf = (i: number) => {
    const a = c.fixed[i].anchor;
    return a !== undefined && pinned.get(a) === i ? anchors[a].position : undefined;
  };
  reasons.push(...fixedPairs(c, (i) => c.fixed[i].position, 0));
  reasons.push(...fixedPairs(c, (i) => (c.fixed[i].position === undefined ? anchorOf(i) : undefined), slack));
  const answer = spreadSubset(anchors.map((a) => a.position), n, c.spacing.min - slack, [...pinned.keys()]);
  if (answer === 'no') {
    const need = num(Math.max(0, c.spacing.min - slack));
    const withPinned = pinned.size > 0 ? ' together with the anchors pinned in fixed' : '';
    reasons.push(
      reason(
        '/dyes/count',
        `dyes.count asks for ${n} dyes, but no ${n} anchors of the scaffold${withPinned} are at least ${need} nm apart ` +
          `(spacing.min ${num(c.spacing.min)} nm less twice linker.length ${num(scaffold.linker.length)} nm), so the dyes cannot keep spacing.min.`,
      ),
    );
  }
  return reasons;
}

/** A pinned position must be within linker.length of its anchor, or of some anchor. */
function positionOnLinker(c: ConstraintSet, i: number, anchors: AnchorPoint[], linker: number): PrecheckReason[] {
  const f = c.fixed[i];
  if (f.position === undefined) return [];
  const p = f.position;
  if (f.anchor !== undefined && f.anchor < anchors.length) {
    const gap = distance(p, anchors[f.anchor].position);
    if (gap <= linker + 1e-9) return [];
    return [reason(`/fixed/${i}/position`, `fixed[${i}].position is ${num(gap)} nm from anchor ${f.anchor}, farther than scaffold.linker.length (${num(linker)} nm).`)];
  }
  if (f.anchor === undefined && !anchors.some((a) => distance(p, a.position) <= linker + 1e-9)) {
    return [reason(`/fixed/${i}/position`, `fixed[${i}].position ${formatVector(p)} is farther than scaffold.linker.length (${num(linker)} nm) from every anchor.`)];
  }
  return [];
}

/** Pinned dyes closer than spacing.min; `slack` is how much farther apart than `where` they can move. */
function fixedPairs(c: ConstraintSet, where: (i: number) => Vector3 | undefined, slack: number): PrecheckReason[] {
  const reasons: PrecheckReason[] = [];
  for (let i = 0; i < c.fixed.length; i++) {
    for (let j = i + 1; j < c.fixed.length; j++) {
      const a = where(i);
      const b = where(j);
      if (a === undefined || b === undefined) continue;
      const most = distance(a, b) + slack;
      if (most >= c.spacing.min - 1e-9) continue;
      const what = slack > 0 ? `sit on anchors whose dyes can be at most ${num(most)} nm apart (anchor distance plus twice linker.length)` : `are ${num(most)} nm apart`;
      reasons.push(reason(`/fixed/${j}`, `fixed[${i}] and fixed[${j}] ${what}, closer than spacing.min (${num(c.spacing.min)} nm).`));
    }
  }
  return reasons;
}

function coneReason(c: ConstraintSet, i: number, direction: Vector3, axis: Vector3 | undefined): PrecheckReason[] {
  const dipole = c.scaffold.dipole;
  if (dipole.kind !== 'cone' || axis === undefined) return [];
  const angle = lineAngle(direction, axis);
  if (angle <= dipole.half_angle + 1e-9) return [];
  return [
    reason(`/fixed/${i}/direction`, `fixed[${i}].direction is ${num(angle)} degrees from the cone axis, more than scaffold.dipole.half_angle (${num(dipole.half_angle)} degrees).`),
  ];
}
