/**
 * A unit vector in 3-D (for example a transition dipole direction), stored as three Cartesian
 * standardized coordinates c in [0, 1]^3: w = 2c - 1 is a point of the cube [-1, 1]^3 and the
 * direction is w / |w|. Cartesian storage has no poles, so optimizers move smoothly through every
 * direction (spherical angles would make the step size collapse near theta = 0 and pi).
 * Encoded directions sit on the sphere |w| = 1/2, well inside the cube.
 *
 * Random sampling uses Archimedes' equal-area map (z uniform in [-1, 1], azimuth uniform in
 * [0, 2 pi)), which gives the uniform law on the sphere from two uniform numbers.
 */
import { InputError } from '../../errors.js';
import { clip01, type VariableCodec } from './codec.js';

export type Vec3 = [number, number, number];

/** Radius, in w = 2c - 1 coordinates, at which directions are encoded. */
const RADIUS = 0.5;
/** Below this |w| the direction is undefined and the codec returns +z. */
const DEGENERATE = 1e-12;

export class UnitVectorCodec implements VariableCodec<Vec3> {
  readonly kind = 'unit-vector' as const;
  readonly width = 3;
  readonly discrete = false;
  readonly categorical = false;

  constructor(
    readonly name: string,
    readonly init: Vec3 | undefined = undefined,
  ) {
    if (init !== undefined) this.encode(init, new Float64Array(3), 0);
  }

  decode(std: ArrayLike<number>, offset: number): Vec3 {
    const x = 2 * clip01(std[offset]) - 1;
    const y = 2 * clip01(std[offset + 1]) - 1;
    const z = 2 * clip01(std[offset + 2]) - 1;
    const r = Math.hypot(x, y, z);
    if (r < DEGENERATE) return [0, 0, 1];
    return [x / r, y / r, z / r];
  }

  encode(value: Vec3, out: Float64Array, offset: number): void {
    if (!Array.isArray(value) || value.length !== 3 || !value.every(Number.isFinite)) {
      throw new InputError(`variable "${this.name}": a unit vector must be an array of three finite numbers`);
    }
    const r = Math.hypot(value[0], value[1], value[2]);
    if (Math.abs(r - 1) > 1e-6) throw new InputError(`variable "${this.name}": vector has length ${r}, expected 1`);
    for (let i = 0; i < 3; i++) out[offset + i] = (1 + (RADIUS * value[i]) / r) / 2;
  }

  fromUnit(u: ArrayLike<number>, uOffset: number, out: Float64Array, offset: number): void {
    const z = 2 * u[uOffset] - 1;
    const phi = 2 * Math.PI * u[uOffset + 1];
    const s = Math.sqrt(Math.max(0, 1 - z * z));
    out[offset] = (1 + RADIUS * s * Math.cos(phi)) / 2;
    out[offset + 1] = (1 + RADIUS * s * Math.sin(phi)) / 2;
    out[offset + 2] = (1 + RADIUS * z) / 2;
  }

  signature(): string {
    return `unit-vector:${this.name}`;
  }
}
