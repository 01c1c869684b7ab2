/**
 * The Halton low-discrepancy sequence (Halton, Numer. Math. 2, 1960): coordinate j of point i is the
 * radical inverse of i in the j-th prime base. With `scramble`, every digit position of every
 * coordinate has its own random permutation of the digits, applied to leading zero digits as well
 * (random digit scrambling; Owen, "A randomized Halton algorithm in R", arXiv:1706.02808, 2017).
 * Scrambling keeps the stratification of the sequence and removes the strong correlations between
 * high prime bases that make the plain sequence poor beyond a few dimensions.
 */
import { InputError } from '../../errors.js';
import { Rng } from '../rng.js';

/** The first n primes, by trial division. */
export function firstPrimes(n: number): number[] {
  const primes: number[] = [];
  for (let c = 2; primes.length < n; c++) {
    let prime = true;
    for (const p of primes) {
      if (p * p > c) break;
      if (c % p === 0) {
        prime = false;
        break;
      }
    }
    if (prime) primes.push(c);
  }
  return primes;
}

export class Halton {
  private readonly bases: number[];
  /** perms[j][k]: the digit permutation of coordinate j at digit position k (null: identity). */
  private readonly perms: (Uint32Array[] | null)[];
  private readonly digits: number[];

  /** `scrambleSeed` null gives the plain sequence. */
  constructor(
    readonly dim: number,
    readonly scrambleSeed: number | null,
  ) {
    if (!Number.isInteger(dim) || dim < 1) throw new InputError(`Halton sequence needs a dimension >= 1, got ${dim}`);
    this.bases = firstPrimes(dim);
    // Enough digits that the last one is below double precision.
    this.digits = this.bases.map((b) => Math.ceil((53 * Math.LN2) / Math.log(b)));
    const rng = scrambleSeed === null ? null : Rng.fromSeed(scrambleSeed);
    this.perms = this.bases.map((b, j) =>
      rng ? Array.from({ length: this.digits[j] }, () => Uint32Array.from(rng.permutation(b))) : null,
    );
  }

  /** Writes point number `index` (index >= 0) into out[0..dim). */
  point(index: number, out: Float64Array): void {
    if (!Number.isSafeInteger(index) || index < 0) throw new InputError(`Halton index must be a non-negative integer, got ${index}`);
    for (let j = 0; j < this.dim; j++) {
      const b = this.bases[j];
      const perm = this.perms[j];
      let i = index;
      let scale = 1 / b;
      let v = 0;
      const kmax = perm ? this.digits[j] : Infinity;
      for (let k = 0; k < kmax && (perm || i > 0); k++) {
        const digit = i % b;
        i = (i - digit) / b;
        v += (perm ? perm[k][digit] : digit) * scale;
        scale /= b;
      }
      out[j] = v < 1 ? v : 1 - Number.EPSILON / 2;
    }
  }
}
