import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeUtf8, firstInvalidUtf8 } from './utf8.js';

// Reference: the WHATWG Encoding Standard UTF-8 decoder as implemented by Node's TextDecoder
// (fatal mode), itself following RFC 3629.
const referenceValid = (bytes: Uint8Array): boolean => {
  try {
    new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    return true;
  } catch {
    return false;
  }
};

describe('UTF-8 validation', () => {
  it('agrees with TextDecoder on random byte strings', () => {
    fc.assert(fc.property(fc.uint8Array({ maxLength: 24 }), (b) => {
      expect(firstInvalidUtf8(b) < 0).toBe(referenceValid(b));
    }), { numRuns: 3000 });
  });
  it('agrees with TextDecoder on strings biased towards multi-byte sequences', () => {
    const byte = fc.oneof(fc.integer({ min: 0x80, max: 0xbf }), fc.integer({ min: 0xc0, max: 0xff }), fc.integer({ min: 0, max: 0x7f }));
    fc.assert(fc.property(fc.array(byte, { maxLength: 8 }), (a) => {
      const b = Uint8Array.from(a);
      expect(firstInvalidUtf8(b) < 0).toBe(referenceValid(b));
    }), { numRuns: 5000 });
  });
  it('locates the first bad byte by line and column and strips a BOM', () => {
    const bytes = Uint8Array.from([...Buffer.from('name: a\nlr: 6'), 0xb5, ...Buffer.from('H\n')]);
    expect(decodeUtf8(bytes)).toEqual({ ok: false, offset: 13, line: 2, column: 6, byte: 0xb5 });
    expect(decodeUtf8(Uint8Array.from([0xef, 0xbb, 0xbf, 0x61]))).toEqual({ ok: true, text: 'a' });
    expect(decodeUtf8(Buffer.from('4.7 \u00b5H'))).toEqual({ ok: true, text: '4.7 \u00b5H' });
    // overlong "/" and an encoded surrogate are invalid (RFC 3629 section 3)
    expect(firstInvalidUtf8(Uint8Array.from([0xc0, 0xaf]))).toBe(0);
    expect(firstInvalidUtf8(Uint8Array.from([0x41, 0xed, 0xa0, 0x80]))).toBe(1);
  });
});
