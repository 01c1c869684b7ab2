/**
 * Seeded pseudo-random generator for the search layer.
 *
 * Generator: xoshiro128** 1.1 (Blackman and Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4), 2021; reference code xoshiro128starstar.c).
 * Seeding: the 64-bit seed is expanded by SplitMix64 (Steele, Lea and Flood, "Fast splittable
 * pseudorandom number generators", OOPSLA 2014), as the xoshiro authors recommend.
 * Uniform doubles take 53 random bits from two outputs. Gaussian deviates use the ziggurat method
 * (Marsaglia and Tsang, J. Stat. Softw. 5(8), 2000; tables in ziggurat.ts) with the layer index
 * drawn from its own output, as Doornik ("An improved ziggurat method to generate normal random
 * samples", 2005) recommends against the correlation of index and value bits in the original.
 *
 * The whole state is plain JSON (`dump()` / `Rng.load()`), so a run can be stopped and resumed.
 */
import { InputError } from '../errors.js';
import { fn, kn, wn, ZIGGURAT_R } from './ziggurat.js';

export interface RngState {
  /** The four 32-bit words of the xoshiro128** state, as unsigned integers. */
  words: [number, number, number, number];
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
  // State in a typed array: the 32-bit words stay unboxed (no heap numbers).
  private readonly s = new Uint32Array(4);

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
    return Rng.fromWords(state.words);
  }

  /** Replaces this generator's state in place (every holder of it then continues from `state`). */
  restore(state: RngState): void {
    const other = Rng.load(state);
    this.s.set(other.s);
  }

  dump(): RngState {
    const s = this.s;
    return { words: [s[0], s[1], s[2], s[3]] };
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

  /** Standard normal deviate (ziggurat). */
  normal(): number {
    for (;;) {
      const hz = this.nextU32() | 0; // signed 32-bit value
      const iz = this.nextU32() & 127; // independent layer index (Doornik 2005)
      if (Math.abs(hz) < kn[iz]) return hz * wn[iz];
      const x = hz * wn[iz];
      if (iz === 0) {
        // The tail beyond r (Marsaglia 1964): x = -ln(U1) / r, accepted when -2 ln(U2) > x^2.
        let t: number;
        let y: number;
        do {
          t = -Math.log(1 - this.uniform()) / ZIGGURAT_R;
          y = -Math.log(1 - this.uniform());
        } while (y + y < t * t);
        return hz > 0 ? ZIGGURAT_R + t : -ZIGGURAT_R - t;
      }
      if (fn[iz] + this.uniform() * (fn[iz - 1] - fn[iz]) < Math.exp(-0.5 * x * x)) return x;
    }
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
