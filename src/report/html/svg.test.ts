import { describe, expect, it } from 'vitest';
import { linearScale, linePath, niceDomain, simplify } from './svg.js';

describe('scales and ticks', () => {
  it('maps the domain ends onto the range ends, reversed for a y axis', () => {
    const s = linearScale(60e3, 150e3, 0, 300);
    expect(s(60e3)).toBe(0);
    expect(s(150e3)).toBe(300);
    expect(s(105e3)).toBeCloseTo(150, 12);
    const y = linearScale(0.8, 1.4, 200, 0);
    expect(y(1.4)).toBeCloseTo(0, 12);
  });

  it('widens to whole 1-2-5 steps that cover the data', () => {
    const d = niceDomain(0.83, 1.38, 6);
    expect(d.d0).toBeCloseTo(0.8, 12);
    expect(d.d1).toBeCloseTo(1.4, 12);
    expect(d.ticks).toEqual([0.8, 0.9, 1, 1.1, 1.2, 1.3, 1.4]);
    expect(niceDomain(5, 5).ticks.length).toBeGreaterThan(1); // flat data still gets an axis
  });
});

describe('linePath', () => {
  const sx = linearScale(0, 1, 0, 100);
  const sy = linearScale(0, 1, 100, 0);

  it('starts a new subpath after a null or non-finite value', () => {
    const d = linePath([0, 0.1, 0.2, 0.3, 0.4], [0.5, 0.7, null, 0.2, Number.NaN], sx, sy);
    expect(d).toBe('M0 50L10 30M30 80');
  });

  it('reduces collinear points to the two ends', () => {
    const xs = Array.from({ length: 600 }, (_, i) => i / 599);
    expect(linePath(xs, xs.map((x) => 0.2 + 0.5 * x), sx, sy)).toBe('M0 80L100 30');
  });

  it('keeps a sine within the tolerance of every sample while dropping most points', () => {
    const n = 600;
    const flat: number[] = [];
    for (let i = 0; i < n; i++) flat.push((600 * i) / (n - 1), 40 + 35 * Math.sin((4 * Math.PI * i) / (n - 1)));
    const keep = simplify(flat, 0.25);
    expect(keep.length).toBeLessThan(n / 3);
    // Distance of every dropped sample to the kept polyline segment spanning it (closed form: point-line distance).
    for (let k = 1; k < keep.length; k++) {
      const a = keep[k - 1]!;
      const b = keep[k]!;
      const [ax, ay, bx, by] = [flat[2 * a]!, flat[2 * a + 1]!, flat[2 * b]!, flat[2 * b + 1]!];
      for (let i = a + 1; i < b; i++) {
        const d = Math.abs((by - ay) * (flat[2 * i]! - ax) - (bx - ax) * (flat[2 * i + 1]! - ay)) / Math.hypot(bx - ax, by - ay);
        expect(d).toBeLessThanOrEqual(0.25);
      }
    }
  });
});
