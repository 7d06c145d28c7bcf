import { describe, expect, it } from 'vitest';
import { fhaGain, fnForGain, inputImpedance, inputPhase, peakGainFn, zeroPhaseFn } from './gain.js';

// Check values: method reference (../shared/method-reference.md) section 6.1. Tags as there:
// [D] closed-form identity derived from circuit laws; [N] value evaluated from the closed form;
// SRC formula: Erickson & Maksimovic, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 19 and
// Steigerwald, IEEE TPEL 3(2), 1988 (from memory, as the reference says).
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const deg = (r: number) => (r * 180) / Math.PI;

describe('FHA gain against the method-reference check values (6.1)', () => {
  const cases: [number, number, number, number, string][] = [
    [1, 0.3, 5, 1.0, '[D] identity: M = 1 at fn = 1'],
    [1, 2, 10, 1.0, '[D] identity'],
    [0.5, 0.3, 5, 1.66091, '[N]'],
    [0.7, 0.3, 5, 1.21736, '[N]'],
    [0.8, 0.3, 5, 1.11395, '[N], hand arithmetic in the reference'],
    [1.2, 0.3, 5, 0.937385, '[N]'],
    [1.5, 0.3, 5, 0.878049, '[N], hand arithmetic in the reference'],
    [2.0, 0.3, 5, 0.809776, '[N]'],
    [0.7, 0.5, 5, 1.1473, '[N]'],
    [1.2, 0.5, 5, 0.92865, '[N]'],
    [0.6, 0.2, 3, 2.17447, '[N]'],
    [1.5, 0.2, 3, 0.835529, '[N]'],
    [0.7, 0.4, 7, 1.11134, '[N]'],
    [1.3, 0.4, 7, 0.926431, '[N]'],
    [0.5, 0, 5, 2.5, '[D] no load: Ln fn^2 / |(Ln+1) fn^2 - 1|'],
    [1.5, 0, 5, 0.9, '[D] no load'],
    [3, 0, 5, 45 / 53, '[D] no load'],
  ];
  for (const [fn, q, ln, m, src] of cases) {
    it(`M(${fn}, ${q}, ${ln}) = ${m} (${src})`, () => {
      expect(rel(fhaGain(fn, q, ln), m)).toBeLessThan(6e-6);
    });
  }

  it('phase and |Zin|/Zr at resonance: rows 1-2 ([D] identity)', () => {
    const z1 = inputImpedance(1, 0.3, 5);
    expect(deg(Math.atan2(z1.im, z1.re))).toBeCloseTo(33.6901, 3);
    expect(Math.hypot(z1.re, z1.im)).toBeCloseTo(2.7735, 4);
    const z2 = inputImpedance(1, 2, 10);
    expect(deg(Math.atan2(z2.im, z2.re))).toBeCloseTo(2.86241, 4);
    expect(Math.hypot(z2.re, z2.im)).toBeCloseTo(0.499376, 5);
  });

  it('phase below resonance: rows 3, 4, 5, 9 ([N])', () => {
    expect(deg(inputPhase(0.5, 0.3, 5))).toBeCloseTo(4.76364, 4);
    expect(deg(inputPhase(0.7, 0.3, 5))).toBeCloseTo(28.1717, 3);
    expect(deg(inputPhase(0.8, 0.3, 5))).toBeCloseTo(31.1565, 3);
    expect(deg(inputPhase(0.7, 0.5, 5))).toBeCloseTo(5.04001, 4);
  });

  it('limits: no-load gain tends to Ln/(Ln+1), loaded gain to 0 (row 18, [D])', () => {
    expect(rel(fhaGain(1e6, 0, 5), 5 / 6)).toBeLessThan(1e-9);
    expect(fhaGain(1e6, 0.3, 5)).toBeLessThan(1e-5);
  });

  it('fp/fr = 1/sqrt(Ln+1) is the zero-phase boundary at Q = 0 (row 19, [D])', () => {
    expect(zeroPhaseFn(0, 5)).toBeCloseTo(0.408248, 6);
    expect(zeroPhaseFn(1e-9, 5)).toBeCloseTo(0.408248, 6);
  });

  it('slope at resonance is -2/Ln for any Q (row 20, [D])', () => {
    for (const q of [0.1, 0.3, 1, 3]) {
      const h = 1e-6;
      const slope = (fhaGain(1 + h, q, 5) - fhaGain(1 - h, q, 5)) / (2 * h);
      expect(slope).toBeCloseTo(-0.4, 6);
    }
  });

  const boundary: [number, number, number, number, number?, number?][] = [
    [0.3, 5, 0.483585, 1.70309, 0.450768, 1.74675],
    [0.5, 5, 0.648459, 1.17495, 0.560475, 1.20237],
    [1, 5, 0.899677, 1.02441, 0.887885, 1.02473],
    [0.4, 7, 0.589139, 1.1694, 0.482651, 1.2086],
  ];
  for (const [q, ln, fzp, mzp, fpk, mpk] of boundary) {
    it(`zero-phase boundary and peak gain for Q=${q}, Ln=${ln} (rows 21-26, [N])`, () => {
      const a = zeroPhaseFn(q, ln);
      expect(rel(a, fzp)).toBeLessThan(2e-6);
      expect(rel(fhaGain(a, q, ln), mzp)).toBeLessThan(5e-6);
      expect(Math.abs(inputPhase(a, q, ln))).toBeLessThan(1e-12);
      const b = peakGainFn(q, ln);
      expect(rel(b, fpk!)).toBeLessThan(2e-6);
      expect(rel(fhaGain(b, q, ln), mpk!)).toBeLessThan(5e-6);
    });
  }

  it('zero-phase boundary by bisection on the sign of Im(Zin) agrees with the closed form ([D] 2.6)', () => {
    for (const q of [0.05, 0.3, 1, 3]) for (const ln of [1.5, 5, 20]) {
      let lo = 1 / Math.sqrt(ln + 1), hi = 1;
      for (let i = 0; i < 100; i++) { const m = (lo + hi) / 2; if (inputImpedance(m, q, ln).im < 0) lo = m; else hi = m; }
      expect(rel(zeroPhaseFn(q, ln), (lo + hi) / 2)).toBeLessThan(1e-10);
    }
  });

  it('form B equals form A to machine precision over a grid ([D] 2.4)', () => {
    for (const fn of [0.3, 0.5, 0.9, 1.1, 2, 4]) for (const q of [0, 0.2, 1, 3]) for (const ln of [2, 5, 12]) {
      const b = (ln * fn * fn) / Math.hypot((ln + 1) * fn * fn - 1, q * ln * fn * (fn * fn - 1));
      expect(rel(fhaGain(fn, q, ln), b)).toBeLessThan(1e-12);
    }
  });

  it('Ln -> infinity reduces to the series-resonant gain (rows 27-29; Erickson & Maksimovic 2nd ed. ch. 19, from memory)', () => {
    const src = (f: number, q: number) => 1 / Math.sqrt(1 + q * q * (f - 1 / f) ** 2);
    expect(src(2, 1)).toBeCloseTo(0.5547, 6);
    expect(src(0.5, 1)).toBeCloseTo(0.5547, 6);
    expect(src(1.5, 0.5)).toBeCloseTo(0.923077, 6);
    expect(rel(fhaGain(1.2, 2, 1e9), 0.806405)).toBeLessThan(2e-6);
  });

  it('fnForGain inverts the gain on the inductive branch and refuses unreachable targets', () => {
    const q = 0.4, ln = 6, lo = zeroPhaseFn(q, ln);
    for (const target of [0.9, 1.0, 1.1]) {
      const fn = fnForGain(target, q, ln, lo, 50)!;
      expect(rel(fhaGain(fn, q, ln), target)).toBeLessThan(1e-12);
    }
    expect(fnForGain(fhaGain(lo, q, ln) * 1.01, q, ln, lo, 50)).toBeNull();
  });
});
