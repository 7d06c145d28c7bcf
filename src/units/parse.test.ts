import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseQuantity, type ParseResult } from './parse.js';

const value = (r: ParseResult): number => {
  if (!r.ok) throw new Error(r.message);
  return r.value;
};
const failure = (r: ParseResult): string => {
  if (r.ok) throw new Error(`expected a failure, got ${r.value}`);
  return r.message;
};

// Prefix factors: SI Brochure, 9th edition (BIPM 2019), table of SI prefixes (table number from
// memory); `meg` is the SPICE spelling of mega: ngspice manual, section "Some naming conventions"
// (as cited in ngspice manual, "Some naming conventions").
describe('scale prefixes', () => {
  const cases: [string, 'henry' | 'farad' | 'ohm' | 'hertz' | 'volt', number][] = [
    ['1T', 'hertz', 1e12],
    ['1G', 'hertz', 1e9],
    ['1meg', 'ohm', 1e6],
    ['1Meg', 'ohm', 1e6],
    ['1MEG', 'ohm', 1e6],
    ['1k', 'ohm', 1e3],
    ['1K', 'ohm', 1e3],
    ['1m', 'ohm', 1e-3],
    ['1u', 'henry', 1e-6],
    ['1\u00b5', 'henry', 1e-6], // micro sign U+00B5
    ['1\u03bc', 'henry', 1e-6], // Greek small mu U+03BC
    ['1n', 'farad', 1e-9],
    ['1p', 'farad', 1e-12],
    ['1f', 'farad', 1e-15],
  ];
  it.each(cases)('%s (%s) = %d', (text, kind, expected) => {
    expect(value(parseQuantity(text, kind))).toBe(expected);
  });

  it('reads the brief examples exactly as the equal JavaScript literals', () => {
    // Exact equality: scaling is done on the decimal exponent, so "27n" is the double nearest 27e-9.
    expect(value(parseQuantity('27n', 'farad'))).toBe(27e-9);
    expect(value(parseQuantity('27 nF', 'farad'))).toBe(27e-9);
    expect(value(parseQuantity('27nF', 'farad'))).toBe(27e-9);
    expect(value(parseQuantity('1.5meg', 'hertz'))).toBe(1.5e6);
    expect(value(parseQuantity('1.5 MHz', 'hertz'))).toBe(1.5e6);
    expect(value(parseQuantity('110 mohm', 'ohm'))).toBe(110e-3);
    expect(value(parseQuantity('110m', 'ohm'))).toBe(110e-3);
    expect(value(parseQuantity('2.2k', 'ohm'))).toBe(2.2e3);
    expect(value(parseQuantity('4.7u', 'henry'))).toBe(4.7e-6);
    expect(value(parseQuantity('5e-9', 'second'))).toBe(5e-9);
    expect(value(parseQuantity('100 kHz', 'hertz'))).toBe(100e3);
    expect(value(parseQuantity('0.6 V', 'volt'))).toBe(0.6);
    expect(value(parseQuantity('10%', 'ratio'))).toBe(0.1);
    expect(value(parseQuantity('0.05', 'ratio'))).toBe(0.05);
    expect(value(parseQuantity(8, 'number'))).toBe(8);
    expect(value(parseQuantity('2.5e-3 kHz', 'hertz'))).toBe(2.5);
  });

  it('accepts every unit spelling of each kind', () => {
    expect(value(parseQuantity('310 uH', 'henry'))).toBe(310e-6);
    expect(value(parseQuantity('4.7 \u00b5H', 'henry'))).toBe(4.7e-6);
    expect(value(parseQuantity('470 uF', 'farad'))).toBe(470e-6);
    expect(value(parseQuantity('2 fF', 'farad'))).toBe(2e-15);
    expect(value(parseQuantity('1 F', 'farad'))).toBe(1); // F is farad here, femto is lower-case f
    for (const u of ['ohm', 'ohms', 'Ohm', 'Ohms', '\u03a9', '\u2126']) expect(value(parseQuantity(`10 k${u}`, 'ohm'))).toBe(10e3);
    expect(value(parseQuantity('2.5 mA', 'ampere'))).toBe(2.5e-3);
    expect(value(parseQuantity('1.2 kW', 'watt'))).toBe(1.2e3);
    expect(value(parseQuantity('200 ns', 'second'))).toBe(200e-9);
    expect(value(parseQuantity('200ns', 'second'))).toBe(200e-9);
    expect(value(parseQuantity('3 s', 'second'))).toBe(3);
    expect(value(parseQuantity('100 khz', 'hertz'))).toBe(100e3);
    expect(value(parseQuantity('400V', 'volt'))).toBe(400);
    expect(value(parseQuantity('  +.5e3\tmV ', 'volt'))).toBe(0.5);
  });
});

// The SPICE traps: ngspice manual, section "Some naming conventions" (ngspice manual, "Some naming conventions"):
// SPICE reads M (any case) as milli and only "meg" as mega; this parser refuses a bare M instead of guessing.
describe('meg / M / m traps', () => {
  it('refuses a bare M and offers both spellings', () => {
    const msg = failure(parseQuantity('22M', 'ohm'));
    expect(msg).toContain('"22m"');
    expect(msg).toContain('"22meg"');
    expect(failure(parseQuantity('1.5M', 'hertz'))).toContain('"1.5meg"');
  });
  it('reads M followed by a unit as SI mega', () => {
    expect(value(parseQuantity('2 Mohm', 'ohm'))).toBe(2e6);
    expect(value(parseQuantity('2 MOhm', 'ohm'))).toBe(2e6);
    expect(value(parseQuantity('1.5 MHz', 'hertz'))).toBe(1.5e6);
  });
  it('reads mohm as milliohm and Mohm as megaohm (case sensitive)', () => {
    expect(value(parseQuantity('110 mohm', 'ohm'))).toBe(0.11);
    expect(value(parseQuantity('110 Mohm', 'ohm'))).toBe(110e6);
    expect(value(parseQuantity('1.5 mHz', 'hertz'))).toBe(1.5e-3);
  });
  it('reads meg in any case and before a unit', () => {
    expect(value(parseQuantity('1.5mEg', 'hertz'))).toBe(1.5e6);
    expect(value(parseQuantity('2 megohm', 'ohm'))).toBe(2e6);
  });
});

describe('rejections', () => {
  it('names the expected unit when the unit belongs to another quantity', () => {
    const msg = failure(parseQuantity('27 uH', 'farad'));
    expect(msg).toContain('inductance (H)');
    expect(msg).toMatch(/expected a capacitance in F/);
    expect(failure(parseQuantity('5 V', 'ampere'))).toMatch(/voltage \(V\), not A/);
    expect(failure(parseQuantity('100 kHz', 'second'))).toMatch(/frequency \(Hz\), not s/);
    expect(failure(parseQuantity('5%', 'volt'))).toMatch(/percentage/);
  });
  it.each(['NaN', 'nan', 'Infinity', '-Infinity', '.inf', '', '   ', 'abc', 'k10', '1_000', '0x10', '1,5', '27 n F', '10 V V'])(
    'refuses %j',
    (text) => {
      expect(parseQuantity(text, 'volt').ok).toBe(false);
    },
  );
  it('refuses non-finite numbers given as numbers', () => {
    expect(parseQuantity(NaN, 'volt').ok).toBe(false);
    expect(parseQuantity(Infinity, 'volt').ok).toBe(false);
    expect(parseQuantity(-Infinity, 'ratio').ok).toBe(false);
  });
  it('refuses resistor-code notation and shows the decimal spelling', () => {
    expect(failure(parseQuantity('4k7', 'ohm'))).toContain('"4.7k"');
    expect(failure(parseQuantity('4R7', 'ohm'))).toContain('"4.7"');
    expect(failure(parseQuantity('2M2', 'ohm'))).toContain('"2.2meg"');
  });
  it('refuses unknown trailing letters and suggests the lower-case prefix', () => {
    expect(failure(parseQuantity('27N', 'farad'))).toContain('did you mean "n"');
    expect(failure(parseQuantity('3 mil', 'second'))).toContain('"mil"');
    expect(failure(parseQuantity('10 A', 'volt'))).toContain('current (A)');
  });
  it('refuses values that overflow or underflow', () => {
    expect(failure(parseQuantity('1e400', 'volt'))).toContain('too large');
    expect(failure(parseQuantity('1e308 T', 'volt'))).toContain('too large');
    expect(failure(parseQuantity('1e-320 f', 'farad'))).toContain('too small');
    expect(failure(parseQuantity('1e99999999999999999999', 'volt'))).toContain('too large');
  });
  it('refuses prefixes on ratios and on plain numbers', () => {
    expect(parseQuantity('5m', 'ratio').ok).toBe(false);
    expect(parseQuantity('8%', 'number').ok).toBe(false);
    expect(parseQuantity('8k', 'number').ok).toBe(false);
  });
  it('parses negative numbers (range checks are the caller\'s) and refuses long text', () => {
    expect(value(parseQuantity('-3 uH', 'henry'))).toBe(-3e-6);
    expect(failure(parseQuantity('1'.repeat(100), 'volt'))).toContain('too long');
  });
});

describe('properties', () => {
  it('any decimal with any prefix equals the same decimal with the exponent shifted (JS number grammar as reference)', () => {
    const prefixes: [string, number][] = [['T', 12], ['G', 9], ['meg', 6], ['k', 3], ['m', -3], ['u', -6], ['n', -9], ['p', -12], ['f', -15]];
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99999 }), fc.integer({ min: 0, max: 999 }), fc.constantFrom(...prefixes), (a, b, [p, e]) => {
        const text = `${a}.${String(b).padStart(3, '0')}${p}`;
        expect(value(parseQuantity(text, 'ohm'))).toBe(Number(`${a}.${String(b).padStart(3, '0')}e${e}`));
      }),
    );
  });
  it('never throws and never returns a non-finite value for arbitrary text', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 30 }), fc.constantFrom('henry', 'ohm', 'ratio', 'number') as fc.Arbitrary<'henry'>, (text, kind) => {
        const r = parseQuantity(text, kind);
        if (r.ok) expect(Number.isFinite(r.value)).toBe(true);
      }),
    );
  });
});
