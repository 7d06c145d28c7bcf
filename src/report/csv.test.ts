import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { renderCsv } from './csv.js';

describe('renderCsv', () => {
  it('escapes text a spreadsheet would run as a formula and leaves numbers as numbers (OWASP, CSV Injection)', () => {
    const text = renderCsv([['reason', 'error', 'flag'], ['=HYPERLINK("x")', -0.03, true], ['@SUM(1)', Number.NaN, false], ['-2+3', 1e-9, null]]);
    expect(text.split('\r\n')[1]).toBe('"\'=HYPERLINK(""x"")",-0.03,true');
    const rows = parse(text, { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r['reason'])).toEqual(['\'=HYPERLINK("x")', '\'@SUM(1)', '\'-2+3']);
    expect(rows.map((r) => r['error'])).toEqual(['-0.03', '', '1e-9']);
    expect(rows.map((r) => r['flag'])).toEqual(['true', 'false', '']);
  });
});
