// The corner cache is only an accelerator (system ngspice, two corners): an entry copied over
// another, an entry holding {"result":null}, and a cache folder that cannot be written each give a
// warning and the same results.json, byte for byte, as a run without the cache.
import { copyFileSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-cache-'));
const design = join(dir, 'two.yaml');
const cache = join(dir, 'cache');
let reference = '';
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** Cache files, as [folder/name] paths. */
const entries = (): string[] => readdirSync(cache).flatMap((d) => readdirSync(join(cache, d)).map((f) => join(cache, d, f))).sort();

async function run(out: string, extra: string[] = []): Promise<{ stderr: string; json: string }> {
  const r = await runCli(['run', design, '--engine', 'ngspice', '-o', join(dir, out), '--quiet', ...extra]);
  expect(r.code, r.stderr).toBe(0);
  return { stderr: r.stderr, json: readFileSync(join(dir, out, 'results.json'), 'utf8') };
}

beforeAll(async () => {
  // two corners of the demo with loose tolerances, so that they pass
  writeFileSync(design, readFileSync(DEMO_FILE, 'utf8').replace(/vin: \[.*\]/, 'vin: [390 V]').replace(/load: \[.*\]/, 'load: [50%, 100%]')
    .replace(/compare:[\s\S]*$/, 'compare:\n  vout: 50%\n  fs: 50%\n  gain: 50%\n  currents: 90%\n  voltages: 50%\n'));
  reference = (await run('plain', ['--no-cache'])).json;
  expect((await run('first', ['--cache-dir', cache])).json).toBe(reference);
  expect(entries()).toHaveLength(2);
});

describe('cache entries are checked against their key and corner', () => {
  it('one entry copied over the other: a miss with a warning, no corner twice, no corner lost', async () => {
    const [a, b] = entries();
    copyFileSync(a!, b!);
    const r = await run('copied', ['--cache-dir', cache]);
    expect(r.stderr).toMatch(/warning: cache entry .* ignored \(it holds another key: the file was copied or renamed\); corner v390_\w+ is simulated again/);
    expect(JSON.parse(readFileSync(join(dir, 'copied', 'run-log.json'), 'utf8')).fromCache).toHaveLength(1);
    expect(r.json).toBe(reference);
    expect(JSON.parse(readFileSync(b!, 'utf8')).key).toBe(b!.replace(/^.*\/|\.json$/g, '')); // rewritten
  });

  it('an entry holding {"result":null} or broken JSON: a miss with a warning, not a crash', async () => {
    const [a, b] = entries();
    writeFileSync(a!, '{"result":null}');
    writeFileSync(b!, '{"format":');
    const r = await run('nulls', ['--cache-dir', cache]);
    expect(r.stderr).toMatch(/cache entry .* ignored \(format undefined, expected \d+\)/);
    expect(r.stderr).toMatch(/cache entry .* ignored \(not valid JSON\)/);
    expect(r.json).toBe(reference);
  });

  it('an entry with its own key and corner but a hand-edited outcome is refused by the results reader', async () => {
    const [a] = entries();
    const e = JSON.parse(readFileSync(a!, 'utf8'));
    e.outcome.result.sim.vout = 'high';
    writeFileSync(a!, JSON.stringify(e));
    const r = await run('edited', ['--cache-dir', cache]);
    expect(r.stderr).toMatch(/ignored \(outcome\.result\.sim\.vout: expected a number, got "high"\)/);
    expect(r.json).toBe(reference);
  });

  it('a cache folder that cannot be written (/proc: root cannot create files there either) is a warning; the run goes on', async () => {
    const r = await run('nocache', ['--cache-dir', '/proc/tankcheck-cache']);
    expect(r.stderr).toMatch(/warning: cache \/proc\/tankcheck-cache cannot be written .*; corners are simulated without it/);
    expect(r.json).toBe(reference);
  });
});
