import { describe, expect, it } from 'vitest';
import { locate, makeSpan, sliceWindow, spanAverage, spanPeak, spanRms, spanStats, valueAt } from './window.js';
import { warpedGrid } from './synthetic.test-support.js';

const f = 50e3;
const T = 1 / f;
const map = (t: Float64Array, g: (x: number) => number) => t.map(g);
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('window statistics on non-uniform grids', () => {
  // 3 periods, 20k points per period, steps varying 0.4x..1.6x; the window starts and ends mid-segment.
  const t = warpedGrid(3 * T, 60_000);
  const span = makeSpan(t, 0.2371 * T, 2.2371 * T);

  it('grid really is non-uniform', () => {
    let lo = Infinity;
    let hi = 0;
    for (let i = 1; i < t.length; i++) {
      lo = Math.min(lo, t[i] - t[i - 1]);
      hi = Math.max(hi, t[i] - t[i - 1]);
    }
    expect(hi / lo).toBeGreaterThan(3);
  });

  it('sine: RMS = peak / sqrt(2), average 0', () => {
    // Standard result (closed form): (1/T) integral of sin^2 over whole periods = 1/2.
    const y = map(t, (x) => 7 * Math.sin(2 * Math.PI * f * x));
    expect(rel(spanRms(span, y), 7 / Math.SQRT2)).toBeLessThan(1e-6);
    expect(Math.abs(spanAverage(span, y))).toBeLessThan(1e-6 * 7);
    expect(rel(spanPeak(span, y), 7)).toBeLessThan(1e-6);
  });

  it('triangle: RMS = peak / sqrt(3)', () => {
    // Standard result (closed form): (1/T) integral of (2x/T - 1)^2 over a period = 1/3.
    const tri = (x: number) => {
      const u = (((x / T) % 1) + 1) % 1;
      return 4 * (u < 0.5 ? 4 * u - 1 : 3 - 4 * u);
    };
    expect(rel(spanRms(span, map(t, tri)), 4 / Math.sqrt(3))).toBeLessThan(1e-6);
    // With the vertices on the grid the PWL data is the triangle itself: exact to rounding.
    const verts = Array.from({ length: 7 }, (_, k) => (k * T) / 2);
    const tv = warpedGrid(3 * T, 999, verts);
    const s = spanStats(makeSpan(tv, T / 2, (5 * T) / 2), map(tv, tri));
    expect(rel(s.rms, 4 / Math.sqrt(3))).toBeLessThan(1e-12);
    expect(Math.abs(s.avg)).toBeLessThan(1e-12);
    expect(s.max).toBe(4);
    expect(s.min).toBe(-4);
  });

  it('full-wave rectified sine: average = (2/pi) peak', () => {
    // Standard result (closed form): (1/pi) integral_0^pi sin = 2/pi.
    const y = map(t, (x) => 3 * Math.abs(Math.sin(2 * Math.PI * f * x)));
    expect(rel(spanAverage(span, y), (2 / Math.PI) * 3)).toBeLessThan(1e-6);
    // its RMS is that of the sine: peak / sqrt(2)
    expect(rel(spanRms(span, y), 3 / Math.SQRT2)).toBeLessThan(1e-6);
  });
});

describe('window ends interpolate', () => {
  // y = 3 + 2t on a coarse non-uniform grid: the PWL interpolant is the line itself.
  const t = Float64Array.from([0, 0.4, 1.7, 3]);
  const y = map(t, (x) => 3 + 2 * x);
  const span = makeSpan(t, 0.2, 2.5);

  it('slices with exact end values', () => {
    const s = sliceWindow(span, y);
    expect(Array.from(s.t)).toEqual([0.2, 0.4, 1.7, 2.5]);
    expect(s.y[0]).toBeCloseTo(3.4, 14);
    expect(s.y[3]).toBeCloseTo(8, 14);
  });

  it('average, RMS and extremes of a line equal the calculus values', () => {
    // Closed form: integral of (3 + 2t)^2 dt = (3 + 2t)^3 / 6.
    const st = spanStats(span, y);
    expect(st.avg).toBeCloseTo(3 + 2 * 1.35, 12);
    const ms = ((3 + 2 * 2.5) ** 3 - (3 + 2 * 0.2) ** 3) / 6 / 2.3;
    expect(st.rms).toBeCloseTo(Math.sqrt(ms), 12);
    expect(st.min).toBeCloseTo(3.4, 14);
    expect(st.max).toBeCloseTo(8, 14);
  });

  it('a window inside one segment and one ending exactly on a sample', () => {
    expect(spanAverage(makeSpan(t, 0.5, 0.6), y)).toBeCloseTo(4.1, 12);
    expect(spanAverage(makeSpan(t, 0.4, 1.7), y)).toBeCloseTo(3 + 2 * 1.05, 12);
  });

  it('locate and valueAt', () => {
    const p = locate(t, 1.05);
    expect(p.i).toBe(1);
    expect(p.f).toBeCloseTo(0.5, 14);
    expect(valueAt(y, p)).toBeCloseTo(5.1, 14);
    expect(locate(t, -1)).toEqual({ t: 0, i: 0, f: 0 });
    expect(locate(t, 9)).toEqual({ t: 3, i: 2, f: 1 });
  });

  it('refuses empty, reversed, short or out-of-range windows', () => {
    expect(() => makeSpan(t, 1, 1)).toThrow(/empty window/);
    expect(() => makeSpan(t, 2, 1)).toThrow(/empty window/);
    expect(() => makeSpan(t, 0, 3.5)).toThrow(/outside the data/);
    expect(() => makeSpan(Float64Array.from([0]), 0, 1)).toThrow(/at least 2/);
  });
});
