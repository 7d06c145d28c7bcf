import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatSi, formatSpice, formatSpiceEng } from './format.js';
import { parseQuantity } from './parse.js';

describe('formatSi', () => {
  it('writes engineering notation with 4 significant digits by default', () => {
    expect(formatSi(62e-6, 'H')).toBe('62 uH');
    expect(formatSi(101234, 'Hz')).toBe('101.2 kHz');
    expect(formatSi(0.11, 'ohm')).toBe('110 mohm');
    expect(formatSi(2e6, 'ohm')).toBe('2 Mohm');
    expect(formatSi(-3.3e-9, 'F')).toBe('-3.3 nF');
    expect(formatSi(24, 'V')).toBe('24 V');
    expect(formatSi(0, 'W')).toBe('0 W');
    expect(formatSi(1.23456e-12, 'F', 3)).toBe('1.23 pF');
    expect(formatSi(5e15, 'Hz')).toBe('5000 THz'); // beyond the largest prefix
  });
  it('carries into the next prefix when rounding reaches 1000', () => {
    expect(formatSi(999.96, 'V')).toBe('1 kV');
    expect(formatSi(999.94, 'V')).toBe('999.9 V');
    expect(formatSi(0.99996, 'A')).toBe('1 A');
  });
  it('writes mega as "meg" when there is no unit, so the text reads back unambiguously', () => {
    expect(formatSi(2.2e6, '')).toBe('2.2 meg');
    expect(formatSi(0.5, '')).toBe('500 m');
    expect(formatSi(7, '')).toBe('7');
  });
  it('prints non-finite values as such', () => {
    expect(formatSi(NaN, 'V')).toBe('NaN V');
    expect(formatSi(-Infinity, 'A')).toBe('-Infinity A');
  });
  it('reads back through parseQuantity within the printed precision', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-14, max: 1e13, noNaN: true }), (x) => {
        const r = parseQuantity(formatSi(x, 'ohm'), 'ohm');
        expect(r.ok).toBe(true);
        if (r.ok) expect(Math.abs(r.value - x) / x).toBeLessThanOrEqual(5e-4);
      }),
    );
  });
});

describe('formatSpice', () => {
  it('is value.toExponential(12): no suffix, no unit letter', () => {
    expect(formatSpice(60e-6)).toBe('6.000000000000e-5');
    expect(formatSpice(1e6)).toBe('1.000000000000e+6');
    expect(formatSpice(-0.5)).toBe('-5.000000000000e-1');
    expect(formatSpice(0)).toBe('0.000000000000e+0');
  });
  it('keeps 13 significant digits (relative error below 5e-13)', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-300, max: 1e300, noNaN: true }), (x) => {
        const text = formatSpice(x);
        expect(text).toMatch(/^-?\d\.\d{12}e[+-]\d+$/);
        expect(Math.abs(Number(text) - x) / x).toBeLessThan(5e-13);
      }),
    );
  });
  it('refuses NaN and Infinity', () => {
    expect(() => formatSpice(NaN)).toThrow(RangeError);
    expect(() => formatSpice(Infinity)).toThrow(RangeError);
  });
});

describe('formatSpiceEng', () => {
  // SPICE scale suffixes (common practice; ngspice manual, "Scale factors"): f p n u m k meg g t.
  const SCALE: Record<string, number> = { f: -15, p: -12, n: -9, u: -6, m: -3, '': 0, k: 3, meg: 6, g: 9, t: 12 };
  const readBack = (text: string): number => {
    const m = /^(-?\d+(?:\.\d+)?)(?:(f|p|n|u|m|k|meg|g|t)|e(-?\d+))?$/.exec(text);
    if (!m) throw new Error(`not a compact SPICE number: ${text}`);
    return Number(`${m[1]}e${m[3] ?? SCALE[m[2] ?? '']}`);
  };
  it('writes design values short, with lower-case suffixes (meg, never M)', () => {
    expect([50e-6, 90e3, 4.7e-9, 1.5e6, 1e-4, 0.05, 400, 0, 1e9, 300e-12, 60e-6 * 1.05].map((x) => formatSpiceEng(x)))
      .toEqual(['50u', '90k', '4.7n', '1.5meg', '100u', '50m', '400', '0', '1g', '300p', '63u']);
    expect(formatSpiceEng(-2.5e-3)).toBe('-2.5m');
    expect(formatSpiceEng(1.2e-18)).toBe('1.2e-18');
  });
  it('uses 6 digits where they read back within 1e-12, more where they do not', () => {
    expect(formatSpiceEng(98545.89449726851)).toBe('98.5458944973k');
    expect(formatSpiceEng(129999.99999999479)).toBe('130k'); // within 1e-12 of 130 kHz
    expect(formatSpiceEng(1234567)).toBe('1.234567meg');
  });
  it('reads back within 1e-12 relative, with at most 13 significant digits', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e20, max: 1e20, noNaN: true }).filter((x) => x !== 0 && Math.abs(x) > 1e-300), (x) => {
        const text = formatSpiceEng(x);
        expect(Math.abs(readBack(text) - x)).toBeLessThanOrEqual(1e-12 * Math.abs(x));
        expect(text.replace(/^-/, '').replace(/[a-z].*$/, '').replace('.', '').replace(/^0+/, '').length).toBeLessThanOrEqual(13);
      }),
    );
  });
  it('refuses NaN and Infinity', () => {
    expect(() => formatSpiceEng(NaN)).toThrow(RangeError);
    expect(() => formatSpiceEng(-Infinity)).toThrow(RangeError);
  });
});
