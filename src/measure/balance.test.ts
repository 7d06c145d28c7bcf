import { describe, expect, it } from 'vitest';
import { isSettled, stateBalance, type BalanceTraces } from './balance.js';
import { warpedGrid } from './synthetic.test-support.js';

// Synthetic windows with known answers. A centre-tapped rectifier delivers |sin| pulses: their average
// over whole half periods is (2/pi) of the peak (standard result), so a pulse peak of (pi/2) I gives
// an average of exactly I. The capacitor current is that minus the load current.
const fs = 100e3;
const T = 1 / fs;
const CYCLES = 12;
const LOAD = 2.4; // ohm: Io = 10 A at 24 V
const TOL = { vout: 1e-3, chargeBalance: 0.01, periodicity: 0.01 };

/** Deterministic zero-mean "noise": incommensurate sines (no random source in tests). */
const noise = (x: number) => Math.sin(2 * Math.PI * 7.31 * fs * x) + 0.7 * Math.sin(2 * Math.PI * 13.7 * fs * x + 1) + 0.5 * Math.sin(2 * Math.PI * 29.3 * fs * x + 2);

function window(opts: { delivered: number; vout?: (x: number) => number; growth?: number; noise?: number }): BalanceTraces {
  // vertices of |sin| at every half period lie on the grid, so the PWL average is accurate
  const t = warpedGrid(CYCLES * T, CYCLES * 2000, Array.from({ length: 2 * CYCLES + 1 }, (_, k) => (k * T) / 2));
  const io = 10;
  const vout = t.map(opts.vout ?? (() => 24));
  const amp = (x: number) => 1 + (opts.growth ?? 0) * (x / (CYCLES * T));
  return {
    t, vout,
    outputCapCurrent: t.map((x) => (Math.PI / 2) * opts.delivered * Math.abs(Math.sin(2 * Math.PI * fs * x)) - io + (opts.noise ?? 0) * io * noise(x)),
    tankCurrent: t.map((x) => amp(x) * 3 * Math.cos(2 * Math.PI * fs * x)), // at its peak at the window ends
    crVoltage: t.map((x) => 200 + amp(x) * 90 * Math.sin(2 * Math.PI * fs * x)),
  };
}

describe('stateBalance on synthetic windows', () => {
  it('balanced: the rectifier delivers exactly Io, the tank repeats', () => {
    const b = stateBalance(window({ delivered: 10 }), 0, CYCLES * T, LOAD);
    expect(Math.abs(b.chargeBalance)).toBeLessThan(1e-5);
    expect(b.periodicity).toBeLessThan(1e-6);
    expect(b.iout).toBeCloseTo(10, 12);
    expect(isSettled(0, b, TOL)).toBe(true);
  });

  it('imbalanced with a perfectly flat Vout: 10 % short is caught although the voltage criterion passes', () => {
    // Behind a large capacitor the voltage barely moves: here it does not move at all.
    const b = stateBalance(window({ delivered: 9 }), 0, CYCLES * T, LOAD);
    expect(b.chargeBalance).toBeCloseTo(-0.1, 4);
    expect(isSettled(0, b, TOL)).toBe(false);
  });

  it('a tank amplitude still growing by 2 % per window is not periodic', () => {
    const b = stateBalance(window({ delivered: 10, growth: 0.02 }), 0, CYCLES * T, LOAD);
    // the current ends at its peak, 2 % above where it started; the window's peak is 1.02 x 3 A: 0.06 / 3.06
    expect(b.periodicity).toBeGreaterThan(0.019);
    expect(b.periodicity).toBeLessThan(0.021);
    expect(isSettled(0, b, TOL)).toBe(false);
  });

  it('noisy: zero-mean noise of 30 % of Io on the capacitor current does not hide a 3 % imbalance nor fake one', () => {
    const balanced = stateBalance(window({ delivered: 10, noise: 0.3 }), 0, CYCLES * T, LOAD);
    expect(Math.abs(balanced.chargeBalance)).toBeLessThan(0.002);
    expect(isSettled(0, balanced, TOL)).toBe(true);
    const short = stateBalance(window({ delivered: 9.7, noise: 0.3 }), 0, CYCLES * T, LOAD);
    expect(short.chargeBalance).toBeGreaterThan(-0.032);
    expect(short.chargeBalance).toBeLessThan(-0.028);
    expect(isSettled(0, short, TOL)).toBe(false);
  });

  it('Vout not settled fails the criterion even with balance and periodicity', () => {
    const b = stateBalance(window({ delivered: 10 }), 0, CYCLES * T, LOAD);
    expect(isSettled(2e-3, b, TOL)).toBe(false);
    expect(isSettled(NaN, b, TOL)).toBe(false);
  });
});
