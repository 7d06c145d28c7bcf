import { describe, expect, it } from 'vitest';
import { pearson, ranks, spearman } from './rank.js';

describe('ranks', () => {
  it('gives tied values the mean of their ranks', () => {
    expect(ranks([10, 20, 20, 5])).toEqual([2, 3.5, 3.5, 1]);
  });
});

describe('spearman', () => {
  it('without ties equals Spearman\'s formula 1 - 6 sum d^2 / (n (n^2 - 1)) (Spearman 1904)', () => {
    const x = [3.1, 1.2, 5.5, 4.4, 2.0, 9.1, 7.7];
    const y = [2.0, 1.0, 4.0, 6.0, 3.0, 7.0, 5.0];
    const rx = ranks(x);
    const ry = ranks(y);
    const n = x.length;
    const d2 = rx.reduce((a, r, i) => a + (r - ry[i]!) ** 2, 0);
    expect(spearman(x, y)).toBeCloseTo(1 - (6 * d2) / (n * (n * n - 1)), 12);
  });

  it('is +-1 for any monotonic relation, where Pearson is not', () => {
    const x = [1, 2, 3, 4, 5, 6];
    const y = x.map((v) => Math.exp(v));
    expect(spearman(x, y)).toBeCloseTo(1, 12);
    expect(spearman(x, y.map((v) => -v))).toBeCloseTo(-1, 12);
    expect(pearson(x, y)!).toBeLessThan(0.95);
  });

  it('is null for a constant series', () => {
    expect(spearman([1, 2, 3], [4, 4, 4])).toBeNull();
  });
});
