import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { esc, idPart, rowAnchor } from './escape.js';

describe('esc', () => {
  it('replaces the five HTML-special characters (HTML Living Standard: text and attribute values)', () => {
    expect(esc(`<a href="x" title='y'>&</a>`)).toBe('&lt;a href=&quot;x&quot; title=&#39;y&#39;&gt;&amp;&lt;/a&gt;');
    expect(esc(null)).toBe('');
    expect(esc(42)).toBe('42');
  });

  it('never leaves a raw < > " \' in any string (property)', () => {
    fc.assert(fc.property(fc.string(), (s) => !/[<>"']/.test(esc(s))));
  });
});

describe('idPart', () => {
  it('keeps corner ids readable and encodes everything else', () => {
    expect(rowAnchor('v340_25pct_reg_nom')).toBe('c-v340_5f_25pct_5f_reg_5f_nom');
    expect(idPart('a.b-C9')).toBe('a.b-C9');
    expect(idPart('"><x>')).toBe('_22__3e__3c_x_3e_');
  });

  it('is injective and yields only [A-Za-z0-9._-] (property)', () => {
    fc.assert(fc.property(fc.string(), fc.string(), (a, b) => a === b || idPart(a) !== idPart(b)));
    fc.assert(fc.property(fc.string({ unit: 'grapheme' }), (a) => /^[A-Za-z0-9._-]*$/.test(idPart(a))));
  });
});
