// Shards and merge on the system ngspice: three parts merged give the single run's bytes; every refusal exits 2.
import { describe, expect, it, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync, cpSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-shards-'));
// three regulated full-load corners of the demo: one per shard, cheap on ngspice
const base = [DEMO_FILE, '--engine', 'ngspice', '--only', '*100pct*'];
const FILES = ['results.json', 'results.csv', 'junit.xml', 'waveforms.json'];

describe('three shards merged equal one run (system ngspice)', () => {
  beforeAll(async () => {
    expect([0, 1]).toContain((await runCli(['run', ...base, '--no-cache', '--out', join(dir, 'single')])).code);
    for (const k of [1, 2, 3]) {
      const r = await runCli(['run', ...base, '--cache-dir', join(dir, `cache-${k}`), '--shard', `${k}/3`, '--out', join(dir, `part-${k}`)]);
      expect([0, 1]).toContain(r.code);
    }
  }, 240_000);

  it('each part marks its shard; merge writes the single run byte for byte', async () => {
    const p2 = JSON.parse(readFileSync(join(dir, 'part-2', 'results.json'), 'utf8'));
    expect(p2.shard).toMatchObject({ index: 2, count: 3, total: 3 });
    expect(p2.shard.fingerprint).toMatch(/^[0-9a-f]{64}$/);
    const single = JSON.parse(readFileSync(join(dir, 'single', 'results.json'), 'utf8'));
    expect(single.corners).toHaveLength(3);
    const r = await runCli(['merge', join(dir, 'part-3'), join(dir, 'part-1', 'results.json'), join(dir, 'part-2'), '--out', join(dir, 'merged'), '--html', join(dir, 'merged', 'report.html')]);
    // the merged exit code is the single run's verdict
    const s = await runCli(['run', ...base, '--cache-dir', join(dir, 'cache-1'), '--out', join(dir, 'single-again')]);
    expect(r.code).toBe(s.code);
    for (const f of FILES) expect(readFileSync(join(dir, 'merged', f), 'utf8'), f).toBe(readFileSync(join(dir, 'single', f), 'utf8'));
    expect(readFileSync(join(dir, 'merged', 'report.html'), 'utf8')).toContain('<html');
  }, 120_000);

  it('refuses a missing shard, a duplicate, a foreign part and a truncated part: exit 2, nothing written', async () => {
    const p = (k: number) => join(dir, `part-${k}`);
    const cases: { parts: string[]; message: RegExp }[] = [
      { parts: [p(1), p(2)], message: /missing shard 3\/3/ },
      { parts: [p(1), p(2), p(2), p(3)], message: /shard 2\/3 is given twice/ },
    ];
    // a part of another design or engine version carries another fingerprint
    const foreign = join(dir, 'foreign');
    mkdirSync(foreign, { recursive: true });
    const other = JSON.parse(readFileSync(join(p(3), 'results.json'), 'utf8'));
    other.shard.fingerprint = 'f'.repeat(64);
    writeFileSync(join(foreign, 'results.json'), JSON.stringify(other));
    cases.push({ parts: [p(1), p(2), foreign], message: /foreign[/\\]results\.json: from another study/ });
    const cut = join(dir, 'cut');
    cpSync(p(3), cut, { recursive: true });
    const text = readFileSync(join(cut, 'results.json'), 'utf8');
    writeFileSync(join(cut, 'results.json'), text.slice(0, text.length / 2));
    cases.push({ parts: [p(1), p(2), cut], message: /cut[/\\]results\.json:\d+:\d+: not valid JSON: the file ends early/ });
    const noItems = join(dir, 'no-items');
    mkdirSync(noItems, { recursive: true });
    delete other.shard.items;
    writeFileSync(join(noItems, 'results.json'), JSON.stringify(other));
    cases.push({ parts: [p(1), p(2), noItems], message: /no-items[/\\]results\.json\S*: shard\.items/ });
    for (const [i, c] of cases.entries()) {
      const out = join(dir, `refused-${i}`);
      const r = await runCli(['merge', ...c.parts, '--out', out]);
      expect(r.code, c.message.source).toBe(2);
      expect(r.stderr).toMatch(c.message);
      expect(existsSync(out)).toBe(false);
    }
  });
});
