// The tankcheck command line: exit codes (README table), outputs, baseline regression, hand decks.
import { describe, expect, it, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execa } from 'execa';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-cli-'));
const demoText = readFileSync(DEMO_FILE, 'utf8');

/** A one-corner variant of the demo with loose compare tolerances, so that it passes. */
function passingDesign(file: string, cr = '42 nF'): string {
  const text = demoText
    .replace(/vin: \[.*\]/, 'vin: [390 V]').replace(/load: \[.*\]/, 'load: [100%]').replace(/cr: 42 nF/, `cr: ${cr}`)
    .replace(/compare:[\s\S]*$/, 'compare:\n  vout: 50%\n  fs: 50%\n  gain: 50%\n  currents: 90%\n  voltages: 50%\n');
  const path = join(dir, file);
  writeFileSync(path, text);
  return path;
}

describe('tankcheck fha and init', () => {
  it('init writes the demo; fha prints one row per corner and writes JSON and CSV', async () => {
    const file = join(dir, 'demo.yaml');
    expect((await runCli(['init', file])).code).toBe(0);
    expect((await runCli(['init', file])).code).toBe(2); // refuses to overwrite
    const json = join(dir, 'fha.json');
    const r = await runCli(['fha', file, '--json', json, '--csv', join(dir, 'fha.csv')]);
    expect(r.code).toBe(0);
    expect(r.stdout.split('\n').filter((l) => /^v\d/.test(l))).toHaveLength(6);
    const results = JSON.parse(readFileSync(json, 'utf8'));
    expect(results.schema).toBe('tankcheck/results@1');
    // regulated FHA hits the target gain exactly: n (Vo + VF) / Vin_eff = 8 (24 + 0.5) / 170 at
    // 340 V (the conversion ratio of Steigerwald 1988 / Erickson & Maksimovic ch. 19, from memory)
    const low = results.corners.find((c: { id: string }) => c.id === 'v340_100pct_reg_nom');
    expect(low.fha.gain).toBeCloseTo((8 * 24.5) / 170, 9);
  });

  it('an invalid design exits 2, names every problem with file, path and line, and writes nothing', async () => {
    const bad = join(dir, 'bad.yaml');
    writeFileSync(bad, demoText.replace('lm: 300 uH', 'lm: 300 uF').replace('cr: 42 nF', 'cr: 22M'));
    const json = join(dir, 'bad.json');
    const r = await runCli(['fha', bad, '--json', json]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/bad\.yaml:\d+:\d+: tank\.lm/);
    expect(r.stderr).toMatch(/bad\.yaml:\d+:\d+: tank\.cr/);
    expect(existsSync(json)).toBe(false);
  });

  it('unknown options and commands exit 2', async () => {
    expect((await runCli(['fha'])).code).toBe(2);
    expect((await runCli(['frobnicate'])).code).toBe(2);
    expect((await runCli(['run', DEMO_FILE, '--engine', 'fluxotron'])).code).toBe(2);
  });
});

describe('tankcheck run (system ngspice)', () => {
  let out: string;
  let pass: string;
  beforeAll(() => {
    out = join(dir, 'run1');
    pass = passingDesign('pass.yaml');
  });

  it('a design within tolerance exits 0 and writes results.json, results.csv, junit.xml atomically', async () => {
    const r = await runCli(['run', pass, '--engine', 'ngspice', '--out', out, '--no-cache']);
    expect(r.code).toBe(0);
    const files = readdirSync(out).sort();
    expect(files).toEqual(['junit.xml', 'results.csv', 'results.json', 'run-log.json', 'waveforms.json']);
    const res = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    expect(res.engine.name).toBe('ngspice');
    expect(res.corners[0].sim.runs).toBeGreaterThanOrEqual(1);
    expect(readFileSync(join(out, 'junit.xml'), 'utf8')).toMatch(/<testcase [^>]*name="v390_100pct_reg_nom"/);
  });

  it('the same design and engine give a byte-identical results file, cached or not; the run log says what came from the cache', async () => {
    const cache = join(dir, 'cache');
    const a = join(dir, 'ra');
    const b = join(dir, 'rb');
    expect((await runCli(['run', pass, '--engine', 'ngspice', '--out', a, '--cache-dir', cache])).code).toBe(0);
    const r = await runCli(['run', pass, '--engine', 'ngspice', '--out', b, '--cache-dir', cache]);
    expect(r.code).toBe(0);
    const log = JSON.parse(readFileSync(join(b, 'run-log.json'), 'utf8'));
    expect(log).toEqual({ schema: 'tankcheck/run-log@1', cacheDir: cache, fromCache: ['v390_100pct_reg_nom'], simulated: 0 });
    expect(r.stderr).toMatch(/^cache: 1 of 1 corners from .*; 0 operating points simulated now$/m);
    expect(JSON.parse(readFileSync(join(a, 'run-log.json'), 'utf8')).fromCache).toEqual([]);
    // the cache is only an accelerator: the cached run's file is the uncached run's, byte for byte
    expect(readFileSync(join(b, 'results.json'), 'utf8')).toBe(readFileSync(join(a, 'results.json'), 'utf8'));
    const c = join(dir, 'rc');
    expect((await runCli(['run', pass, '--engine', 'ngspice', '--out', c, '--no-cache'])).code).toBe(0);
    expect(readFileSync(join(c, 'results.json'), 'utf8')).toBe(readFileSync(join(out, 'results.json'), 'utf8'));
  });

  it('--baseline: unchanged design exits 0; a deliberately changed design is a regression (exit 1)', async () => {
    const base = join(out, 'results.json');
    const same = await runCli(['run', pass, '--engine', 'ngspice', '--out', join(dir, 'b1'), '--baseline', base, '--cache-dir', join(dir, 'cache-b')]);
    expect(same.code).toBe(0);
    expect(same.stdout).toMatch(/no change beyond tolerance/);
    const changed = passingDesign('changed.yaml', '47 nF');
    const r = await runCli(['run', changed, '--engine', 'ngspice', '--out', join(dir, 'b2'), '--baseline', base, '--cache-dir', join(dir, 'cache-b')]);
    expect(r.code).toBe(1);
    const res = JSON.parse(readFileSync(join(dir, 'b2', 'results.json'), 'utf8'));
    expect(res.baseline.regressed).toBe(true);
    expect(res.baseline.moved.some((m: { metric: string }) => m.metric === 'fs')).toBe(true);
  });

  it('the demo diverges from FHA beyond tolerance: exit 1, junit failures', async () => {
    const r = await runCli(['run', DEMO_FILE, '--engine', 'ngspice', '--out', join(dir, 'demo'), '--only', 'v340_100pct*', '--no-cache']);
    expect(r.code).toBe(1);
    expect(readFileSync(join(dir, 'demo', 'junit.xml'), 'utf8')).toMatch(/<failure /);
  });

  it('a corner that fails to simulate is reported with the simulator reason: exit 3', async () => {
    const model = join(dir, 'broken-diode.lib');
    writeFileSync(model, '.subckt dbroken a k\nD1 a k nosuchmodel\n.ends dbroken\n');
    const file = join(dir, 'broken.yaml');
    writeFileSync(file, readFileSync(pass, 'utf8') + 'devices:\n  diodeModel:\n    file: broken-diode.lib\n    name: dbroken\n');
    const r = await runCli(['run', file, '--engine', 'ngspice', '--out', join(dir, 'broken'), '--no-cache']);
    expect(r.code).toBe(3);
    const res = JSON.parse(readFileSync(join(dir, 'broken', 'results.json'), 'utf8'));
    expect(res.corners[0].status).toBe('failed');
    expect(res.corners[0].failure.kind).toBe('input');
  });

  it('an engine that cannot start exits 4', async () => {
    const r = await runCli(['run', pass, '--engine', 'ngspice', '--ngspice-path', '/nonexistent/ngspice', '--out', join(dir, 'x')]);
    expect(r.code).toBe(4);
  });
});

describe('tankcheck decks', () => {
  it('writes one deck per corner plus index.csv; plain `ngspice -b` runs a deck without error', async () => {
    const d = join(dir, 'decks');
    const r = await runCli(['decks', DEMO_FILE, '-o', d]);
    expect(r.code).toBe(0);
    const decks = readdirSync(d).filter((f) => f.endsWith('.cir'));
    expect(decks).toHaveLength(6);
    expect(readFileSync(join(d, 'index.csv'), 'utf8').trim().split('\r\n')).toHaveLength(7);
    const run = await execa('ngspice', ['-b', decks.find((f) => f.startsWith('v390_100pct'))!], { cwd: d, reject: false });
    expect(run.exitCode).toBe(0);
    const vout = Number(/vout_avg\s*=\s*(\S+)/.exec(run.stdout)![1]);
    expect(Math.abs(vout - 24) / 24).toBeLessThan(0.005); // the model frequency meets the target
  });
});
