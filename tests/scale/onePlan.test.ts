// decks and run read one plan: the same corners in the same order, the decks built from its start points.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';
import { loadDesign } from '../../src/design/index.js';
import { planStudy } from '../../src/plan/plan.js';
import { handDeck } from '../../src/cli/decks.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-oneplan-'));

describe('one plan for decks and run', () => {
  it('decks lists the corners run --dry-run plans, each deck from the plan item; --shard splits them alike', async () => {
    const r = await loadDesign(DEMO_FILE);
    if (!r.ok) throw new Error('demo invalid');
    const plan = planStudy(r.design, {});
    const dry = await runCli(['run', DEMO_FILE, '--dry-run']);
    const planned = dry.stdout.split('\n').filter((l) => /^\s+\d+\s/.test(l)).map((l) => l.trim().split(/\s+/)[1]);
    expect(planned).toEqual(plan.items.map((it) => it.corner.id));
    const out = join(dir, 'all');
    expect((await runCli(['decks', DEMO_FILE, '-o', out])).code).toBe(0);
    const index = readFileSync(join(out, 'index.csv'), 'utf8').trim().split('\r\n').slice(1).map((l) => l.split(','));
    expect(index.map((row) => row[0])).toEqual(planned);
    for (const it of plan.items) {
      expect(readFileSync(join(out, `${it.corner.id}.cir`), 'utf8')).toBe(handDeck(r.design, it));
      expect(Number(index[it.index]![3])).toBe(it.start!.fs);
    }
    const parts = [];
    for (const k of [1, 2, 3]) {
      const d = join(dir, `shard-${k}`);
      expect((await runCli(['decks', DEMO_FILE, '-o', d, '--shard', `${k}/3`])).code).toBe(0);
      const mine = (await runCli(['run', DEMO_FILE, '--dry-run', '--shard', `${k}/3`])).stdout.split('\n').filter((l) => / \*$/.test(l)).map((l) => l.trim().split(/\s+/)[1]);
      const decks = readdirSync(d).filter((f) => f.endsWith('.cir')).map((f) => f.slice(0, -4)).sort();
      expect(decks).toEqual([...mine].sort());
      parts.push(...decks);
    }
    expect(parts.sort()).toEqual([...planned].sort());
  });
});
