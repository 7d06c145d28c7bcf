import { describe, expect, it } from 'vitest';
import { eng, num, pct, pctAbs, plain, sig } from './display.js';
import { formatSi } from './format.js';

describe('number display (the one formatter of tables and reports)', () => {
  it('num: significant digits, trailing zeros dropped, an empty mark for missing values', () => {
    expect(num(99.004)).toBe('99');
    expect(num(0.123456)).toBe('0.1235');
    expect(num(101234, 4, 1e3)).toBe('101.2');
    expect(num(null)).toBe('');
    expect(num(Number.NaN, 4, 1, '-')).toBe('-');
    expect(num('12')).toBe('');
  });

  it('sig keeps trailing zeros and never writes an exponent', () => {
    expect(sig(99)).toBe('99.00');
    expect(sig(123456)).toBe('123456');
    expect(sig(undefined)).toBe('');
  });

  it('pct is signed with one decimal, pctAbs unsigned to 3 digits', () => {
    expect(pct(0.035)).toBe('+3.5%');
    expect(pct(-0.1234)).toBe('-12.3%');
    expect(pct(0)).toBe('+0.0%');
    expect(pctAbs(0.1)).toBe('10 %');
  });

  it('eng is formatSi with the micro sign and 3 digits, including the carry into the next prefix', () => {
    expect(eng(57e-6, 'H')).toBe('57 µH');
    expect(eng(39.9e-9, 'F')).toBe('39.9 nF');
    expect(eng(999.96e-6, 'H')).toBe('1 mH');
    expect(eng(-2.2e6, 'ohm')).toBe('-2.2 Mohm');
    expect(eng(null, 'H')).toBe('');
    expect(formatSi(57e-6, 'H', 3)).toBe('57 uH');
  });

  it('plain: 5 significant digits for numbers, text as is', () => {
    expect(plain(3.14159265)).toBe('3.1416');
    expect(plain('ok')).toBe('ok');
    expect(plain(true)).toBe('true');
  });
});
