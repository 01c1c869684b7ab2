/** Bounded reals on a linear or logarithmic scale, as one number or as a fixed-length vector. */
import { InputError } from '../../errors.js';
import { clip01, type VariableCodec } from './codec.js';

export interface RealOptions {
  /** Map the standardized coordinate to the value on a log scale (needs lower > 0). */
  log?: boolean;
  /** Starting value (a number, or one number per component for a vector). */
  init?: number | readonly number[];
}

export class RealCodec implements VariableCodec<number | number[]> {
  readonly kind;
  readonly discrete = false;
  readonly categorical = false;
  readonly width: number;
  readonly init: number | number[] | undefined;
  private readonly a: number;
  private readonly b: number;

  /** `size` undefined gives a scalar variable; a positive integer gives a vector of that length. */
  constructor(
    readonly name: string,
    readonly lower: number,
    readonly upper: number,
    readonly size: number | undefined,
    readonly options: RealOptions = {},
  ) {
    const log = options.log === true;
    this.kind = log ? ('log-real' as const) : ('real' as const);
    if (!Number.isFinite(lower) || !Number.isFinite(upper) || !(upper > lower)) {
      throw new InputError(`variable "${name}": bounds must be finite with lower < upper, got [${lower}, ${upper}]`);
    }
    if (log && !(lower > 0)) throw new InputError(`variable "${name}": a log-scaled real needs lower > 0, got ${lower}`);
    if (size !== undefined && (!Number.isInteger(size) || size < 1)) {
      throw new InputError(`variable "${name}": vector length must be a positive integer, got ${size}`);
    }
    this.width = size ?? 1;
    this.a = log ? Math.log(lower) : lower;
    this.b = log ? Math.log(upper) : upper;
    if (options.init !== undefined) {
      const probe = new Float64Array(this.width);
      this.encode(options.init as number | number[], probe, 0); // validates
      this.init = Array.isArray(options.init) ? [...options.init] : (options.init as number);
    }
  }

  private toValue(u: number): number {
    const t = this.a + clip01(u) * (this.b - this.a);
    const v = this.kind === 'log-real' ? Math.exp(t) : t;
    return v < this.lower ? this.lower : v > this.upper ? this.upper : v;
  }

  private toStd(v: number): number {
    if (typeof v !== 'number' || !(v >= this.lower && v <= this.upper)) {
      throw new InputError(`variable "${this.name}": value ${v} is outside [${this.lower}, ${this.upper}]`);
    }
    const t = this.kind === 'log-real' ? Math.log(v) : v;
    return clip01((t - this.a) / (this.b - this.a));
  }

  decode(std: ArrayLike<number>, offset: number): number | number[] {
    if (this.size === undefined) return this.toValue(std[offset]);
    const out = new Array<number>(this.size);
    for (let i = 0; i < this.size; i++) out[i] = this.toValue(std[offset + i]);
    return out;
  }

  encode(value: number | readonly number[], out: Float64Array, offset: number): void {
    if (this.size === undefined) {
      out[offset] = this.toStd(value as number);
      return;
    }
    if (!Array.isArray(value) || value.length !== this.size) {
      throw new InputError(`variable "${this.name}": expected an array of ${this.size} numbers`);
    }
    for (let i = 0; i < this.size; i++) out[offset + i] = this.toStd(value[i]);
  }

  fromUnit(u: ArrayLike<number>, uOffset: number, out: Float64Array, offset: number): void {
    for (let i = 0; i < this.width; i++) out[offset + i] = u[uOffset + i];
  }

  signature(): string {
    return `${this.kind}:${this.name}[${this.width}]:${this.lower}:${this.upper}`;
  }
}
