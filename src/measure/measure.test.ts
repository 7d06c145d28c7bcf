import { describe, expect, it } from 'vitest';
import { measure } from './measure.js';
import { aboveResonanceSet, resonantSet, sineSet } from './models.test-support.js';
import { synthesize } from './synthetic.test-support.js';
import type { SimMetrics, Waveforms } from './types.js';

// Measurement arithmetic on synthetic waveform sets (plumbing: the sets build in the physics, see
// synthetic.test-support.ts). Tank of shared/checks/worked-example.json (HB, CT, ideal diodes): Vin 400 V, Lr 50 uH, Cr 50 nF, Lm 250 uH, n 4, RL 4 ohm.
const tank = { vin: 400, lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, load: 4 };
const fr = 1 / (2 * Math.PI * Math.sqrt(tank.lr * tank.cr));
const zr = Math.sqrt(tank.lr / tank.cr);
const rel = (a: number, b: number) => Math.abs(a / b - 1);
const win = (w: Waveforms, cycles = 5) => ({ tStart: 2 / w.fs, cycles });

describe('ideal converter at fs = fr (docs/method.md#stresses, derived from circuit laws)', () => {
  const w = resonantSet(tank);
  const m = measure(w, win(w));
  const vo = 200 / tank.n; // M = 1 at fn = 1 for every load (docs/method.md#gain-limits): Vo = Vin_eff / n
  const io = vo / tank.load;
  const im = (tank.n * vo) / (4 * fr * tank.lm); // Im,pk (square voltage), 3.1
  const irRms = Math.sqrt(((Math.PI * io) / (2 * Math.SQRT2 * tank.n)) ** 2 + im ** 2 / 2); // 3.1 exact at fr
  const irPk = Math.sqrt(((Math.PI * io) / (2 * tank.n)) ** 2 + im ** 2);

  it('fs, gain, vout, iout, pout', () => {
    expect(rel(m.fs, fr)).toBeLessThan(1e-9);
    expect(m.gain).toBeCloseTo(1, 9); // HB: Vin_eff = Vin / 2
    expect(m.vout).toBeCloseTo(vo, 9);
    expect(m.iout).toBeCloseTo(io, 9);
    expect(m.pout).toBeCloseTo(vo * io, 6);
  });

  it('tank current RMS and peak equal the exact fs = fr expressions', () => {
    expect(rel(m.tankCurrentRms, irRms)).toBeLessThan(1e-5); // exact for piecewise-linear data; 1e-5 covers the sampling
    expect(rel(m.tankCurrentPeak, irPk)).toBeLessThan(1e-6);
    expect(rel(m.magnetizingCurrentPeak, im)).toBeLessThan(1e-9);
  });

  it('switch RMS = Ir,rms / sqrt(2) and turn-off current = Im,pk (docs/method.md#switches)', () => {
    expect(rel(m.switchCurrentRms, irRms / Math.SQRT2)).toBeLessThan(1e-3); // step at the half-period sampled once
    expect(rel(m.switchTurnOffCurrent, im)).toBeLessThan(1e-6);
  });

  it('Cr voltage = Vin/2 +- Ir,pk Zr (docs/method.md#cr-voltage)', () => {
    expect(rel(m.crVoltagePeak, 200 + irPk * zr)).toBeLessThan(1e-6);
    expect(rel(m.crVoltageMin, 200 - irPk * zr)).toBeLessThan(1e-5);
  });

  it('diode average Io/2 and reverse voltage 2 Vo for CT (docs/method.md#diodes)', () => {
    expect(rel(m.diodeCurrentAvg, io / 2)).toBeLessThan(1e-5);
    expect(m.diodeReverseVoltage).toBeCloseTo(2 * vo, 9);
    expect(m.diodeReverseCurrent).toBe(0);
  });

  it('mode P, ZCS, inductive', () => {
    expect(m.mode).toBe('P');
    expect(m.zcs).toBe(true);
    expect(m.region).toBe('inductive');
  });
});

describe('Lm -> infinity: half-sine secondary (docs/method.md#diodes, #output-ripple; Erickson & Maksimovic 2nd ed. ch. 19, from memory)', () => {
  const w = resonantSet({ ...tank, lm: 1e3 });
  const m = measure(w, win(w));
  const io = 50 / tank.load;
  it('diode peak (pi/2) Io, rms (pi/4) Io, capacitor ripple Io sqrt(pi^2/8 - 1), tank rms pi Io / (2 sqrt2 n)', () => {
    expect(rel(m.diodeCurrentPeak, (Math.PI / 2) * io)).toBeLessThan(1e-6);
    expect(rel(m.diodeCurrentRms, (Math.PI / 4) * io)).toBeLessThan(1e-5);
    expect(rel(m.outputRippleCurrentRms, io * Math.sqrt(Math.PI ** 2 / 8 - 1))).toBeLessThan(1e-5);
    expect(rel(m.tankCurrentRms, (Math.PI * io) / (2 * Math.SQRT2 * tank.n))).toBeLessThan(1e-5);
  });
});

describe('full-bridge inverter and rectifier', () => {
  const w = resonantSet(tank, { inverter: 'full-bridge', rectifier: 'full-bridge' });
  const m = measure(w, win(w));
  it('Vin_eff = Vin: Vo = Vin / n at gain 1; FBR diode average Io/2, reverse Vo (docs/method.md#gain, #diodes)', () => {
    expect(m.gain).toBeCloseTo(1, 9);
    expect(m.vout).toBeCloseTo(100, 9);
    expect(rel(m.diodeCurrentAvg, 100 / tank.load / 2)).toBeLessThan(1e-5);
    expect(m.diodeReverseVoltage).toBeCloseTo(100, 9);
    expect(m.mode).toBe('P');
  });
});

describe('output ripple, power and the load fallback', () => {
  it('ripple a sin(2 ws t): pp = 2a, pout = (Vo^2 + a^2/2) / R (closed form: mean of sin^2 = 1/2)', () => {
    const w = resonantSet(tank, { voutRipple: 0.5, pointsPerCycle: 6000 });
    const m = measure(w, win(w));
    expect(m.voutRipple).toBeCloseTo(1, 4);
    expect(rel(m.pout, (50 ** 2 + 0.125) / 4)).toBeLessThan(1e-7);
  });

  it('without load: iout from the rectifier current balance', () => {
    const w = { ...resonantSet(tank), load: undefined };
    const m = measure(w, win(w));
    expect(rel(m.iout, 12.5)).toBeLessThan(1e-5);
    expect(rel(m.pout, 625)).toBeLessThan(1e-5);
  });
});

describe('whole pipeline on the invented sets (edges shared between the measurements)', () => {
  it('above resonance: NP, hard commutation, ZVS with the complete node swing', () => {
    const fs = 125e3;
    const w = aboveResonanceSet({ fs, fn: 1.25, ipk: 5, im: 2, tc: 0.04 / fs }, { deadTime: 100e-9 });
    const m = measure(w, win(w, 4));
    expect([m.mode, m.zcs, m.zvs, m.region]).toEqual(['NP', false, true, 'inductive']);
    expect(m.zcsRatio).toBeGreaterThan(0.5);
  });

  it('leading tank current: capacitive, turn-off current negative', () => {
    const w = sineSet(100e3, 3, 0.3, { deadTime: 100e-9 });
    const m = measure(w, win(w, 4));
    expect(m.region).toBe('capacitive');
    expect(m.switchTurnOffCurrent).toBeLessThan(0);
  });
});

describe('no rectifier conduction', () => {
  it('diode metrics 0, zcs true, mode O, nothing NaN', () => {
    const fs = 100e3;
    const tri = (x: number) => -2 + 4 * fs * 2 * x;
    const w = synthesize(
      { inverter: 'half-bridge', rectifier: 'center-tapped', vin: 400, fs, n: 4, vout: 50, load: 4, deadTime: 100e-9, cycles: 6, pointsPerCycle: 2000 },
      { tank: tri, magnetizing: tri, crAc: (x) => -50 * Math.cos(2 * Math.PI * fs * x) },
    );
    const m = measure(w, win(w, 3));
    for (const k of Object.keys(m) as (keyof SimMetrics)[]) {
      if (typeof m[k] === 'number') expect(Number.isFinite(m[k]), k).toBe(true);
    }
    expect([m.diodeCurrentAvg, m.diodeCurrentPeak, m.diodeCurrentRms, m.diodeReverseCurrent]).toEqual([0, 0, 0, 0]);
    expect([m.zcs, m.zcsRatio, m.mode]).toEqual([true, 0, 'O']);
  });
});

describe('refusals', () => {
  const w = resonantSet(tank, { cycles: 4 });
  it('a window that is not whole cycles, or reaches past the data', () => {
    expect(() => measure(w, { tStart: 1 / w.fs, cycles: 2.5 })).toThrow(/whole number of switching cycles/);
    expect(() => measure(w, { tStart: 1 / w.fs, cycles: 0 })).toThrow(/whole number/);
    expect(() => measure(w, { tStart: 2 / w.fs, cycles: 3 })).toThrow(/outside the data/);
  });

  it('gate frequency different from the design fs', () => {
    expect(() => measure({ ...w, fs: w.fs * 1.01 }, { tStart: 0, cycles: 3 })).toThrow(/design fs/);
  });

  it('short or inconsistent data, bad options', () => {
    const t1 = Float64Array.from([0]);
    expect(() => measure({ ...w, t: t1 }, { tStart: 0, cycles: 1 })).toThrow(/at least 2 time points/);
    expect(() => measure({ ...w, vout: w.vout.subarray(1) }, { tStart: 0, cycles: 1 })).toThrow(/vout has/);
    expect(() => measure({ ...w, switches: w.switches.slice(0, 1) }, { tStart: 0, cycles: 1 })).toThrow(/2 switch traces/);
    expect(() => measure(w, { tStart: 0, cycles: 1 }, { zvsThreshold: 0.7 })).toThrow(/zvsThreshold/);
    const sparse = resonantSet(tank, { cycles: 4, pointsPerCycle: 4 });
    expect(() => measure(sparse, { tStart: 0, cycles: 3 })).toThrow(/samples in 3 cycles/);
  });
});
