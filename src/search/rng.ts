/**
 * Seeded pseudo-random generator for the search layer.
 *
 * Generator: xoshiro128** 1.1 (Blackman and Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4), 2021; reference code xoshiro128starstar.c).
 * Seeding: the 64-bit seed is expanded by SplitMix64 (Steele, Lea and Flood, "Fast splittable
 * pseudorandom number generators", OOPSLA 2014), as the xoshiro authors recommend.
 * Uniform doubles take 53 random bits from two outputs; Gaussian deviates use Marsaglia's polar
 * form of the Box-Muller transform (Marsaglia and Bray, SIAM Review 6, 1964; Box and Muller,
 * Ann. Math. Stat. 29, 1958), which yields two deviates per accepted pair; the spare one is part of
 * the state.
 *
 * The whole state is plain JSON (`dump()` / `Rng.load()`), so a run can be stopped and resumed.
 */
import { InputError } from '../errors.js';

export interface RngState {
  /** The four 32-bit words of the xoshiro128** state, as unsigned integers. */
  words: [number, number, number, number];
  /** The second Box-Muller deviate not yet handed out, or null. */
  spare: number | null;
}

const MASK64 = (1n << 64n) - 1n;

/** SplitMix64 step: returns [next state, output], both unsigned 64-bit BigInts. */
export function splitMix64(state: bigint): [bigint, bigint] {
  const next = (state + 0x9e3779b97f4a7c15n) & MASK64;
  let z = next;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return [next, z ^ (z >> 31n)];
}

/** 32-bit left rotation; the result is a signed 32-bit pattern (store it in a Uint32Array). */
function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

export class Rng {
  // State in typed arrays: 32-bit words and the spare deviate stay unboxed (no heap numbers).
  private readonly s = new Uint32Array(4);
  private readonly spareValue = new Float64Array(1);
  private hasSpare = false;

  private constructor(words: readonly number[]) {
    for (let i = 0; i < 4; i++) this.s[i] = words[i] >>> 0;
  }

  /** A generator seeded from a non-negative safe integer. */
  static fromSeed(seed: number): Rng {
    if (!Number.isSafeInteger(seed) || seed < 0) {
      throw new InputError(`seed must be a non-negative integer below 2^53, got ${seed}`, 'bad-seed');
    }
    let state = BigInt(seed);
    const words: number[] = [];
    for (let i = 0; i < 2; i++) {
      const [next, out] = splitMix64(state);
      state = next;
      words.push(Number(out >> 32n), Number(out & 0xffffffffn));
    }
    if (!words.some((w) => w !== 0)) words[0] = 1; // the all-zero state is the one xoshiro forbids
    return new Rng(words);
  }

  /** A generator started from explicit state words (for tests against reference outputs). */
  static fromWords(words: [number, number, number, number]): Rng {
    if (words.every((w) => w >>> 0 === 0)) throw new InputError('xoshiro128** state must not be all zero');
    return new Rng(words);
  }

  static load(state: RngState): Rng {
    if (!state || !Array.isArray(state.words) || state.words.length !== 4) {
      throw new InputError('random generator state must hold four 32-bit words', 'bad-state');
    }
    const rng = Rng.fromWords(state.words);
    if (typeof state.spare === 'number') {
      rng.hasSpare = true;
      rng.spareValue[0] = state.spare;
    }
    return rng;
  }

  /** Replaces this generator's state in place (every holder of it then continues from `state`). */
  restore(state: RngState): void {
    const other = Rng.load(state);
    this.s.set(other.s);
    this.hasSpare = other.hasSpare;
    this.spareValue[0] = other.spareValue[0];
  }

  dump(): RngState {
    const s = this.s;
    return { words: [s[0], s[1], s[2], s[3]], spare: this.hasSpare ? this.spareValue[0] : null };
  }

  /** Next unsigned 32-bit output of xoshiro128**. */
  nextU32(): number {
    const s = this.s;
    const result = Math.imul(rotl(Math.imul(s[1], 5), 7), 9) >>> 0;
    const t = s[1] << 9;
    s[2] ^= s[0];
    s[3] ^= s[1];
    s[1] ^= s[2];
    s[0] ^= s[3];
    s[2] ^= t;
    s[3] = rotl(s[3], 11);
    return result;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  uniform(): number {
    const a = this.nextU32() >>> 5; // 27 bits
    const b = this.nextU32() >>> 6; // 26 bits
    return (a * 67108864 + b) / 9007199254740992;
  }

  /** Uniform integer in [0, n), n a positive integer below 2^32 (rejection keeps it unbiased). */
  int(n: number): number {
    if (!Number.isInteger(n) || n <= 0 || n > 0x100000000) throw new InputError(`int(n) needs 1 <= n <= 2^32, got ${n}`);
    const limit = 0x100000000 - (0x100000000 % n);
    for (;;) {
      const u = this.nextU32();
      if (u < limit) return u % n;
    }
  }

  /** Standard normal deviate (polar method, spare kept). */
  normal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spareValue[0];
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      // 32-bit uniforms on (-1, 1): ample resolution for the polar method, half the generator calls.
      u = this.nextU32() * 4.656612873077393e-10 - 1;
      v = this.nextU32() * 4.656612873077393e-10 - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const k = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareValue[0] = v * k;
    this.hasSpare = true;
    return u * k;
  }

  /** Fills `out` with independent standard normal deviates. */
  normals(out: Float64Array): Float64Array {
    for (let i = 0; i < out.length; i++) out[i] = this.normal();
    return out;
  }

  /** A uniformly random permutation of 0..n-1 (Fisher-Yates, Durstenfeld's form). */
  permutation(n: number): number[] {
    const p = Array.from({ length: n }, (_, i) => i);
    for (let i = n - 1; i > 0; i--) {
      const j = this.int(i + 1);
      const tmp = p[i];
      p[i] = p[j];
      p[j] = tmp;
    }
    return p;
  }
}
