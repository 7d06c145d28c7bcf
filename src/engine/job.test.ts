import { describe, expect, it } from 'vitest';
import { checkJob, isSafeIncludePath, timeLimitMs } from './job.js';

describe('checkJob', () => {
  it('accepts ASCII decks with relative include paths', () => {
    expect(checkJob({ id: 'a', deck: 't\nR1 a 0 1k\n.end\n', includes: { 'lib/m.lib': '* ok\n', '.spiceinit': '' }, timeoutMs: 1 })).toBeUndefined();
  });

  it('rejects non-ASCII text (the wasm engine hangs on it) and escaping include paths', () => {
    expect(checkJob({ id: 'a', deck: 't\nL1 a 0 50\u00b5H\n.end\n', timeoutMs: 1 })).toBe('deck is not 7-bit ASCII');
    expect(checkJob({ id: 'a', deck: 't\n.end\n', includes: { 'm.lib': '\u03a9' }, timeoutMs: 1 })).toMatch(/ASCII/);
    expect(checkJob({ id: 'a', deck: 't\n.end\n', includes: { 'Deck.cir': '*' }, timeoutMs: 1 })).toMatch(/reserved/);
    for (const p of ['../x.lib', '/etc/passwd', 'a/../../b', 'a\\b', 'C:x', '', 'a//b']) expect(isSafeIncludePath(p)).toBe(false);
  });
});

describe('timeLimitMs', () => {
  it('turns the job limit into a safe timer delay', () => {
    expect(timeLimitMs(1500.2)).toBe(1501);
    expect(timeLimitMs(0)).toBeUndefined();
    expect(timeLimitMs(Infinity)).toBeUndefined();
    expect(timeLimitMs(Number.NaN)).toBeUndefined();
    expect(timeLimitMs(1e12)).toBe(2_147_483_647);
  });
});
