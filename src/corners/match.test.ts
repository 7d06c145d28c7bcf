import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { matchesPattern } from './match.js';

/** Reference: the pattern as an anchored, case-insensitive regular expression (fine for short inputs). */
function byRegExp(pattern: string, id: string): boolean {
  if (!/[*?]/.test(pattern)) return id.toLowerCase().includes(pattern.toLowerCase());
  const body = pattern.split('').map((c) => (c === '*' ? '.*' : c === '?' ? '.' : c.replace(/[.+^${}()|[\]\\]/g, '\\$&'))).join('');
  return new RegExp(`^${body}$`, 'is').test(id);
}

describe('matchesPattern', () => {
  it('wildcards match the whole id, a plain pattern any part of it, in either case', () => {
    expect(matchesPattern('v340_*', 'v340_100pct_reg_nom')).toBe(true);
    expect(matchesPattern('v34?_*_nom', 'V340_100pct_reg_nom')).toBe(true);
    expect(matchesPattern('*_nom', 'v340_100pct_reg_lrH-crL-lmH')).toBe(false);
    expect(matchesPattern('100pct', 'v340_100pct_reg_nom')).toBe(true);
    expect(matchesPattern('v340_', 'v390_100pct_reg_nom')).toBe(false);
    expect(matchesPattern('*', '')).toBe(true);
    expect(matchesPattern('?', '')).toBe(false);
    expect(matchesPattern('a*a', 'a')).toBe(false);
  });

  it('agrees with a regular-expression reference on 3000 random patterns and ids', () => {
    const ch = fc.constantFrom('a', 'b', 'A', '0', '_', '*', '?', '.');
    fc.assert(fc.property(fc.string({ unit: ch, maxLength: 12 }), fc.string({ unit: fc.constantFrom('a', 'b', 'B', '0', '_', '.'), maxLength: 16 }),
      (p, id) => matchesPattern(p, id) === byRegExp(p, id)), { numRuns: 3000, seed: 11 });
  });

  it('twenty "*0" pairs and an "x" against long ids finish at once (a backtracking matcher took over 20 s)', () => {
    const pattern = `${'*0'.repeat(20)}x`;
    const id = '0'.repeat(60);
    const t0 = performance.now();
    for (let i = 0; i < 200; i++) expect(matchesPattern(pattern, id)).toBe(false);
    // a sanity bound against a hang, not a benchmark: (60 x 41) comparisons per call
    expect(performance.now() - t0).toBeLessThan(1000);
  });
});
