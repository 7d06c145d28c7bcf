import { describe, expect, it } from 'vitest';
// @ts-expect-error jstat ships no type declarations; only jStat.beta.inv is used, in this test
import jstatModule from 'jstat';

const { jStat } = jstatModule as { jStat: { beta: { inv(p: number, a: number, b: number): number } } };
import { binomialCdf, clopperPearson, wilsonInterval } from './interval.js';

describe('clopperPearson', () => {
  it('agrees with the beta-quantile form computed by jstat (npm registry) to 1e-6', () => {
    // Clopper-Pearson ends as beta quantiles: low = B^-1(a/2; x, n-x+1), high = B^-1(1-a/2; x+1, n-x)
    for (const [x, n] of [[0, 20], [1, 29], [15, 148], [81, 263], [50, 100], [99, 100], [100, 100], [487, 500], [1000, 1000]] as const) {
      const low = x === 0 ? 0 : jStat.beta.inv(0.025, x, n - x + 1);
      const high = x === n ? 1 : jStat.beta.inv(0.975, x + 1, n - x);
      const ours = clopperPearson(x, n);
      expect(ours.low).toBeCloseTo(low, 6);
      expect(ours.high).toBeCloseTo(high, 6);
      expect(ours.value).toBe(x / n);
    }
  });

  it('at n of n successes has the closed form low = (alpha/2)^(1/n) (Clopper and Pearson 1934)', () => {
    expect(clopperPearson(500, 500).low).toBeCloseTo(0.025 ** (1 / 500), 9);
    expect(clopperPearson(0, 500).high).toBeCloseTo(1 - 0.025 ** (1 / 500), 9);
  });
});

describe('wilsonInterval', () => {
  it('matches the worked values of Newcombe 1998 (Statistics in Medicine 17, Table I, method 3; from memory, 4 digits)', () => {
    const cases = [[81, 263, 0.2553, 0.3662], [15, 148, 0.0624, 0.1605], [0, 20, 0, 0.1611], [1, 29, 0.0061, 0.1718]] as const;
    for (const [x, n, lo, hi] of cases) {
      const w = wilsonInterval(x, n);
      expect(w.low).toBeCloseTo(lo, 4);
      expect(w.high).toBeCloseTo(hi, 4);
    }
  });

  it('refuses impossible counts', () => {
    expect(() => wilsonInterval(3, 2)).toThrow(RangeError);
    expect(() => clopperPearson(1, 0)).toThrow(RangeError);
  });
});

describe('binomialCdf', () => {
  it('sums the binomial probabilities: Bin(10, 0.5) <= 5 is 638/1024 exactly', () => {
    expect(binomialCdf(5, 10, 0.5)).toBeCloseTo(638 / 1024, 12);
    expect(binomialCdf(-1, 10, 0.5)).toBe(0);
    expect(binomialCdf(10, 10, 0.5)).toBe(1);
  });
});
