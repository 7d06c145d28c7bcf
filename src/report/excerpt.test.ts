import { describe, expect, it } from 'vitest';
import { excerpt, EXCERPT_POINTS } from './excerpt.js';
import { resonantSet } from '../measure/models.test-support.js';

// Synthetic waveforms of the ideal converter at fs = fr (closed form, docs/method.md#tank-currents)
// on a non-uniform grid, with a dead time so the gate edges sit at known times.
const td = 200e-9;
const tank = { vin: 400, lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, load: 4 };
const w = resonantSet(tank, { deadTime: td, cycles: 8 });
const T = 1 / w.fs;

describe('waveform excerpt for the report', () => {
  const x = excerpt('c1', w, 2 * T, 6);

  it('keeps the last 2 cycles of the window on an even grid of EXCERPT_POINTS from 0', () => {
    expect(x.t).toHaveLength(EXCERPT_POINTS);
    expect(x.t[0]).toBe(0);
    expect(Math.abs(x.t.at(-1)! / (2 * T) - 1)).toBeLessThan(5e-6); // values keep 6 significant digits
    expect(Object.keys(x.series)).toEqual(expect.arrayContaining(['tankCurrent', 'magnetizingCurrent', 'bridgeVoltage', 'crVoltage', 'vout']));
    expect(x.series['tankCurrent']).toHaveLength(EXCERPT_POINTS);
  });

  it('samples the signals where they are: the magnetizing triangle within 1e-4 of its peak', () => {
    // i_m = -Im + (n Vo / Lm) tau over each half period from the middle of the dead time (models.test-support)
    const vo = 200 / tank.n;
    const im = (tank.n * vo) / (4 * w.fs * tank.lm);
    const t0 = 6 * T;
    x.t.forEach((tt, k) => {
      const tau = (((t0 + tt) % T) + T) % T;
      const half = tau < T / 2 ? tau : tau - T / 2;
      const sign = tau < T / 2 ? 1 : -1;
      const expected = sign * (-im + ((tank.n * vo) / tank.lm) * half);
      // the source grid has 3000 points per cycle: a turnaround between two samples is cut by up to
      // slope x step, ~1e-4 of the peak
      expect(Math.abs(x.series['magnetizingCurrent']![k]! - expected)).toBeLessThan(1e-4 * im);
    });
  });

  it('marks the high-side turn-on edges at k T + td / 2 (interpolated like the measurements)', () => {
    expect(x.edges).toHaveLength(2);
    x.edges.forEach((e, k) => expect(Math.abs(e / (k * T + td / 2) - 1)).toBeLessThan(5e-6));
  });
});
