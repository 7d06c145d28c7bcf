import { describe, expect, it } from 'vitest';
import { settleErrorOf } from './steady.js';

// A first-order approach v_k = V (1 - e r^k) is a geometric sequence: the tail still to come after
// window n is d_n r / (1 - r), exactly what Aitken's delta-squared extrapolation recovers (standard
// result for geometric sequences; e.g. any numerical-analysis text on series acceleration).
describe('settleErrorOf', () => {
  const V = 24;
  const seq = (e: number, r: number, n: number) => Array.from({ length: n }, (_, k) => V * (1 - e * r ** k));

  it('estimates the exact remaining error of a monotone geometric approach', () => {
    const avgs = seq(0.01, 0.8, 3);
    const remaining = (V - avgs[2]!) / avgs[2]!;
    expect(settleErrorOf(avgs, 1e-4, 0, Infinity)).toBeCloseTo(remaining, 12);
  });

  it('does not call a slow drift settled just because two windows look alike', () => {
    const avgs = seq(0.05, 0.99, 3); // each window changes by only 0.05 %, yet 5 % is still to come
    expect(Math.abs(avgs[2]! - avgs[1]!) / avgs[2]!).toBeLessThan(1e-3);
    expect(settleErrorOf(avgs, 1e-4, 0, Infinity)).toBeGreaterThan(0.04);
  });

  it('caps the tail by the longest output time constant (RL Co), so noise near ratio 1 cannot block settling', () => {
    const avgs = [V, V * (1 + 1e-7), V * (1 + 2e-7)];
    // ratio 1: the bound is change x tauMax / window = 1e-7 x 10 = 1e-6
    expect(settleErrorOf(avgs, 1e-4, 0, 1e-3)).toBeCloseTo(1e-6 / (1 + 2e-7), 9);
  });

  it('an oscillation is judged by the last change and its projection over tau', () => {
    const avgs = [V, V * 1.001, V * 0.9995];
    const change = Math.abs(avgs[2]! - avgs[1]!) / avgs[2]!;
    expect(settleErrorOf(avgs, 1e-4, 0, Infinity)).toBeCloseTo(change, 12);
    expect(settleErrorOf(avgs, 1e-4, 3e-4, Infinity)).toBeCloseTo(change * 3, 12);
  });

  it('needs two windows to judge', () => {
    expect(settleErrorOf([V], 1e-4, 0, 1)).toBe(Infinity);
  });
});
