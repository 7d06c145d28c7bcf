/**
 * Seeded pseudorandom numbers for the Monte Carlo analysis (pure: the seed goes in, nothing is
 * read from the machine).
 *
 * Generator: xoshiro128** 1.1 of D. Blackman and S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Transactions on Mathematical Software 47(4), 2021, article 36. 128-bit state,
 * 32-bit output, all arithmetic in 32-bit integers (exact in JavaScript through Math.imul and >>>).
 *
 * Seeding: as the authors recommend, the state is filled from SplitMix64 (G. L. Steele, D. Lea and
 * C. H. Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014), so that nearby seeds
 * give unrelated states. SplitMix64 needs 64-bit products; BigInt is used for those few steps only.
 *
 * Streams: every (seed, sample, parameter) triple gets its own generator, derived by mixing the
 * three numbers through SplitMix64's finaliser. Sample k's values therefore depend on (seed, k)
 * alone: any order of evaluation, any number of jobs, any split into shards draws the same values,
 * and a rejection step that takes an extra draw for one parameter does not shift the others.
 */

const MASK64 = (1n << 64n) - 1n;
const GOLDEN = 0x9e3779b97f4a7c15n;

/** SplitMix64's output function (a bijective 64-bit mixer). */
function mix64(z: bigint): bigint {
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return z ^ (z >> 31n);
}

/** Largest seed accepted: seeds are whole numbers 0 .. 2^53 - 1 (exact as JavaScript numbers). */
export const MAX_SEED = Number.MAX_SAFE_INTEGER;

/** A generator of 32-bit words and of doubles in [0, 1). */
export interface Rng {
  /** Next 32-bit unsigned integer. */
  nextU32(): number;
  /** Next double uniform on [0, 1) with 53 random bits. */
  next(): number;
}

const rotl = (x: number, k: number): number => (x << k) | (x >>> (32 - k));

/** The first `count` outputs of SplitMix64 started from state `seed64` (the seeding generator). */
export function splitMix64(seed64: bigint, count: number): bigint[] {
  let x = seed64 & MASK64;
  const out: bigint[] = [];
  for (let i = 0; i < count; i++) {
    x = (x + GOLDEN) & MASK64;
    out.push(mix64(x));
  }
  return out;
}

/** xoshiro128** from its four 32-bit state words (not all zero), as in the authors' reference code. */
export function xoshiro128ssFromState(state: readonly [number, number, number, number]): Rng {
  let [s0, s1, s2, s3] = state.map((w) => w | 0) as [number, number, number, number];
  if ((s0 | s1 | s2 | s3) === 0) throw new RangeError('xoshiro128** state must not be all zero');
  const nextU32 = (): number => {
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = rotl(s3, 11);
    return result;
  };
  return {
    nextU32,
    // 27 + 26 bits, the usual construction of a 53-bit double from two 32-bit words
    next: () => ((nextU32() >>> 5) * 67108864 + (nextU32() >>> 6)) / 9007199254740992,
  };
}

/**
 * xoshiro128** seeded from one 64-bit value through SplitMix64 (two outputs, low word first, give
 * the four state words). Two consecutive SplitMix64 outputs are never both zero (mix64 is a
 * bijection and the counter values differ), so the forbidden all-zero state cannot occur.
 */
export function xoshiro128ss(seed64: bigint): Rng {
  const words = splitMix64(seed64, 2).flatMap((z) => [Number(z & 0xffffffffn), Number(z >> 32n)]);
  return xoshiro128ssFromState(words as [number, number, number, number]);
}

/**
 * The generator of one sample's one parameter. seed: a whole number 0 .. MAX_SEED; sample and
 * stream: whole numbers >= 0 (stream numbers a parameter: lr 0, cr 1, lm 2, turnsRatio 3).
 */
export function sampleRng(seed: number, sample: number, stream: number): Rng {
  for (const [name, v] of [['seed', seed], ['sample', sample], ['stream', stream]] as const) {
    if (!Number.isSafeInteger(v) || v < 0) throw new RangeError(`${name} must be a whole number 0 .. ${MAX_SEED}, got ${v}`);
  }
  const perSeed = mix64((BigInt(seed) + GOLDEN) & MASK64);
  const perSample = mix64(perSeed ^ BigInt(sample));
  return xoshiro128ss((perSample + GOLDEN * BigInt(stream + 1)) & MASK64);
}
