import { describe, expect, it } from 'vitest';
import { measureState, idealCorner } from './metrics.js';
import { solveSteadyState, type TdParams } from '../tdmodel/index.js';
import { params, resonance, loadForQ, rel } from '../tdmodel/cases.test-support.js';
import { makeDesign } from '../../tests/support/design.js';
import { expandCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';

/**
 * Closed forms of the ideal converter at fs = fr (ideal switches and diodes, no dead time, stiff
 * output), derived from circuit laws: for the whole half period Lm is clamped to +-n Vo, so the
 * Lr-Cr current is one sinusoid at fr and Lm carries a triangle of peak Im = n Vo / (4 fs Lm).
 * Charge balance gives the sinusoid's in-phase part pi Io / (2n), continuity with i_m at the
 * half-period ends its quadrature part Im, hence
 *   gain = 1, Ir,rms = sqrt((pi Io / (2 sqrt 2 n))^2 + Im^2 / 2), Ir,pk = sqrt((pi Io / 2n)^2 + Im^2),
 *   turn-off current = Im, diode average Io / 2,
 * valid while the secondary current stays positive all half period: Q >= pi / (4 Ln) (FHA's
 * Q = Zr / Rac). The P-interval solution at resonance as in J. F. Lazar, R. Martinelli,
 * "Steady-state analysis of the LLC series resonant converter", Proc. IEEE APEC 2001 (from memory);
 * the formulas above are re-derived here, not copied.
 */
function closedForm(p: TdParams, rl: number) {
  const vinEff = p.inverter === 'full-bridge' ? p.vin : p.vin / 2;
  const vo = vinEff / p.n;
  const io = vo / rl;
  const im = (p.n * vo) / (4 * p.fs * p.lm);
  const load = (Math.PI * io) / (2 * p.n);
  return { vo, io, im, rms: Math.sqrt(load * load / 2 + im * im / 2), peak: Math.hypot(load, im) };
}

describe('ideal column at fs = fr against the closed forms (Q >= pi / (4 Ln))', () => {
  const cases: [string, Partial<TdParams>, number][] = [
    ['HB, CT, Q = 0.61', {}, 0.61],
    ['HB, CT, Q = 0.2 (just above pi / (4 Ln) = 0.157)', {}, 0.2],
    ['FB, full-bridge rectifier, Q = 0.4', { inverter: 'full-bridge', rectifier: 'full-bridge' }, 0.4],
  ];
  for (const [name, over, q] of cases) {
    it(name, () => {
      const base = params(over);
      const p = { ...base, fs: resonance(base) };
      const rl = loadForQ(p, q);
      const m = measureState(p, solveSteadyState(p, rl), rl, 0);
      const cf = closedForm(p, rl);
      expect(Math.abs(m.gain - 1)).toBeLessThan(1e-6);
      expect(rel(m.vout, cf.vo)).toBeLessThan(1e-6);
      // Sampled at >= 800 points per period: the piecewise-linear RMS and peak are within 1e-5.
      expect(rel(m.tankCurrentRms, cf.rms)).toBeLessThan(2e-5);
      expect(rel(m.tankCurrentPeak, cf.peak)).toBeLessThan(2e-5);
      expect(rel(m.magnetizingCurrentPeak, cf.im)).toBeLessThan(2e-5);
      expect(rel(m.switchTurnOffCurrent, cf.im)).toBeLessThan(2e-5);
      expect(rel(m.diodeCurrentAvg, cf.io / 2)).toBeLessThan(2e-5);
      // Each switch conducts one half period of a half-wave-symmetric current: Ir,rms / sqrt 2 (derived).
      expect(rel(m.switchCurrentRms, cf.rms / Math.SQRT2)).toBeLessThan(2e-5);
      // Near the Q bound the secondary current starts from zero slowly: below the measurement's 2 %
      // mode threshold for a while, which the label (same definition as the simulation's) calls O.
      expect(m.mode).toMatch(q >= 0.4 ? /^P$/ : /^O?P$/);
      expect(m.region).toBe('inductive');
      expect(m.zcs).toBe(true); // the diode current reaches zero at the edge
    });
  }

  it('below Q = pi / (4 Ln) the light-load mode turns OPO-like and the gain rises above 1 (derived: the secondary current would go negative)', () => {
    const p = { ...params(), fs: resonance(params()) };
    const rl = loadForQ(p, 0.1);
    const m = measureState(p, solveSteadyState(p, rl), rl, 0);
    expect(m.gain).toBeGreaterThan(1 + 1e-4);
    expect(m.gain).toBeLessThan(1.05);
    expect(m.mode).toContain('O');
  });
});

describe('ideal column: sampling reproduces the model\'s exact integrals', () => {
  // Dead time, Coss, drops and resistances on; 6.3 tank at 90 kHz (PO mode) and at 130 kHz (NP).
  for (const fs of [90e3, 130e3]) {
    it(`fs = ${fs / 1e3} kHz: RMS, peaks and diode figures within 1e-4 of the integrals`, () => {
      const p = params({ fs, coss: 300e-12, deadTime: 250e-9, vf: 0.7, rd: 0.01, rdsOn: 0.05 });
      const s = solveSteadyState(p, 4);
      const m = measureState(p, s, 4, 0.7);
      expect(rel(m.vout, s.vo)).toBeLessThan(1e-12);
      expect(rel(m.tankCurrentRms, s.tankCurrentRms)).toBeLessThan(1e-4);
      expect(rel(m.tankCurrentPeak, s.tankCurrentPeak)).toBeLessThan(1e-4);
      expect(rel(m.magnetizingCurrentPeak, s.magnetizingCurrentPeak)).toBeLessThan(1e-4);
      expect(rel(m.crVoltagePeak, s.crVoltageMax)).toBeLessThan(1e-4);
      expect(rel(m.diodeCurrentRms, s.diodeCurrentRms)).toBeLessThan(1e-4);
      expect(rel(m.diodeCurrentPeak, s.diodeCurrentPeak)).toBeLessThan(1e-4);
      expect(rel(m.diodeCurrentAvg, s.diodeCurrentAvg)).toBeLessThan(1e-4);
      expect(rel(m.outputRippleCurrentRms, s.outputRippleCurrentRms)).toBeLessThan(1e-3);
      expect(rel(m.switchTurnOffCurrent, s.turnOffCurrent)).toBeLessThan(1e-6);
      expect(m.zvs).toBe(s.zvs);
      // Blocking CT diode: 2 Vo + the conducting diode's drop at its current (derived, common practice).
      expect(m.diodeReverseVoltage).toBeGreaterThan(2 * s.vo + 0.7);
      expect(m.diodeReverseVoltage).toBeLessThan(2 * s.vo + 0.7 + 0.01 * s.diodeCurrentPeak + 1e-9);
    });
  }
});

describe('idealCorner', () => {
  it('a corner far below resonance is null with the reason', () => {
    const d = makeDesign({ operating: { frequency: [3e3] } });
    const c = expandCorners(d)[0]!;
    const r = idealCorner(d, c, predictCorner(d, c));
    expect(r.ideal).toBeNull();
    if (r.ideal === null) expect(r.reason).toMatch(/fs\/fr = 0\.0298 lies outside 0\.05\.\.20/);
  });

  it('regulated: the solved frequency gives output.voltage within 1e-6', () => {
    const d = makeDesign({ operating: { frequency: 'regulate' } });
    const c = expandCorners(d)[0]!;
    const r = idealCorner(d, c, predictCorner(d, c));
    expect(r.ideal).not.toBeNull();
    if (r.ideal) {
      expect(rel(r.ideal.vout, d.output.voltage)).toBeLessThan(1e-6);
      expect(r.ideal.fs).toBeCloseTo(r.params.fs, 3);
    }
  });
});
