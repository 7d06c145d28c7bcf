import { describe, expect, it } from 'vitest';
import { sampleRng, splitMix64, xoshiro128ss, xoshiro128ssFromState } from './prng.js';

describe('SplitMix64', () => {
  it('gives the published sequence for seed 1234567', () => {
    // Test vector of the SplitMix64 reference code (Steele, Lea and Flood 2014) as used by the
    // Rust rand_xoshiro crate's tests; from memory, confirmed by a separate Python computation.
    expect(splitMix64(1234567n, 5)).toEqual([
      6457827717110365317n, 3203168211198807973n, 9817491932198370423n, 4593380528125082431n, 16408922859458223821n,
    ]);
  });
});

describe('xoshiro128**', () => {
  it('gives the reference outputs for the state {1, 2, 3, 4}', () => {
    // First outputs of the authors' xoshiro128starstar.c from state 1, 2, 3, 4: from memory; the
    // first three also worked by hand from the published update (11520 = rotl(2 * 5, 7) * 9).
    const rng = xoshiro128ssFromState([1, 2, 3, 4]);
    expect([rng.nextU32(), rng.nextU32(), rng.nextU32(), rng.nextU32()]).toEqual([11520, 0, 5927040, 70819200]);
  });

  it('rejects the all-zero state', () => {
    expect(() => xoshiro128ssFromState([0, 0, 0, 0])).toThrow(/all zero/);
  });

  it('gives doubles in [0, 1) with mean 1/2 and variance 1/12 (within 4 standard errors at n = 20000)', () => {
    const rng = xoshiro128ss(42n);
    const n = 20000;
    const xs = Array.from({ length: n }, () => rng.next());
    expect(Math.min(...xs)).toBeGreaterThanOrEqual(0);
    expect(Math.max(...xs)).toBeLessThan(1);
    const mean = xs.reduce((a, b) => a + b, 0) / n;
    const variance = xs.reduce((a, b) => a + (b - mean) ** 2, 0) / (n - 1);
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(variance - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n)); // var of U^2-type terms: 1/180
  });
});

describe('sampleRng', () => {
  it('depends on (seed, sample, stream) only, not on the order of creation', () => {
    const a = sampleRng(42, 17, 1).next();
    sampleRng(42, 3, 0).next();
    expect(sampleRng(42, 17, 1).next()).toBe(a);
  });

  it('gives different streams for a different seed, sample or parameter', () => {
    const base = sampleRng(42, 17, 1).nextU32();
    expect(sampleRng(43, 17, 1).nextU32()).not.toBe(base);
    expect(sampleRng(42, 18, 1).nextU32()).not.toBe(base);
    expect(sampleRng(42, 17, 2).nextU32()).not.toBe(base);
  });

  it('refuses negative or fractional seeds', () => {
    expect(() => sampleRng(-1, 0, 0)).toThrow(RangeError);
    expect(() => sampleRng(1.5, 0, 0)).toThrow(RangeError);
  });
});
