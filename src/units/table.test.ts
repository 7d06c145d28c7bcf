import { describe, expect, it } from 'vitest';
import { parseLoad } from './parseLoad.js';
import { parseQuantity } from './parse.js';
import { loadPattern, quantityPattern, type UnitKind } from './table.js';

// The JSON Schema patterns must accept exactly what the parser accepts (except over/underflow,
// which a regular expression cannot see).
const samples = [
  '27n', '27 nF', '27nF', '1.5meg', '1.5 MHz', '110 mohm', '110m', '2.2k', '4.7u', '5e-9', '100 kHz', '0.6 V',
  '10%', '22M', '2 Mohm', '27 uH', '4k7', 'NaN', 'Infinity', '', 'abc', '1F', '1f', '10 k\u03a9', '.5e3 mV', '0x10',
  '8', '8%', '-3 uH', '4.7\u00b5H', '27N', '3 mil', '5 A', '1.2 kW', '300mA', '2 megohm', '1.5mEg', '200ns', '12',
];
const kinds: UnitKind[] = ['henry', 'farad', 'ohm', 'volt', 'ampere', 'watt', 'second', 'hertz', 'ratio', 'number'];

describe('quantityPattern', () => {
  it.each(kinds)('agrees with parseQuantity for %s', (kind) => {
    const re = new RegExp(quantityPattern(kind), 'u');
    for (const s of samples) expect([s, re.test(s)]).toEqual([s, parseQuantity(s, kind).ok]);
  });
  it('agrees with parseLoad', () => {
    const re = new RegExp(loadPattern(), 'u');
    for (const s of samples) expect([s, re.test(s)]).toEqual([s, parseLoad(s).ok]);
  });
});
