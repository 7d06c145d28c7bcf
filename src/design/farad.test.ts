import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { parseDesign } from './parse.js';

const demo = readFileSync(new URL('../../examples/demo.yaml', import.meta.url), 'utf8');

describe('a farad in tank.cr', () => {
  it('is refused, not only warned about, as docs/design-file.md says (F is farad, f femto)', () => {
    const r = parseDesign(demo.replace('cr: 42 nF', 'cr: 1F'), 'demo.yaml');
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.problems.map((p) => p.path)).toContain('tank.cr');
  });

  it('accepts the largest plausible Cr, 1 mF', () => {
    expect(parseDesign(demo.replace('cr: 42 nF', 'cr: 1 mF'), 'demo.yaml').ok).toBe(true);
  });
});
