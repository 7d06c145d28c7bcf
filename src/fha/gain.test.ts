import { describe, expect, it } from 'vitest';
import { fhaGain, fnForGain, inputImpedance, inputPhase, peakGainFn, zeroPhaseFn } from './gain.js';
import { readChecks } from '../../tests/support/checks.js';

// Check values: shared/checks/fha-gain.json, which names its published source (the FHA tank gain of
// Steigerwald 1988 and Erickson & Maksimovic, 2nd ed., ch. 19; identities derived from circuit laws,
// the other rows the closed form evaluated and independently re-computed).
interface GainRow { fn: number; q: number; ln: number; m: number; phaseDeg?: number; zinOverZr?: number; basis: string }
interface BoundaryRow { q: number; ln: number; fnZeroPhase: number; mZeroPhase: number; fnPeak: number; mPeak: number }
const checks = readChecks<{ gain: GainRow[]; boundary: BoundaryRow[]; seriesResonant: { rows: { f: number; q: number; m: number }[] } }>('fha-gain.json');
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
const deg = (r: number) => (r * 180) / Math.PI;

describe(`FHA gain against the check table (${checks.title})`, () => {
  for (const { fn, q, ln, m, basis } of checks.gain) {
    it(`M(${fn}, ${q}, ${ln}) = ${m} (${basis})`, () => {
      expect(rel(fhaGain(fn, q, ln), m)).toBeLessThan(6e-6);
    });
  }

  for (const { fn, q, ln, phaseDeg, zinOverZr } of checks.gain.filter((r) => r.phaseDeg !== undefined)) {
    it(`phase(Zin) at fn ${fn}, Q ${q}, Ln ${ln} = ${phaseDeg} deg${zinOverZr ? `, |Zin|/Zr = ${zinOverZr}` : ''}`, () => {
      expect(Math.abs(deg(inputPhase(fn, q, ln)) - phaseDeg!)).toBeLessThan(1e-3);
      const z = inputImpedance(fn, q, ln);
      expect(Math.abs(deg(Math.atan2(z.im, z.re)) - phaseDeg!)).toBeLessThan(1e-3);
      if (zinOverZr) expect(rel(Math.hypot(z.re, z.im), zinOverZr)).toBeLessThan(5e-6);
    });
  }

  it('limits: no-load gain tends to Ln/(Ln+1), loaded gain to 0 (identity: Q = 0 tends to Ln/(Ln+1), any Q > 0 to 0)', () => {
    expect(rel(fhaGain(1e6, 0, 5), 5 / 6)).toBeLessThan(1e-9);
    expect(fhaGain(1e6, 0.3, 5)).toBeLessThan(1e-5);
  });

  it('fp/fr = 1/sqrt(Ln+1) is the zero-phase boundary at Q = 0 (identity)', () => {
    expect(zeroPhaseFn(0, 5)).toBeCloseTo(0.408248, 6);
    expect(zeroPhaseFn(1e-9, 5)).toBeCloseTo(0.408248, 6);
  });

  it('slope at resonance is -2/Ln for any Q (identity: dM/dfn = -2/Ln at fn = 1)', () => {
    for (const q of [0.1, 0.3, 1, 3]) {
      const h = 1e-6;
      const slope = (fhaGain(1 + h, q, 5) - fhaGain(1 - h, q, 5)) / (2 * h);
      expect(slope).toBeCloseTo(-0.4, 6);
    }
  });

  for (const { q, ln, fnZeroPhase: fzp, mZeroPhase: mzp, fnPeak: fpk, mPeak: mpk } of checks.boundary) {
    it(`zero-phase boundary and peak gain for Q=${q}, Ln=${ln} (evaluated, check table)`, () => {
      const a = zeroPhaseFn(q, ln);
      expect(rel(a, fzp)).toBeLessThan(2e-6);
      expect(rel(fhaGain(a, q, ln), mzp)).toBeLessThan(5e-6);
      expect(Math.abs(inputPhase(a, q, ln))).toBeLessThan(1e-12);
      const b = peakGainFn(q, ln);
      expect(rel(b, fpk)).toBeLessThan(2e-6);
      expect(rel(fhaGain(b, q, ln), mpk)).toBeLessThan(5e-6);
    });
  }

  it('zero-phase boundary by bisection on the sign of Im(Zin) agrees with the closed form (docs/method.md#zero-phase)', () => {
    for (const q of [0.05, 0.3, 1, 3]) for (const ln of [1.5, 5, 20]) {
      let lo = 1 / Math.sqrt(ln + 1), hi = 1;
      for (let i = 0; i < 100; i++) { const m = (lo + hi) / 2; if (inputImpedance(m, q, ln).im < 0) lo = m; else hi = m; }
      expect(rel(zeroPhaseFn(q, ln), (lo + hi) / 2)).toBeLessThan(1e-10);
    }
  });

  it('form B equals form A to machine precision over a grid (docs/method.md#gain)', () => {
    for (const fn of [0.3, 0.5, 0.9, 1.1, 2, 4]) for (const q of [0, 0.2, 1, 3]) for (const ln of [2, 5, 12]) {
      const b = (ln * fn * fn) / Math.hypot((ln + 1) * fn * fn - 1, q * ln * fn * (fn * fn - 1));
      expect(rel(fhaGain(fn, q, ln), b)).toBeLessThan(1e-12);
    }
  });

  it(`Ln -> infinity reduces to the series-resonant gain (${checks.seriesResonant.rows.length} rows, check table)`, () => {
    const src = (f: number, q: number) => 1 / Math.sqrt(1 + q * q * (f - 1 / f) ** 2);
    for (const { f, q, m } of checks.seriesResonant.rows) {
      expect(rel(src(f, q), m)).toBeLessThan(2e-6);
      expect(rel(fhaGain(f, q, 1e9), m)).toBeLessThan(2e-6);
    }
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
