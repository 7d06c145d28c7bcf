// What the documentation says `tolerances.corners: extremes` does must be what toleranceSets does.
import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { toleranceSets } from '../../src/corners/expand.js';
import { makeDesign } from '../support/design.js';
import { SECTION_FIELDS } from '../../src/design/fields.js';

const read = (p: string) => readFileSync(new URL(`../../${p}`, import.meta.url), 'utf8');
const extremes = (lr: number, cr: number, lm: number) =>
  toleranceSets(makeDesign({ tolerances: { lr, cr, lm, corners: 'extremes' } }));

describe('tolerances.corners: extremes', () => {
  it('makes 9 tank sets: nominal plus every low/high combination, never a mixed -/0/+ set', () => {
    const sets = extremes(0.05, 0.05, 0.1);
    expect(sets).toHaveLength(9);
    expect(sets[0]).toEqual({ lr: 0, cr: 0, lm: 0 });
    for (const s of sets.slice(1)) expect([s.lr, s.cr, s.lm].every((x) => x === -1 || x === 1)).toBe(true);
    expect(new Set(sets.map((s) => JSON.stringify(s))).size).toBe(9);
  });
  it('keeps an element with 0 tolerance nominal: 5 sets with one such element, 3 with two, 1 with three', () => {
    expect(extremes(0, 0.05, 0.1)).toHaveLength(5);
    expect(extremes(0, 0, 0.1)).toHaveLength(3);
    expect(extremes(0, 0, 0)).toHaveLength(1);
  });
  it('docs/design-file.md, the README, the field help and the schema say so, not "-/0/+"', () => {
    const texts = [read('docs/design-file.md'), read('README.md'), read('schema/design.schema.json'), JSON.stringify(SECTION_FIELDS)];
    for (const t of texts) expect(t).not.toMatch(/-\/0\/\+/);
    expect(read('docs/design-file.md')).toMatch(/`extremes`: the nominal set plus every combination of Lr, Cr, Lm each at its low or high extreme: 9 tank sets/);
    expect(read('README.md')).toMatch(/corners: extremes }\s+# 9 tank sets: nominal \+ every low\/high combination/);
  });
});
