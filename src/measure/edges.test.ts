import { describe, expect, it } from 'vitest';
import { findCrossings } from './edges.js';
import { warpedGrid } from './synthetic.test-support.js';

describe('findCrossings', () => {
  const f = 100e3;
  const t = warpedGrid(4 / f, 40_000);
  const y = t.map((x) => Math.sin(2 * Math.PI * f * x));

  it('finds the zero crossings of a sine at k / (2 f)', () => {
    // Closed form: sin(2 pi f t) = 0 at t = k / (2 f), rising at even k.
    const rise = findCrossings(t, y, 0, 'rise', 0.5 / f, 3.9 / f);
    const fall = findCrossings(t, y, 0, 'fall', 0, 4 / f);
    expect(rise.map((p) => p.t * f)).toEqual([1, 2, 3].map((k) => expect.closeTo(k, 9)));
    expect(fall.map((p) => p.t * f)).toEqual([0.5, 1.5, 2.5, 3.5].map((k) => expect.closeTo(k, 9)));
  });

  it('interpolates a level crossing inside a segment and keeps [from, to) half-open', () => {
    const tt = Float64Array.from([0, 1, 3, 4, 6]);
    const yy = Float64Array.from([0, 1, 0, 1, 0]);
    expect(findCrossings(tt, yy, 0.5, 'rise', 0, 10).map((p) => p.t)).toEqual([0.5, 3.5]);
    expect(findCrossings(tt, yy, 0.5, 'fall', 0, 10).map((p) => p.t)).toEqual([2, 5]);
    expect(findCrossings(tt, yy, 0.5, 'rise', 0.5, 3.5).map((p) => p.t)).toEqual([0.5]);
  });

  it('counts a sample lying exactly on the level once (on = at or above the level)', () => {
    const tt = Float64Array.from([0, 1, 2, 3, 4]);
    const yy = Float64Array.from([0, 0.5, 1, 0.5, 0]);
    expect(findCrossings(tt, yy, 0.5, 'rise', 0, 4).map((p) => p.t)).toEqual([1]);
    expect(findCrossings(tt, yy, 0.5, 'fall', 0, 4).map((p) => p.t)).toEqual([3]);
    // ending exactly on the level is not yet a fall
    expect(findCrossings(tt.subarray(0, 4), yy.subarray(0, 4), 0.5, 'fall', 0, 3)).toEqual([]);
  });
});
