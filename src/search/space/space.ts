/**
 * A typed search space: named variables (bounded, log-scaled or vector reals, integers, unordered
 * choices, 3-D unit vectors) and cheap constraints. Each variable maps to standardized coordinates
 * in [0, 1], so optimizers see only a real vector; `decode` gives back a typed point.
 *
 *   const space = new SearchSpace()
 *     .real('gap', 0.5, 4)
 *     .choice('dye', ['A', 'B', 'C'])
 *     .unitVector('dipole')
 *     .constraint('not too close', (p) => p.gap > 1, (p) => 1 - p.gap);
 */
import { InputError } from '../../errors.js';
import type { Rng } from '../rng.js';
import type { CategoricalBlock, StandardSpace } from '../core/types.js';
import type { VariableCodec } from './codec.js';
import { RealCodec, type RealOptions } from './real.js';
import { IntegerCodec } from './integer.js';
import { ChoiceCodec } from './choice.js';
import { UnitVectorCodec, type Vec3 } from './unitVector.js';

export interface Constraint<P> {
  readonly name: string;
  readonly satisfied: (point: P) => boolean;
  /** How far a point is from satisfying the constraint (> 0 when violated); 1 when absent. */
  readonly violation?: (point: P) => number;
}

type Add<P, K extends string, V> = P & { [key in K]: V };

export class SearchSpace<P extends object = {}> implements StandardSpace {
  private readonly codecs: VariableCodec[] = [];
  private readonly offsets: number[] = [];
  private readonly constraints: Constraint<P>[] = [];
  private readonly blocks: CategoricalBlock[] = [];
  private readonly blockCodec: ChoiceCodec<string | number | boolean>[] = [];
  private size = 0;

  private add<Q extends object>(codec: VariableCodec): SearchSpace<Q> {
    if (typeof codec.name !== 'string' || codec.name.length === 0) throw new InputError('a variable needs a non-empty name');
    if (this.codecs.some((c) => c.name === codec.name)) throw new InputError(`variable "${codec.name}" is defined twice`);
    this.codecs.push(codec);
    this.offsets.push(this.size);
    if (codec.categorical) {
      this.blocks.push({ offset: this.size, width: codec.width });
      this.blockCodec.push(codec as ChoiceCodec<string | number | boolean>);
    }
    this.size += codec.width;
    return this as unknown as SearchSpace<Q>;
  }

  /** A real in [lower, upper]; `log: true` puts it on a logarithmic scale. */
  real<K extends string>(name: K, lower: number, upper: number, options: RealOptions & { init?: number } = {}) {
    return this.add<Add<P, K, number>>(new RealCodec(name, lower, upper, undefined, options));
  }

  /** A log-scaled real in [lower, upper], lower > 0. */
  logReal<K extends string>(name: K, lower: number, upper: number, options: { init?: number } = {}) {
    return this.add<Add<P, K, number>>(new RealCodec(name, lower, upper, undefined, { ...options, log: true }));
  }

  /** A vector of `length` reals, each in [lower, upper]. */
  reals<K extends string>(name: K, length: number, lower: number, upper: number, options: RealOptions = {}) {
    return this.add<Add<P, K, number[]>>(new RealCodec(name, lower, upper, length, options));
  }

  /** An integer in [lower, upper]. */
  integer<K extends string>(name: K, lower: number, upper: number, options: { init?: number } = {}) {
    return this.add<Add<P, K, number>>(new IntegerCodec(name, lower, upper, options.init));
  }

  /** One of `options`, unordered. */
  choice<K extends string, const C extends string | number | boolean>(name: K, options: readonly C[], settings: { init?: C } = {}) {
    return this.add<Add<P, K, C>>(new ChoiceCodec<C>(name, options, settings.init));
  }

  /** A direction in 3-D, returned as a unit vector [x, y, z]. */
  unitVector<K extends string>(name: K, options: { init?: Vec3 } = {}) {
    return this.add<Add<P, K, Vec3>>(new UnitVectorCodec(name, options.init));
  }

  /**
   * A cheap constraint checked before the objective: `satisfied` decides, `violation` (optional,
   * > 0 when violated) ranks infeasible points so a search can walk towards feasibility.
   */
  constraint(name: string, satisfied: (point: P) => boolean, violation?: (point: P) => number): this {
    if (typeof satisfied !== 'function') throw new InputError(`constraint "${name}": satisfied must be a function`);
    if (violation !== undefined && typeof violation !== 'function') throw new InputError(`constraint "${name}": violation must be a function`);
    this.constraints.push({ name, satisfied, violation });
    return this;
  }

  get dim(): number {
    return this.size;
  }

  get variables(): readonly VariableCodec[] {
    return this.codecs;
  }

  get categorical(): readonly CategoricalBlock[] {
    return this.blocks;
  }

  get discreteShare(): number {
    return this.codecs.length === 0 ? 0 : this.codecs.filter((c) => c.discrete).length / this.codecs.length;
  }

  get startGiven(): boolean {
    return this.codecs.length > 0 && this.codecs.every((c) => c.init !== undefined);
  }

  get constraintNames(): string[] {
    return this.constraints.map((c) => c.name);
  }

  private requireVariables(): void {
    if (this.size === 0) throw new InputError('the search space has no variables');
  }

  decode(std: ArrayLike<number>): P {
    if (std.length !== this.size) throw new InputError(`expected ${this.size} standardized coordinates, got ${std.length}`);
    const point: Record<string, unknown> = {};
    for (let i = 0; i < this.codecs.length; i++) point[this.codecs[i].name] = this.codecs[i].decode(std, this.offsets[i]);
    return point as P;
  }

  encode(point: P): Float64Array {
    this.requireVariables();
    const out = new Float64Array(this.size);
    const record = point as Record<string, unknown>;
    for (let i = 0; i < this.codecs.length; i++) {
      const c = this.codecs[i];
      if (!(c.name in record)) throw new InputError(`point has no value for variable "${c.name}"`);
      c.encode(record[c.name], out, this.offsets[i]);
    }
    return out;
  }

  fromUnitInto(u: ArrayLike<number>, out: Float64Array): void {
    for (let i = 0; i < this.codecs.length; i++) this.codecs[i].fromUnit(u, this.offsets[i], out, this.offsets[i]);
  }

  sampleInto(rng: Rng, out: Float64Array): void {
    this.requireVariables();
    const u = new Float64Array(this.size);
    for (let i = 0; i < this.size; i++) u[i] = rng.uniform();
    this.fromUnitInto(u, out);
  }

  startInto(rng: Rng, out: Float64Array): void {
    this.sampleInto(rng, out);
    for (let i = 0; i < this.codecs.length; i++) {
      const c = this.codecs[i];
      if (c.init !== undefined) c.encode(c.init, out, this.offsets[i]);
    }
  }

  categoryOf(x: ArrayLike<number>, block: number): number {
    return this.blockCodec[block].indexOf(x, this.blocks[block].offset);
  }

  setCategory(x: Float64Array, block: number, index: number): void {
    this.blockCodec[block].setIndex(index, x, this.blocks[block].offset);
  }

  /**
   * Total violation of the constraints at `point`: 0 when all hold. A violated constraint adds its
   * measure (1 without one; the smallest positive number when the measure is not positive; Infinity
   * when it is not finite).
   */
  violation(point: P): number {
    let total = 0;
    for (const c of this.constraints) {
      if (c.satisfied(point)) continue;
      const v = c.violation ? c.violation(point) : 1;
      total += Number.isNaN(v) || v === Infinity ? Infinity : v > 0 ? v : Number.MIN_VALUE;
    }
    return total;
  }

  /** Names and kinds of the variables, used to refuse resuming a run on another space. */
  signature(): string[] {
    return this.codecs.map((c) => c.signature());
  }
}
