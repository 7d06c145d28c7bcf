import { describe, expect, it } from 'vitest';
import { deadTimeZvs, predictCorner, tankConstants } from './predict.js';
import { expandCorners } from '../corners/expand.js';
import { makeDesign } from '../../tests/support/design.js';
import { readChecks } from '../../tests/support/checks.js';
import type { Design } from '../design/types.js';

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

function only(design: Design) {
  const [c] = expandCorners(design);
  return { corner: c!, fha: predictCorner(design, c!) };
}

// Worked example: shared/checks/worked-example.json (invented operating point; FHA values evaluated
// from the published formulas and re-computed independently; the table names its sources).
type Fha = ReturnType<typeof predictCorner>;
const example = readChecks<{ fha: Record<string, number>; fhaFullBridge: Record<string, number> }>('worked-example.json');
describe(`worked example: ${example.title}`, () => {
  const { fha } = only(makeDesign());
  const skip = new Set(['phaseDeg', 'crVoltageAcPeak']);
  for (const [k, v] of Object.entries(example.fha).filter(([k]) => !skip.has(k))) {
    it(`${k} = ${v}`, () => expect(rel(fha[k as keyof Fha] as number, v)).toBeLessThan(1e-5));
  }
  it('phase(Zin) = 11.9586 deg, Vcr,ac,pk = 192.713 V', () => {
    expect((fha.phase! * 180) / Math.PI).toBeCloseTo(11.9586, 3);
    expect(rel(fha.crVoltagePeak! - 200, 192.713)).toBeLessThan(1e-5);
  });
  it('below resonance: inductive, ZCS expected, ZVS by charge (1.129 A >= 0.96 A)', () => {
    expect(fha.region).toBe('inductive');
    expect(fha.zcs).toBe(true);
    expect(fha.zvs).toBe(true);
    expect(fha.zvsMargin!).toBeCloseTo(1.12903 - 0.96, 4);
  });
  it('full-bridge variant: same M and Q, Vo = 104.208 V, Io = 26.0521 A (check table)', () => {
    const fb = only(makeDesign({ topology: { inverter: 'full-bridge', rectifier: 'center-tapped' } })).fha;
    expect(rel(fb.gain!, 1.04208)).toBeLessThan(1e-5);
    expect(rel(fb.q, 0.609579)).toBeLessThan(1e-5);
    expect(rel(fb.vout!, 104.208)).toBeLessThan(1e-5);
    expect(rel(fb.iout!, 26.0521)).toBeLessThan(1e-5);
    expect(fb.crVoltagePeak).toBeCloseTo(-fb.crVoltageMin!, 9); // no DC bias on a full-bridge Cr (docs/method.md#cr-voltage)
  });
});

// Independent cross-check: M from the closed form against complex impedance arithmetic on the
// physical element values (Zs = jwLr + 1/(jwCr), Zp = jwLm || Rac, M = |Zp/(Zs+Zp)|), docs/method.md#gain.
describe('closed form against complex impedance arithmetic on physical values', () => {
  type C = { re: number; im: number };
  const add = (a: C, b: C): C => ({ re: a.re + b.re, im: a.im + b.im });
  const mul = (a: C, b: C): C => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
  const div = (a: C, b: C): C => { const d = b.re * b.re + b.im * b.im; return { re: (a.re * b.re + a.im * b.im) / d, im: (a.im * b.re - a.re * b.im) / d }; };
  const abs = (a: C) => Math.hypot(a.re, a.im);

  it('agrees to 1e-9 relative over a grid of tanks, loads, frequencies and both bridges', () => {
    let checked = 0;
    for (const inverter of ['half-bridge', 'full-bridge'] as const)
      for (const rectifier of ['center-tapped', 'full-bridge'] as const)
        for (const [lr, cr, lm] of [[50e-6, 50e-9, 250e-6], [20e-6, 100e-9, 180e-6], [120e-6, 12e-9, 300e-6]])
          for (const rl of [1, 4, 30])
            for (const fs of [40e3, 90e3, 150e3, 300e3]) {
              const d = makeDesign({ topology: { inverter, rectifier }, tank: { lr, cr, lm, turnsRatio: 3.5, integrated: false },
                rectifier: { forwardVoltage: 0.7, resistance: 0 }, operating: { vin: [380], load: [{ kind: 'ohm', value: rl }], frequency: [fs] } as any });
              const f = only(d).fha;
              const vf = rectifier === 'center-tapped' ? 0.7 : 1.4;
              const rac = (8 * 3.5 ** 2 * (f.vout! + vf) * rl) / (Math.PI ** 2 * f.vout!);
              const w = 2 * Math.PI * fs;
              const zs: C = add({ re: 0, im: w * lr }, div({ re: 1, im: 0 }, { re: 0, im: w * cr }));
              const zl: C = { re: 0, im: w * lm };
              const zp = div(mul(zl, { re: rac, im: 0 }), add(zl, { re: rac, im: 0 }));
              const m = abs(div(zp, add(zs, zp)));
              expect(rel(f.gain!, m)).toBeLessThan(1e-9);
              // and the output relation (docs/method.md#gain): Vo = M Vin_eff / n - V_drop
              const vinEff = inverter === 'half-bridge' ? 190 : 380;
              expect(rel(f.vout!, (m * vinEff) / 3.5 - vf)).toBeLessThan(1e-9);
              checked++;
            }
    expect(checked).toBe(144);
  });
});

describe('regulated corners', () => {
  const reg = (over: Parameters<typeof makeDesign>[0]) =>
    only(makeDesign({ operating: { vin: [400], load: [{ kind: 'ohm', value: 4 }], ratedPower: 676, frequency: 'regulate', corners: [] }, ...over }));

  it('solves fs so that Vo equals output.voltage, on the inductive branch', () => {
    const { fha, corner } = reg({ output: { voltage: 52, capacitance: 1e-4, esr: 0.01 } });
    expect(rel(fha.vout!, 52)).toBeLessThan(1e-12);
    expect(rel(fha.gain!, (4 * 52) / 200)).toBeLessThan(1e-9);
    expect(fha.fs!).toBeGreaterThan(fha.fsZeroPhase);
    // re-predict at the solved frequency in fixed mode: the same Vo comes back
    const fixed = predictCorner(makeDesign(), { ...corner, fs: fha.fs });
    expect(rel(fixed.vout!, 52)).toBeLessThan(1e-9);
  });

  it('a gain above M(fn_zp) is unreachable with ZVS: nulls and a warning, not a number', () => {
    const { fha } = reg({ output: { voltage: 120, capacitance: 1e-4, esr: 0.01 } });
    expect(fha.fs).toBeNull();
    expect(fha.gain).toBeNull();
    expect(fha.warnings.join(' ')).toMatch(/unreachable with ZVS/);
  });

  it('flags a light-load corner that needs a gain below Ln/(Ln+1) (docs/method.md#gain-limits)', () => {
    const { fha } = reg({ output: { voltage: 38, capacitance: 1e-4, esr: 0.01 }, operating: { vin: [400], load: [{ kind: 'ohm', value: 400 }], ratedPower: 676, frequency: 'regulate', corners: [] } });
    expect(fha.gainTarget).toBeLessThan(5 / 6);
    expect(fha.warnings.join(' ')).toMatch(/Ln\/\(Ln\+1\)/);
  });

  it('tank constants: fr and fp follow 1/(2 pi sqrt(LC)) (derived; docs/method.md#normalised)', () => {
    const k = tankConstants({ lr: 50e-6, cr: 50e-9, lm: 250e-6 });
    expect(k.fp / k.fr).toBeCloseTo(1 / Math.sqrt(6), 12);
  });
});

describe('stresses at fs = fr (docs/method.md#tank-currents, #diodes, #output-ripple)', () => {
  it('diode average Io/2, peak (pi/2) Io, rms (pi/4) Io; CT reverse 2 Vo + VF, FB Vo + VF', () => {
    const d = makeDesign({ rectifier: { forwardVoltage: 0.5, resistance: 0 } });
    const ct = only(d).fha;
    expect(ct.diodeCurrentAvg! / ct.iout!).toBeCloseTo(0.5, 12);
    expect(ct.diodeCurrentPeak! / ct.iout!).toBeCloseTo(1.5708, 4);
    expect(ct.diodeCurrentRms! / ct.iout!).toBeCloseTo(0.785398, 6);
    expect(ct.diodeReverseVoltage!).toBeCloseTo(2 * ct.vout! + 0.5, 9);
    const fb = only(makeDesign({ topology: { inverter: 'half-bridge', rectifier: 'full-bridge' }, rectifier: { forwardVoltage: 0.5, resistance: 0 } })).fha;
    expect(fb.diodeReverseVoltage!).toBeCloseTo(fb.vout! + 0.5, 9);
  });
});

describe('dead time against the switching period (ZVS verdict)', () => {
  const fs = 100e3;
  it('half the period or more: no ZVS, with the reason', () => {
    const w: string[] = [];
    expect(deadTimeZvs(5e-6, fs, 1, w)).toBe(false);
    expect(w[0]).toMatch(/not shorter than half the switching period at 100.0 kHz \(5.00 us\)/);
  });
  it('over 10 % of the period: warns with the fundamental factor sin(x)/x, x = pi fs td', () => {
    // x = pi 0.2 -> sin(x)/x = 0.9355 (closed form of the trapezoid's fundamental)
    const w: string[] = [];
    expect(deadTimeZvs(2e-6, fs, 1.5, w)).toBe(true);
    expect(w[0]).toMatch(/20.0 % of the period .* = 0\.9355/);
  });
  it('the current reverses phase / (2 pi fs) after the centre of the dead time: td must stay below phase / (pi fs)', () => {
    const phase = 0.3; // rad: reversal after 0.3 / (pi 100 kHz) = 0.955 us of dead time
    expect(deadTimeZvs(0.9e-6, fs, phase, [])).toBe(true);
    const w: string[] = [];
    expect(deadTimeZvs(1.0e-6, fs, phase, w)).toBe(false);
    expect(w.at(-1)).toMatch(/outlasts the 0.955 us before the tank current reverses/);
  });
  it('a 6 us dead time on a 78-114 kHz design never gets a ZVS yes from FHA', () => {
    const d = makeDesign({ switches: { deadTime: 6e-6 }, operating: { frequency: [78e3, 99e3, 114e3] } });
    for (const c of expandCorners(d)) expect(predictCorner(d, c).zvs).toBe(false);
  });
});
