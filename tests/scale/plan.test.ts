// The plan CLI surface without an engine: --dry-run, --shard-index-env (0-based), fingerprint, cache prune.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, mkdirSync, writeFileSync, utimesSync, existsSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';
import { studyFingerprint } from '../../src/cli/fingerprint.js';
import { parseSize } from '../../src/cli/cache.js';
import { loadDesign } from '../../src/design/index.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-plan-'));

describe('run --dry-run', () => {
  it('prints every corner with its cost and the shard split, starts no engine, writes nothing', async () => {
    const out = join(dir, 'dry');
    // an engine that does not exist would fail at once: the dry run never asks for it
    const r = await runCli(['run', DEMO_FILE, '--dry-run', '--shard', '2/3', '--engine', 'ngspice', '--ngspice-path', '/nonexistent/ngspice', '--out', out]);
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^plan: 6 corners, 6 to simulate, estimated cost 12\.00/);
    // six regulated corners of cost 2: two per shard (LPT, deal in plan order)
    expect(r.stdout).toMatch(/shards: 1\/3: 2 corners, cost 4\.00; 2\/3: 2 corners, cost 4\.00; 3\/3: 2 corners, cost 4\.00/);
    expect(r.stdout.split('\n').filter((l) => / \*$/.test(l)).map((l) => l.trim().split(/\s+/)[1])).toEqual(['v340_100pct_reg_nom', 'v410_25pct_reg_nom']);
    expect(existsSync(out)).toBe(false);
  });

  it('--shard-index-env reads a 0-based index: 1 is shard 2/3', async () => {
    process.env['TC_TEST_INDEX'] = '1';
    try {
      const r = await runCli(['run', DEMO_FILE, '--dry-run', '--shard-index-env', 'TC_TEST_INDEX', '--shard', '3']);
      expect(r.code).toBe(0);
      expect(r.stdout).toMatch(/this shard \(2\/3, marked \*\): 2 corners/);
      const bad = await runCli(['run', DEMO_FILE, '--dry-run', '--shard-index-env', 'TC_TEST_INDEX', '--shard', '1/3']);
      expect(bad.code).toBe(2);
      expect(bad.stderr).toMatch(/disagrees with TC_TEST_INDEX=1/);
      process.env['TC_TEST_INDEX'] = '3';
      expect((await runCli(['run', DEMO_FILE, '--dry-run', '--shard-index-env', 'TC_TEST_INDEX', '--shard', '3'])).code).toBe(2);
    } finally {
      delete process.env['TC_TEST_INDEX'];
    }
  });

  it('bad --shard exits 2', async () => {
    for (const s of ['0/3', '4/3', '3', 'a/b']) expect((await runCli(['run', DEMO_FILE, '--dry-run', '--shard', s])).code, s).toBe(2);
  });
});

describe('study fingerprint', () => {
  it('depends on design content, engine version and plan settings, not on the file name', async () => {
    const r = await loadDesign(DEMO_FILE);
    if (!r.ok) throw new Error('demo invalid');
    const e = { name: 'ngspice', version: 'ngspice-42' };
    const f = studyFingerprint({ ...r.design, file: 'a.yaml' }, e, {});
    expect(studyFingerprint({ ...r.design, file: 'b/c.yaml' }, e, {})).toBe(f);
    expect(studyFingerprint(r.design, { ...e, version: 'ngspice-43' }, {})).not.toBe(f);
    expect(studyFingerprint({ ...r.design, tank: { ...r.design.tank, cr: r.design.tank.cr * 1.01 } }, e, {})).not.toBe(f);
    expect(studyFingerprint(r.design, e, { only: '*100pct*' })).not.toBe(f);
  });
});

describe('cache prune', () => {
  it('parses binary sizes and refuses ambiguous ones', () => {
    expect(parseSize('500M')).toBe(500 * 1024 * 1024);
    expect(parseSize('2k')).toBe(2048);
    expect(parseSize('1.5G')).toBe(1.5 * 1024 ** 3);
    expect(parseSize('1234')).toBe(1234);
    for (const s of ['', '-1M', '5 mb', '5T', 'M']) expect(parseSize(s), s).toBeNull();
  });

  it('removes the oldest entries until the cache fits; exit 2 on a bad size', async () => {
    const cache = join(dir, 'cache');
    const names = ['aa', 'bb', 'cc', 'dd'].map((p, i) => join(cache, p, `${p}${String(i).repeat(62)}.json`));
    names.forEach((n, i) => {
      mkdirSync(join(n, '..'), { recursive: true });
      writeFileSync(n, 'x'.repeat(1000));
      utimesSync(n, 1_000_000 + i * 100, 1_000_000 + i * 100); // aa oldest .. dd newest
    });
    const r = await runCli(['cache', 'prune', '--cache-dir', cache, '--max-size', '2k']);
    expect(r.code).toBe(0);
    expect(names.map((n) => existsSync(n))).toEqual([false, false, true, true]);
    expect(r.stdout).toMatch(/4 entries, 4000 bytes; removed 2 oldest \(2000 bytes\)/);
    expect((await runCli(['cache', 'prune', '--cache-dir', cache, '--max-size', '5 mb'])).code).toBe(2);
    expect(readFileSync(names[3]!, 'utf8')).toHaveLength(1000);
  });
});
