import { describe, expect, it } from 'vitest';
import { parseMeasured } from './parse.js';
import type { MeasuredParse } from './types.js';

const points = (r: MeasuredParse) => {
  if (!r.ok) throw new Error(JSON.stringify(r.problems));
  return r.points;
};
const problems = (r: MeasuredParse) => {
  if (r.ok) throw new Error('expected problems');
  return r.problems;
};

describe('parseMeasured', () => {
  it('reads units in cells into SI values', () => {
    const p = points(parseMeasured('vin,load,fs,vout,pin,note\n390 V,50%,98.5 kHz,24.1 V,131.2 W,warm\n'));
    expect(p).toEqual([{ line: 2, vin: 390, load: { kind: 'percent', value: 0.5 }, fs: 98_500, vout: 24.1, pin: 131.2, note: 'warm' }]);
  });

  it('gives bare numbers the unit of their header and reads absolute loads', () => {
    const p = points(parseMeasured('vin [V],load [A],fs [kHz],vout [V],iin [mA]\n340,10,80.2,23.95,812\n'));
    expect(p[0].vin).toBe(340);
    expect(p[0].load).toEqual({ kind: 'ampere', value: 10 });
    expect(p[0].fs).toBeCloseTo(80_200, 9);
    expect(p[0].iin).toBeCloseTo(0.812, 12);
  });

  it('reads a share-of-power header unit without a space', () => {
    expect(points(parseMeasured('vin,load [%],fs,vout\n390 V,25,100 kHz,24 V\n'))[0].load).toEqual({ kind: 'percent', value: 0.25 });
  });

  it('accepts semicolons, a byte-order mark, CRLF and empty lines, keeping true line numbers', () => {
    const p = points(parseMeasured('\ufeffvin;load;fs;vout\r\n\r\n390 V;100%;91 kHz;24.0 V\r\n\r\n410 V;25%;120 kHz;24.2 V\r\n'));
    expect(p.map((x) => x.line)).toEqual([3, 5]);
    expect(p[1].vin).toBe(410);
  });

  it('skips whole-line # comments, keeping line numbers and a # inside a note', () => {
    const p = points(parseMeasured('# bench log, unit 2\nvin,load,fs,vout,note\n# warm-up\n390 V,50%,99 kHz,24 V,probe #3\n'));
    expect(p).toEqual([{ line: 4, vin: 390, load: { kind: 'percent', value: 0.5 }, fs: 99_000, vout: 24, note: 'probe #3' }]);
  });

  it('names a missing required column, and suggests the intended one for a misspelt header', () => {
    const pr = problems(parseMeasured('vin,lod,fs\n390 V,50%,90 kHz\n'));
    expect(pr).toContainEqual({ line: 1, column: 5, field: 'lod', message: 'unknown column; did you mean "load"?' });
    expect(pr).toContainEqual({ line: 1, column: 1, field: 'vout', message: 'required column is missing' });
  });

  it('reports every bad cell at once with its line and character column', () => {
    const pr = problems(parseMeasured('vin,load,fs,vout\n390 V,50%,1 uH,24 V\n390 V,,90 kHz,24 V\n12 M,50%,90 kHz,-3 V\n'));
    expect(pr.map((p) => [p.line, p.column, p.field])).toEqual([[2, 11, 'fs'], [3, 7, 'load'], [4, 1, 'vin'], [4, 17, 'vout']]);
    expect(pr[0].message).toMatch(/unit of inductance/);
    expect(pr[2].message).toMatch(/ambiguous/);
    expect(pr[3].message).toMatch(/greater than 0/);
  });

  it('refuses a header unit of the wrong kind, and duplicate columns', () => {
    const pr = problems(parseMeasured('vin [A],load,fs,vout,vout\n1,50%,90 kHz,24 V,24 V\n'));
    expect(pr.map((p) => p.field)).toEqual(['vin', 'vout']);
    expect(pr[0].message).toMatch(/does not fit/);
    expect(pr[1].message).toMatch(/twice/);
  });

  it('reports an unclosed quote as unreadable CSV, and an empty file', () => {
    expect(problems(parseMeasured('vin,load,fs,vout\n"390 V,50%,90 kHz,24 V\n'))[0].message).toMatch(/not readable as CSV/);
    expect(problems(parseMeasured('\n\n'))[0].message).toMatch(/empty/);
    expect(problems(parseMeasured('vin,load,fs,vout\n'))[0].message).toMatch(/no rows/);
  });

  it('reads a 10,000-row file completely', () => {
    const rows = Array.from({ length: 10_000 }, (_, i) => `${340 + (i % 70)} V,${(i % 100) + 1}%,${80 + (i % 50)} kHz,24.0${i % 10} V`);
    const p = points(parseMeasured(['vin,load,fs,vout', ...rows].join('\n')));
    expect(p).toHaveLength(10_000);
    expect(p[9_999]).toMatchObject({ line: 10_001, vin: 340 + (9_999 % 70), fs: 129_000, vout: 24.09 });
  });
});
