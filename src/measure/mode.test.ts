import { describe, expect, it } from 'vitest';
import { labelRuns, modeOfWindow, stateRuns } from './mode.js';
import { windowSpan } from './measure.js';
import { spanPeak } from './window.js';
import { warpedGrid } from './synthetic.test-support.js';
import { aboveResonanceSet, belowResonanceSet, resonantSet } from './models.test-support.js';
import type { Waveforms } from './types.js';

describe('stateRuns', () => {
  it('splits a sine at +-eps at the arcsine times', () => {
    // Closed form: sin(x) > 0.5 for x in (pi/6, 5pi/6); < -0.5 for x in (7pi/6, 11pi/6).
    const t = warpedGrid(2 * Math.PI, 200_000);
    const runs = stateRuns(t, t.map(Math.sin), 0, 2 * Math.PI, 0.5);
    expect(runs.map((r) => r.state).join('')).toBe('OPONO');
    const want = [Math.PI / 6, (2 * Math.PI) / 3, Math.PI / 3, (2 * Math.PI) / 3, Math.PI / 6];
    runs.forEach((r, k) => expect(r.duration).toBeCloseTo(want[k], 8));
  });

  it('a single segment jumping from P to N passes through O for the time between the levels', () => {
    const t = Float64Array.from([0, 1, 3, 4]);
    const y = Float64Array.from([2, 2, -2, -2]);
    const runs = stateRuns(t, y, 0, 4, 1);
    expect(runs).toEqual([
      { state: 'P', duration: 1.5 },
      { state: 'O', duration: 1 },
      { state: 'N', duration: 1.5 },
    ]);
  });
});

describe('labelRuns', () => {
  it('drops spurious short runs and merges equal neighbours', () => {
    const runs = [
      { state: 'P' as const, duration: 0.5 },
      { state: 'O' as const, duration: 0.005 },
      { state: 'P' as const, duration: 0.4 },
      { state: 'N' as const, duration: 0.1 },
    ];
    expect(labelRuns(runs, 0.02)).toBe('PN');
    expect(labelRuns(runs, 0)).toBe('POPN');
    expect(labelRuns(runs, 1)).toBe('P'); // all short: the longest
  });
});

describe('mode of a window', () => {
  const mode = (w: Waveforms) => {
    const span = windowSpan(w, { tStart: 2 / w.fs, cycles: 4 });
    return modeOfWindow(w, span, spanPeak(span, w.secondaryCurrentReferred), 0.02, 0.02);
  };

  it('fs = fr: P for the whole half period (docs/method.md#tank-currents)', () => {
    expect(mode(resonantSet({ vin: 400, lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, load: 4 }))).toBe('P');
  });

  it('below resonance: PO', () => {
    expect(mode(belowResonanceSet({ fs: 80e3, fn: 0.8, ipk: 5, im: 2 }, { deadTime: 100e-9 }))).toBe('PO');
  });

  it('above resonance: NP, and P when the N tail is shorter than 2 % of the half period', () => {
    const fs = 125e3;
    const half = 0.5 / fs;
    expect(mode(aboveResonanceSet({ fs, fn: 1.25, ipk: 5, im: 2, tc: 0.08 * half }, { deadTime: 100e-9 }))).toBe('NP');
    // N visible inside the on-time for tc - td/2 = 0.015 half: spurious
    const short = aboveResonanceSet({ fs, fn: 1.1, ipk: 5, im: 2, tc: 0.025 * half }, { deadTime: 0.02 * half });
    expect(mode(short)).toBe('P');
  });
});
