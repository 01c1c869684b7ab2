/**
 * An unordered categorical choice among k options: k standardized scores, the decoded option is the
 * one with the highest score (ties go to the first). No order among options is implied, unlike a
 * single coordinate cut into k cells.
 */
import { InputError } from '../../errors.js';
import { clip01, type VariableCodec } from './codec.js';

/** Score given to the chosen option when a value is encoded; the others get 1 - CHOSEN. */
export const CHOSEN = 0.75;

export class ChoiceCodec<C extends string | number | boolean> implements VariableCodec<C> {
  readonly kind = 'choice' as const;
  readonly discrete = true;
  readonly categorical = true;
  readonly width: number;

  constructor(
    readonly name: string,
    readonly options: readonly C[],
    readonly init: C | undefined = undefined,
  ) {
    if (!Array.isArray(options) || options.length === 0) {
      throw new InputError(`variable "${name}": a choice needs at least one option`);
    }
    if (new Set(options).size !== options.length) throw new InputError(`variable "${name}": options must be distinct`);
    this.width = options.length;
    if (init !== undefined) this.encode(init, new Float64Array(this.width), 0);
  }

  /** Index of the chosen option in std[offset .. offset + k). */
  indexOf(std: ArrayLike<number>, offset: number): number {
    let best = 0;
    let bestScore = clip01(std[offset]);
    for (let i = 1; i < this.width; i++) {
      const s = clip01(std[offset + i]);
      if (s > bestScore) {
        bestScore = s;
        best = i;
      }
    }
    return best;
  }

  /** Writes the scores that decode to option number `index`. */
  setIndex(index: number, out: Float64Array, offset: number): void {
    for (let i = 0; i < this.width; i++) out[offset + i] = i === index ? CHOSEN : 1 - CHOSEN;
  }

  decode(std: ArrayLike<number>, offset: number): C {
    return this.options[this.indexOf(std, offset)];
  }

  encode(value: C, out: Float64Array, offset: number): void {
    const index = this.options.indexOf(value);
    if (index < 0) {
      throw new InputError(`variable "${this.name}": ${JSON.stringify(value)} is not one of ${this.options.map((o) => JSON.stringify(o)).join(', ')}`);
    }
    this.setIndex(index, out, offset);
  }

  fromUnit(u: ArrayLike<number>, uOffset: number, out: Float64Array, offset: number): void {
    for (let i = 0; i < this.width; i++) out[offset + i] = u[uOffset + i];
  }

  signature(): string {
    return `choice:${this.name}:${JSON.stringify(this.options)}`;
  }
}
