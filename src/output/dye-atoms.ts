/**
 * Each dye as three pseudo-atoms for molecular viewers: its centre and the two ends of its transition
 * dipole, centre +- (length/2) u with u the unit direction (length 1 nm when the dye has none, i.e. ends
 * 0.5 nm from the centre). Elements are real symbols every viewer knows, chosen for their colours:
 *   centre of a donor  N  (blue)      centre of a trap  S  (yellow)
 *   head (centre + length/2 u)  O  (red)      tail (centre - length/2 u)  C  (grey)
 */
import { unit } from '../physics/couplings.js';
import type { Vec3 } from '../physics/types.js';
import { siteRoles, type DesignRecord, type Role } from './record.js';

/** Half-length of the drawn dipole when a dye has no length, nm. */
export const DEFAULT_HALF_LENGTH_NM = 0.5;

export const ELEMENTS = { donor: 'N', trap: 'S', head: 'O', tail: 'C' } as const;

export interface DyeAtom {
  /** 'centre', 'head' or 'tail'. */
  readonly part: 'centre' | 'head' | 'tail';
  readonly element: string;
  /** Position, nm. */
  readonly position: Vec3;
}

export interface DyeAtoms {
  readonly site: number;
  readonly role: Role;
  readonly atoms: readonly [DyeAtom, DyeAtom, DyeAtom];
}

/** The three pseudo-atoms of every dye, in site order: centre, head, tail. */
export function dyeAtoms(record: DesignRecord): DyeAtoms[] {
  const roles = siteRoles(record);
  return record.sites.map((s, i) => {
    const u = unit(s.direction, `site ${i + 1} direction`);
    const h = s.length !== undefined ? s.length / 2 : DEFAULT_HALF_LENGTH_NM;
    const at = (sign: number): Vec3 => [s.position[0] + sign * h * u[0], s.position[1] + sign * h * u[1], s.position[2] + sign * h * u[2]];
    return {
      site: i,
      role: roles[i],
      atoms: [
        { part: 'centre', element: ELEMENTS[roles[i]], position: s.position },
        { part: 'head', element: ELEMENTS.head, position: at(1) },
        { part: 'tail', element: ELEMENTS.tail, position: at(-1) },
      ],
    };
  });
}
