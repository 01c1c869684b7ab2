/** Integers in [lower, upper]: the unit interval is cut into upper - lower + 1 equal cells. */
import { InputError } from '../../errors.js';
import { clip01, type VariableCodec } from './codec.js';

export class IntegerCodec implements VariableCodec<number> {
  readonly kind = 'integer' as const;
  readonly width = 1;
  readonly discrete = true;
  readonly categorical = false;
  private readonly count: number;

  constructor(
    readonly name: string,
    readonly lower: number,
    readonly upper: number,
    readonly init: number | undefined = undefined,
  ) {
    if (!Number.isSafeInteger(lower) || !Number.isSafeInteger(upper) || upper < lower) {
      throw new InputError(`variable "${name}": integer bounds must be integers with lower <= upper, got [${lower}, ${upper}]`);
    }
    this.count = upper - lower + 1;
    if (init !== undefined) this.encode(init, new Float64Array(1), 0);
  }

  decode(std: ArrayLike<number>, offset: number): number {
    const cell = Math.floor(clip01(std[offset]) * this.count);
    return this.lower + (cell >= this.count ? this.count - 1 : cell);
  }

  encode(value: number, out: Float64Array, offset: number): void {
    if (!Number.isInteger(value) || value < this.lower || value > this.upper) {
      throw new InputError(`variable "${this.name}": value ${value} is not an integer in [${this.lower}, ${this.upper}]`);
    }
    out[offset] = (value - this.lower + 0.5) / this.count;
  }

  fromUnit(u: ArrayLike<number>, uOffset: number, out: Float64Array, offset: number): void {
    out[offset] = u[uOffset];
  }

  signature(): string {
    return `integer:${this.name}:${this.lower}:${this.upper}`;
  }
}
