// Both real engines on the same decks: names, values and failure kinds must agree. Slow-tagged.
import { readFileSync } from 'node:fs';
import { afterAll, describe, expect, it } from 'vitest';
import { createEngine } from './index.js';
import type { SimResult } from './types.js';
import { locate, valueAt } from '../measure/window.js';
import { sharedFile } from '../../tests/support/shared.js';

const deckFile = (name: string) => readFileSync(sharedFile('raw', name), 'latin1');
const engines = [createEngine('ngspice'), createEngine('wasm')];
afterAll(() => Promise.all(engines.map((e) => e.close())));
const runBoth = (deck: string) => Promise.all(engines.map((e) => e.run({ id: e.name, deck, timeoutMs: 20_000 })));

/** Largest difference of `name` between two results on the first one's grid, relative to its peak. */
function relativeGap(a: SimResult, b: SimResult, name: string): number {
  const ya = a.vectors[name];
  const peak = ya.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
  return a.vectors.time.reduce((m, t, i) => Math.max(m, Math.abs(ya[i] - valueAt(b.vectors[name], locate(b.vectors.time, t)))), 0) / peak;
}

describe('native ngspice and wasm agree', () => {
  it('return the same lower-case vector names and values (within 1e-3 relative) for an RC/RL deck', async () => {
    // Upper-case names in the deck come back lower-case from both; V(a,b) saves v(a) and v(b).
    const deck = deckFile('rc-tran.cir').replace(/^\.save .*$/m, '.save V(OUT) I(VSENSE) @R2[I] V(IN,MID)');
    const [n, w] = await runBoth(deck);
    expect(n.ok && w.ok).toBe(true);
    expect(Object.keys(n.vectors)).toEqual(['time', 'i(@r2[i])', 'i(vsense)', 'v(in)', 'v(mid)', 'v(out)']);
    expect(Object.keys(w.vectors)).toEqual(Object.keys(n.vectors));
    for (const name of ['v(out)', 'i(vsense)', 'i(@r2[i])', 'v(mid)']) expect(relativeGap(n, w, name)).toBeLessThan(1e-3);
  });

  it('both report a syntax error as an input failure', async () => {
    const rs = await runBoth('bad\nV1 in 0 1\nR1 in out 1k\nX1 out 0 nosuch\n.tran 1u 1m\n.end\n');
    for (const r of rs) expect(r.failure?.kind).toBe('input');
  });

  it('both report the chattering-switch deck as convergence at t = 1 us', async () => {
    const rs = await runBoth(deckFile('timestep-abort.cir'));
    for (const r of rs) {
      expect(r.failure).toMatchObject({ kind: 'convergence', atTime: 1e-6 });
      expect(r.partial).toBe(true);
    }
  });
});
