import { describe, expect, it } from 'vitest';
import { summarizeZcs, zcsIntervals } from './zcs.js';
import { windowSpan } from './measure.js';
import { modeOfWindow } from './mode.js';
import { spanPeak } from './window.js';
import { aboveResonanceSet, belowResonanceSet, resonantSet } from './models.test-support.js';
import { synthesize } from './synthetic.test-support.js';
import type { Waveforms } from './types.js';

const level = (w: Waveforms) => 0.01 * Math.max(...w.diodes.map((d) => Math.max(...d.current)));

describe('rectifier ZCS per conduction interval (docs/method.md#zcs, #zvs)', () => {
  it('fs = fr: the diode current reaches zero exactly at the edge -> ZCS', () => {
    // docs/method.md#zcs: at fs = fr the diode current reaches zero at the primary edge.
    const w = resonantSet({ vin: 400, lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, load: 4 });
    const iv = zcsIntervals(w, windowSpan(w, { tStart: 2 / w.fs, cycles: 5 }), level(w));
    expect(iv).toHaveLength(10); // one per diode per cycle
    expect(iv.filter((c) => c.polarity === 'P').every((c) => c.diode === 0)).toBe(true);
    const s = summarizeZcs(iv, 0.05);
    expect(s.zcs).toBe(true);
    expect(s.zcsRatio).toBeLessThan(1e-9);
  });

  it('below resonance (PO): the current has died before the edge -> ZCS, ratio 0', () => {
    const w = belowResonanceSet({ fs: 80e3, fn: 0.8, ipk: 5, im: 2 }, { deadTime: 100e-9 });
    const s = summarizeZcs(zcsIntervals(w, windowSpan(w, { tStart: 2 / w.fs, cycles: 4 }), level(w)), 0.05);
    expect(s).toEqual({ zcs: true, zcsRatio: 0 });
  });

  it('above resonance (NP): the edge cuts the current -> not ZCS, ratio from the construction', () => {
    const fs = 125e3;
    const half = 0.5 / fs;
    const tc = 0.08 * half;
    const td = 100e-9;
    const w = aboveResonanceSet({ fs, fn: 1.25, ipk: 5, im: 2, tc }, { deadTime: td });
    const iv = zcsIntervals(w, windowSpan(w, { tStart: 2 / fs, cycles: 4 }), level(w));
    expect(iv).toHaveLength(8);
    // Cut at the high-side gate fall (half - td/2): Ipk sin(wr (half - td/2 - tc)) over the arc peak Ipk.
    const wr = (2 * Math.PI * fs) / 1.25;
    const expected = Math.sin(wr * (half - td / 2 - tc));
    for (const c of iv) expect(c.ratio).toBeCloseTo(expected, 6);
    const s = summarizeZcs(iv, 0.05);
    expect(s.zcs).toBe(false);
    expect(s.zcsRatio).toBeCloseTo(expected, 6);
  });

  it('PON: a diode that conducts across an edge of the other polarity is not counted as cut', () => {
    // Invented PON shape: P from the edge (starting at +x, carried over from the previous half's N)
    // down to 0 at L = 0.4 half, O, then N ramping to -x at the next edge. D1 conducts across the
    // low-side gate fall, which drives it (not cuts it); it ends naturally -> ratio 0.
    const fs = 100e3;
    const half = 0.5 / fs;
    const L = 0.4 * half;
    const x = 1;
    const isec = (u: number) =>
      u < L ? x + 4 * Math.sin((Math.PI * u) / L) - (x * u) / L : u < 0.85 * half ? 0 : (-x * (u - 0.85 * half)) / (0.15 * half);
    const mag = (u: number) => -1 + (2 * u) / half;
    const w = synthesize(
      { inverter: 'half-bridge', rectifier: 'center-tapped', vin: 400, fs, n: 4, vout: 50, load: 4, deadTime: 100e-9, cycles: 6, pointsPerCycle: 3000 },
      { tank: (u) => mag(u) + isec(u), magnetizing: mag, crAc: (u) => -50 * Math.cos(2 * Math.PI * fs * u), kinks: [L, 0.85 * half] },
    );
    const span = windowSpan(w, { tStart: 2 / fs, cycles: 3 });
    const iv = zcsIntervals(w, span, level(w));
    expect(iv).toHaveLength(6);
    expect(summarizeZcs(iv, 0.05)).toEqual({ zcs: true, zcsRatio: 0 });
    expect(modeOfWindow(w, span, spanPeak(span, w.secondaryCurrentReferred), 0.02, 0.02)).toBe('PON');
  });

  it('no conduction: with every diode current zero there are no intervals, zcs true, ratio 0', () => {
    const base = resonantSet({ vin: 400, lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, load: 4 });
    const w: Waveforms = { ...base, diodes: base.diodes.map((d) => ({ ...d, current: new Float64Array(d.current.length) })) };
    const span = windowSpan(w, { tStart: 2 / w.fs, cycles: 2 });
    // the same set with its real diode currents has 4 intervals in 2 cycles: the check can fail
    expect(zcsIntervals(base, span, level(base))).toHaveLength(4);
    // measure() passes level 0 when no diode conducts; a positive level must not find any either
    for (const lv of [0, 1e-3]) expect(zcsIntervals(w, span, lv)).toEqual([]);
    expect(summarizeZcs(zcsIntervals(w, span, 0), 0.05)).toEqual({ zcs: true, zcsRatio: 0 });
  });
});
