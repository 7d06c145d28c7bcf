// Runs the embedded wasm ngspice in worker threads (real engine, no mocks). Slow-tagged by the file name.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { execa } from 'execa';
import { afterAll, describe, expect, it } from 'vitest';
import { createWasmEngine } from './wasm.js';
import { sharedFile } from '../../tests/support/shared.js';

const deckFile = (name: string) => readFileSync(sharedFile('raw', name), 'latin1');
const engine = createWasmEngine({ workers: 1 });
afterAll(() => engine.close());

/** RC charging deck with tau = R * 1 uF; v(out) = 1 - exp(-t/tau) (closed form). */
const rcDeck = (ohms: number) => `rc ${ohms}\nV1 in 0 DC 1\nR1 in out ${ohms}\nC1 out 0 1u IC=0\n.options method=gear reltol=1e-4\n.save v(out)\n.tran 10u 2m 0 5u UIC\n.end\n`;
const maxRcError = (r: { vectors: Record<string, Float64Array> }, ohms: number) =>
  r.vectors.time.reduce((m, t, i) => Math.max(m, Math.abs(r.vectors['v(out)'][i] - (1 - Math.exp(-t / (ohms * 1e-6))))), 0);
const LONG_DECK = 'long rc\nV1 in 0 DC 1\nR1 in out 1k\nC1 out 0 1u IC=0\n.save v(out)\n.tran 1n 1 0 1n UIC\n.end\n';
const BAD_DECK = 'bad\nV1 in 0 1\nR1 in out 1k\nX1 out 0 nosuch\n.tran 1u 1m\n.end\n';

describe('wasm engine', () => {
  it('reports ngspice-45.2 and runs the RC/RL deck with lower-case vector names', async () => {
    expect(await engine.version()).toBe('ngspice-45.2');
    const r = await engine.run({ id: 'rc', deck: deckFile('rc-tran.cir'), timeoutMs: 20_000 });
    expect(r.ok).toBe(true);
    expect(Object.keys(r.vectors)).toEqual(['time', 'i(vsense)', 'v(out)']);
    expect(r.vectors.time).toBeInstanceOf(Float64Array);
    expect(maxRcError(r, 1000)).toBeLessThan(1e-3);
  });

  it('fails a bad deck after a good run on the same worker instead of returning the stale circuit', async () => {
    const good = await engine.run({ id: 'good', deck: rcDeck(1000), timeoutMs: 20_000 });
    expect(good.ok).toBe(true);
    const bad = await engine.run({ id: 'bad', deck: BAD_DECK, timeoutMs: 20_000 });
    expect(bad.failure).toMatchObject({ kind: 'input' });
    expect(bad.failure?.message).toMatch(/unknown subckt: x1 out 0 nosuch/);
    expect(bad.vectors).toEqual({});
    // A failed operating point makes ngspice's own `write` fail too: still no stale data, a convergence failure.
    const op = await engine.run({ id: 'op', deck: deckFile('op-fail.cir'), timeoutMs: 20_000 });
    expect(op.failure).toMatchObject({ kind: 'convergence', atTime: 0 });
    expect(op.vectors).toEqual({});
  });

  it('reports Timestep too small as convergence with the abort time and the rows before it', async () => {
    const r = await engine.run({ id: 'conv', deck: deckFile('timestep-abort.cir'), timeoutMs: 20_000 });
    expect(r.failure).toMatchObject({ kind: 'convergence', atTime: 1e-6 });
    expect(r.partial).toBe(true);
    expect(r.vectors.time[r.vectors.time.length - 1]).toBeCloseTo(1e-6, 12);
  });

  it('queues concurrent jobs on one worker and returns each its own result', async () => {
    const ohms = [500, 1000, 2000];
    const rs = await Promise.all(ohms.map((o) => engine.run({ id: `rc${o}`, deck: rcDeck(o), timeoutMs: 20_000 })));
    rs.forEach((r, i) => {
      expect(r.id).toBe(`rc${ohms[i]}`);
      expect(maxRcError(r, ohms[i])).toBeLessThan(1e-3);
    });
  });

  it('replaces the worker at once on a fatal error (missing include) and serves the next job', async () => {
    const before = engine.stats().workersStarted;
    const t0 = performance.now();
    const deck = 'inc\n.include models/missing.lib\nV1 in 0 1\nR1 in 0 1k\n.tran 1u 10u\n.end\n';
    const r = await engine.run({ id: 'fatal', deck, timeoutMs: 30_000 });
    expect(performance.now() - t0).toBeLessThan(5000); // far below the 30 s limit: no wait for a timeout
    expect(r.failure).toMatchObject({ kind: 'input' });
    expect(r.failure?.message).toMatch(/Could not find include file models\/missing\.lib/);
    const next = await engine.run({ id: 'next', deck: rcDeck(1000), timeoutMs: 20_000 });
    expect(next.ok).toBe(true);
    expect(engine.stats().workersStarted).toBe(before + 1);
  });

  it('writes includes to the engine file system for one job only', async () => {
    const deck = 'inc\n.include models/div.lib\nV1 in 0 DC 4\nX1 in out div\n.save v(out)\n.tran 1u 10u\n.end\n';
    const lib = '.subckt div a b\nR1 a b 1k\nR2 b 0 3k\n.ends div\n';
    const r = await engine.run({ id: 'inc', deck, includes: { 'models/div.lib': lib }, timeoutMs: 20_000 });
    expect(r.vectors['v(out)'][0]).toBeCloseTo(3, 9); // 4 V * 3k / (1k + 3k)
    const again = await engine.run({ id: 'inc2', deck, timeoutMs: 20_000 });
    expect(again.failure?.kind).toBe('input'); // the previous job's file is gone
  });

  it('times out a long run, replaces the worker, and runs the next job', async () => {
    const r = await engine.run({ id: 'long', deck: LONG_DECK, timeoutMs: 800 });
    expect(r.failure).toEqual({ kind: 'timeout', message: 'simulation did not finish within 800 ms' });
    const next = await engine.run({ id: 'next', deck: rcDeck(1000), timeoutMs: 20_000 });
    expect(next.ok).toBe(true);
  });

  it('rejects non-ASCII decks as input without running them', async () => {
    const r = await engine.run({ id: 'mu', deck: 'L 50\u00b5H\nR1 a 0 1\n.end\n', timeoutMs: 20_000 });
    expect(r.failure).toEqual({ kind: 'input', message: 'deck is not 7-bit ASCII' });
  });

  it('recycles a worker after recycleAfter runs', async () => {
    const small = createWasmEngine({ recycleAfter: 2 });
    try {
      for (let i = 0; i < 3; i++) expect((await small.run({ id: `r${i}`, deck: rcDeck(1000), timeoutMs: 20_000 })).ok).toBe(true);
      expect(small.stats()).toEqual({ workersStarted: 2, runs: 3 });
    } finally {
      await small.close();
    }
  });
});

describe('wasm engine on a fresh worker', () => {
  it('returns a failed operating point promptly (the bare engine would hang: its write fails, no out.raw)', async () => {
    const fresh = createWasmEngine();
    try {
      await fresh.version();
      const t0 = performance.now();
      const r = await fresh.run({ id: 'op', deck: deckFile('op-fail.cir'), timeoutMs: 15_000 });
      expect(performance.now() - t0).toBeLessThan(10_000);
      expect(r.failure).toMatchObject({ kind: 'convergence', atTime: 0 });
    } finally {
      await fresh.close();
    }
  });
});

describe('wasm engine with two workers', () => {
  it('spreads concurrent jobs over both workers, one run per worker at a time', async () => {
    const two = createWasmEngine({ workers: 2 });
    try {
      const ohms = [400, 800, 1200, 1600];
      const rs = await Promise.all(ohms.map((o) => two.run({ id: `rc${o}`, deck: rcDeck(o), timeoutMs: 20_000 })));
      rs.forEach((r, i) => expect(maxRcError(r, ohms[i])).toBeLessThan(1e-3));
      expect(two.stats()).toEqual({ workersStarted: 2, runs: 4 });
    } finally {
      await two.close();
    }
  });
});

describe('wasm engine process lifetime', () => {
  it('lets a process exit after its runs even without close() (idle workers are unreferenced)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'tankcheck-wasm-exit-'));
    try {
      const script = join(dir, 'run.mts');
      const src = fileURLToPath(new URL('./wasm.ts', import.meta.url));
      writeFileSync(script, `import { createWasmEngine } from ${JSON.stringify(src)};\n` +
        `const r = await createWasmEngine().run({ id: 'x', deck: ${JSON.stringify(rcDeck(1000))}, timeoutMs: 20000 });\n` +
        `console.log(r.ok ? 'ran-ok' : 'ran-failed');\n`);
      const r = await execa(process.execPath, ['--import', 'tsx', script], { reject: false, timeout: 15_000, cwd: fileURLToPath(new URL('../..', import.meta.url)) });
      expect(r.timedOut).toBe(false);
      expect(r.stdout.trim()).toBe('ran-ok');
      expect(r.exitCode).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
