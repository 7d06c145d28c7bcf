import { describe, expect, it } from 'vitest';
import { reducedRankExtrapolation } from './extrapolate.js';
import { extrapolateSeed, MAX_EXTRAPOLATION_STEP } from './seed.js';
import { windowSettle } from './settle.js';

// A linear fixed-point iteration x_{k+1} = A x_k + b converges to x* = (I - A)^-1 b. RRE applied to
// k + 1 differences of a sequence whose error has at most k modes returns x* exactly (up to
// rounding): A. Sidi, "Vector Extrapolation Methods with Applications", SIAM, 2017, ch. 1-2.
function iterate(a: number[][], b: number[], x0: number[], n: number): number[][] {
  const xs = [x0];
  for (let k = 0; k < n; k++) {
    const x = xs[k]!;
    xs.push(a.map((row, i) => row.reduce((s, v, j) => s + v * x[j]!, 0) + b[i]!));
  }
  return xs;
}

describe('reducedRankExtrapolation', () => {
  // A 4x4 map with a slow real mode (0.97), a lightly damped complex pair (|z| = 0.9, about 20
  // iterations per turn: the beat of a tank with its output capacitor) and a fast mode (0.1).
  const r = 0.9;
  const th = (2 * Math.PI) / 20;
  const a = [
    [0.97, 0, 0, 0],
    [0, r * Math.cos(th), -r * Math.sin(th), 0],
    [0, r * Math.sin(th), r * Math.cos(th), 0],
    [0, 0, 0, 0.1],
  ];
  // A mixing basis change so that every component carries every mode: a Householder reflection
  // Q = I - 2 v v^T / (v^T v), orthogonal and its own inverse.
  const v = [1, -2, 0.5, 1.5];
  const vv = v.reduce((s, x) => s + x * x, 0);
  const q = v.map((vi, i) => v.map((vj, j) => (i === j ? 1 : 0) - (2 * vi * vj) / vv));
  const mul = (x: number[][], y: number[][]) => x.map((row) => y[0]!.map((_, j) => row.reduce((s, w, k) => s + w * y[k]![j]!, 0)));
  const A = mul(mul(q, a), q);
  const xStar = [24, 5, 1.5, 300];
  // b = (I - A) x* puts the fixed point at x*
  const b = xStar.map((v, i) => v - A[i]!.reduce((s, w, j) => s + w * xStar[j]!, 0));

  it('returns the fixed point of a linear map with four modes from five differences, to rounding', () => {
    const xs = iterate(A, b, [23.5, 4.2, 1.1, 290], 7).slice(2);
    const s = reducedRankExtrapolation(xs)!;
    // the last iterate is still far off (slow mode 0.97^7 and the ring), the limit is exact
    expect(Math.abs(xs.at(-1)![0]! - 24)).toBeGreaterThan(0.05);
    // within 5e-5: the rounding-level ridge (1e-15 x trace) and the elimination leave about 1e-6 relative
    s.forEach((v, i) => expect(v).toBeCloseTo(xStar[i]!, 4));
  });

  it('returns the last state of a sequence that does not move, and null for too short or non-finite input', () => {
    expect(reducedRankExtrapolation([[1, 2], [1, 2], [1, 2]])).toEqual([1, 2]);
    expect(reducedRankExtrapolation([[1, 2]])).toBeNull();
    expect(reducedRankExtrapolation([[1, 2], [NaN, 2]])).toBeNull();
  });
});

describe('extrapolateSeed', () => {
  const seed = (vo: number, ir: number) => ({ vo, ir, im: 0.5, vcr: 100, va: 0, vb: 0 });
  const scales = { vo: 24, ir: 5, im: 1, vcr: 200 };

  it('moves only the four energy states, keeping the bridge nodes of the last state', () => {
    // first-order approach vo_k = 24 - 0.5 * 0.6^k, ir_k = 4 + 0.5 * 0.6^k: the limit is 24 V, 4 A
    const states = Array.from({ length: 6 }, (_, k) => ({ ...seed(24 - 0.5 * 0.6 ** k, 4 + 0.5 * 0.6 ** k), va: k }));
    const s = extrapolateSeed(states, scales)!;
    expect(s.vo).toBeCloseTo(24, 9);
    expect(s.ir).toBeCloseTo(4, 9);
    expect(s.im).toBeCloseTo(0.5, 12);
    expect(s.va).toBe(5);
  });

  it('refuses a limit further than MAX_EXTRAPOLATION_STEP of a scale from the last state (not yet near steady state)', () => {
    // ratio 0.95 per cycle: the limit lies 20 V beyond the last state, far outside 0.25 x 24 V
    const states = Array.from({ length: 6 }, (_, k) => seed(30 - 25 * 0.95 ** k, 4));
    expect(Math.abs(30 - states.at(-1)!.vo) / 24).toBeGreaterThan(MAX_EXTRAPOLATION_STEP);
    expect(extrapolateSeed(states, scales)).toBeNull();
  });

  it('needs three states', () => {
    expect(extrapolateSeed([seed(24, 4), seed(24.1, 4)], scales)).toBeNull();
  });
});

describe('windowSettle', () => {
  it('turns the average capacitor current into the distance to its equilibrium, R |avg(i_Co)| / Vout', () => {
    // 0.5 A still flowing into a capacitor that sees 40 mOhm: the equilibrium is 20 mV away, 0.0833 % of 24 V
    const w = windowSettle([24, 24], 0.5, 24, 0.04);
    expect(w.chargeShift).toBeCloseTo(0.02 / 24, 12);
    expect(w.halfChange).toBe(0);
    expect(w.error).toBeCloseTo(0.02 / 24, 12);
  });

  it('takes the change between the window halves when it is larger', () => {
    const w = windowSettle([24, 24.048], 0, 24.024, 0.04);
    expect(w.halfChange).toBeCloseTo(0.048 / 24.048, 12);
    expect(w.error).toBe(w.halfChange);
  });

  it('is Infinity, never NaN, for a window without output', () => {
    expect(windowSettle([0, 0], 0, 0, 0.04).error).toBe(Infinity);
  });
});
