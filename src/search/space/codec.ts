/**
 * A variable codec maps one named variable to `width` standardized coordinates in [0, 1] and back.
 * Optimizers only ever see the standardized vector; the codec owns the meaning of the coordinates.
 */
export type VariableKind = 'real' | 'log-real' | 'integer' | 'choice' | 'unit-vector';

export interface VariableCodec<V = unknown> {
  readonly name: string;
  readonly kind: VariableKind;
  /** Number of standardized coordinates. */
  readonly width: number;
  /** True for integer and categorical variables. */
  readonly discrete: boolean;
  /** True when the coordinates form one categorical block (argmax over `width` scores). */
  readonly categorical: boolean;
  /** The starting value given by the user, if any. */
  readonly init: V | undefined;
  /** Value of the variable at std[offset .. offset + width). Coordinates outside [0, 1] are clipped. */
  decode(std: ArrayLike<number>, offset: number): V;
  /** Writes the standardized coordinates of `value`; throws InputError for a value outside the variable. */
  encode(value: V, out: Float64Array, offset: number): void;
  /**
   * Maps `width` numbers uniform in [0, 1) to standardized coordinates so that the decoded value follows
   * the variable's natural uniform law (uniform on the sphere for a unit vector). Used by random and
   * low-discrepancy sampling.
   */
  fromUnit(u: ArrayLike<number>, uOffset: number, out: Float64Array, offset: number): void;
  /** A plain description used to check that a saved run belongs to the same space. */
  signature(): string;
}

export function clip01(u: number): number {
  return u < 0 ? 0 : u > 1 ? 1 : Number.isNaN(u) ? 0.5 : u;
}
