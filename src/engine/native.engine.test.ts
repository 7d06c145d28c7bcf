// Runs the system ngspice (real process, no mocks). Slow-tagged by the *.engine.test.ts name.
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execa } from 'execa';
import { afterAll, describe, expect, it } from 'vitest';
import { EngineUnavailableError } from './errors.js';
import { createNgspiceEngine } from './native.js';
import { sharedFile } from '../../tests/support/shared.js';

const deckFile = (name: string) => readFileSync(sharedFile('raw', name), 'latin1');
const scratch = mkdtempSync(join(tmpdir(), 'tankcheck-native-test-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));
const engine = createNgspiceEngine({ tmpRoot: scratch });

// 1 s of simulated time at a 1 ns step: ~200k rows per wall second here, so it never finishes in a test.
const LONG_DECK = 'long rc\nV1 in 0 DC 1\nR1 in out 1k\nC1 out 0 1u IC=0\n.save v(out)\n.tran 1n 1 0 1n UIC\n.end\n';
/** RC charging from zero state, tau = 1 ms (closed form). */
const rcStep = (t: number) => 1 - Math.exp(-t / 1e-3);
/** Largest |v[i] - f(t[i])| (one expect per check keeps 10^5-row loops fast). */
const maxError = (t: Float64Array, v: Float64Array, f: (t: number) => number) => t.reduce((m, ti, i) => Math.max(m, Math.abs(v[i] - f(ti))), 0);

describe('native ngspice engine', () => {
  it('reports its version and runs the RC/RL deck to the closed-form step response', async () => {
    expect(await engine.version()).toMatch(/^ngspice-\d+/);
    const r = await engine.run({ id: 'rc', deck: deckFile('rc-tran.cir'), timeoutMs: 20_000 });
    expect(r.ok).toBe(true);
    expect(r.partial).toBe(false);
    expect(Object.keys(r.vectors)).toEqual(['time', 'i(vsense)', 'v(out)']);
    expect(maxError(r.vectors.time, r.vectors['v(out)'], rcStep)).toBeLessThan(1e-3);
    expect(readdirSync(scratch)).toEqual([]); // temp dir removed
  });

  it('reports a syntax error as an input failure', async () => {
    const deck = 'bad\nV1 in 0 1\nR1 in out 1k\nX1 out 0 nosuch\n.tran 1u 1m\n.end\n';
    const r = await engine.run({ id: 'bad', deck, timeoutMs: 20_000 });
    expect(r.failure).toEqual({ kind: 'input', message: 'Error: unknown subckt: x1 out 0 nosuch' });
    expect(r.vectors).toEqual({});
  });

  it('reports Timestep too small as convergence with the abort time and keeps the rows before it', async () => {
    const r = await engine.run({ id: 'conv', deck: deckFile('timestep-abort.cir'), timeoutMs: 20_000 });
    expect(r.failure?.kind).toBe('convergence');
    expect(r.failure?.kind === 'convergence' && r.failure.atTime).toBe(1e-6);
    expect(r.partial).toBe(true);
    const t = r.vectors.time;
    expect(t.length).toBeGreaterThan(100);
    expect(t[t.length - 1]).toBeCloseTo(1e-6, 12);
  });

  it('times out, keeps the rows written before the kill, and runs the next job', async () => {
    const t0 = performance.now();
    const r = await engine.run({ id: 'long', deck: LONG_DECK, timeoutMs: 800 });
    expect(performance.now() - t0).toBeLessThan(4000);
    expect(r.failure?.kind).toBe('timeout');
    expect(r.partial).toBe(true);
    const t = r.vectors.time;
    const v = r.vectors['v(out)'];
    expect(t.length).toBeGreaterThan(1000);
    expect(t.every((ti, i) => i === 0 || ti > t[i - 1])).toBe(true);
    expect(maxError(t, v, rcStep)).toBeLessThan(1e-3);
    const next = await engine.run({ id: 'after', deck: deckFile('rc-tran.cir'), timeoutMs: 20_000 });
    expect(next.ok).toBe(true);
  });

  it('stops on the abort signal with the partial rows (aborted)', async () => {
    const ac = new AbortController();
    setTimeout(() => ac.abort(), 400);
    const r = await engine.run({ id: 'cancel', deck: LONG_DECK, timeoutMs: 20_000, signal: ac.signal });
    expect(r.failure?.kind).toBe('aborted');
    expect(r.vectors.time.length).toBeGreaterThan(100);
  });

  it('resolves includes relative to the deck and keeps the job dir on request', async () => {
    const keep = createNgspiceEngine({ tmpRoot: scratch, keepDir: true });
    const deck = 'inc\n.include models/div.lib\nV1 in 0 DC 4\nX1 in out div\n.save v(out)\n.tran 1u 10u\n.end\n';
    const lib = '.subckt div a b\nR1 a b 1k\nR2 b 0 3k\n.ends div\n';
    const r = await keep.run({ id: 'inc', deck, includes: { 'models/div.lib': lib }, timeoutMs: 20_000 });
    expect(r.ok).toBe(true);
    expect(r.vectors['v(out)'][0]).toBeCloseTo(3, 9); // 4 V * 3k / (1k + 3k)
    expect(r.workDir && existsSync(join(r.workDir, 'deck.cir')) && existsSync(join(r.workDir, 'out.raw'))).toBe(true);
  });

  it('never reads a .spiceinit from the caller cwd, HOME, or the job dir', async () => {
    const home = mkdtempSync(join(scratch, 'home-'));
    const proof = join(home, 'proof');
    const init = `* init\nshell touch ${proof}\n`;
    writeFileSync(join(home, '.spiceinit'), init);
    writeFileSync(join(home, 'deck.cir'), deckFile('rc-tran.cir'));
    // Control: without -n, ngspice does run this .spiceinit (so the check below can fail).
    await execa('ngspice', ['-b', '-r', 'o.raw', 'deck.cir'], { cwd: home, reject: false, stdin: 'ignore' });
    expect(existsSync(proof)).toBe(true);
    rmSync(proof);
    const saved = { cwd: process.cwd(), home: process.env.HOME };
    process.chdir(home);
    process.env.HOME = home;
    try {
      const r = await engine.run({ id: 'init', deck: deckFile('rc-tran.cir'), includes: { '.spiceinit': init }, timeoutMs: 20_000 });
      expect(r.ok).toBe(true);
    } finally {
      process.chdir(saved.cwd);
      process.env.HOME = saved.home;
    }
    expect(existsSync(proof)).toBe(false);
  });

  it('signals a missing binary with EngineUnavailableError from version(), and fails runs without throwing', async () => {
    const missing = createNgspiceEngine({ path: join(scratch, 'no-such-ngspice'), tmpRoot: scratch });
    await expect(missing.version()).rejects.toBeInstanceOf(EngineUnavailableError);
    const r = await missing.run({ id: 'x', deck: deckFile('rc-tran.cir'), timeoutMs: 5000 });
    expect(r.failure?.kind).toBe('engine');
    expect(r.failure?.message).toMatch(/ENOENT/);
  });
});
