import { describe, expect, it } from 'vitest';
import { ksCritical05, ksStatistic } from './ks.js';

describe('ksStatistic', () => {
  it('computes D by hand for three points against U(0, 1)', () => {
    // sorted 0.1, 0.5, 0.6: steps 1/3, 2/3, 1 -> max(1/3-0.1, 0.1, 2/3-0.5, 0.5-1/3, 1-0.6, 0.6-2/3) = 0.4
    expect(ksStatistic([0.6, 0.1, 0.5], (x) => x)).toBeCloseTo(0.4, 12);
  });

  it('uses Massey\'s asymptotic critical value 1.36/sqrt(n) at alpha 0.05', () => {
    expect(ksCritical05(100)).toBeCloseTo(0.136, 3);
  });
});
