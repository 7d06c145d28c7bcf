// Faults of the embedded wasm engine: a run past its time limit and a fatal ngspice error (after which
// the instance hangs). The engine underneath is the real one; support/faultyEngine.ts rewrites the deck
// of one corner. Each must end as a failed corner with its reason while the next corner is simulated
// on a replacement worker.
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { KEEP, TARGET, expectKept, faultKit, type Corner } from './support/faultKit.js';
import { faultyEngine, lengthenDeck, polyDeck } from './support/faultyEngine.js';
import { createWasmEngine } from '../../src/engine/wasm.js';
import { loadDesignOrThrow } from '../../src/design/load.js';
import { runStudy } from '../../src/run/study.js';

const { dir, loadsDesign, run } = faultKit('wasm-faults');

describe('timeout', () => {
  it('wasm engine, 1 s limit on a deck that runs for minutes: the worker is stopped and replaced; the other corner (run after it) is kept', async () => {
    const design = (await loadDesignOrThrow(loadsDesign('timeout-wasm.yaml', ['50%', '100%']))).design;
    const wasm = createWasmEngine({ workers: 1 });
    const engine = faultyEngine(wasm, TARGET, lengthenDeck, { timeoutMs: 1000 });
    try {
      const t0 = performance.now();
      const { results } = await runStudy(design, { engine, jobs: 1 });
      const byId = Object.fromEntries(results.corners.map((c) => [c.id, c]));
      expect(byId[TARGET].failure).toMatchObject({ kind: 'timeout', message: 'simulation did not finish within 1000 ms' });
      expect(engine.hits).toBe(1); // a timeout is not retried
      expectKept(byId[KEEP] as unknown as Corner);
      expect(wasm.stats().workersStarted).toBe(2);
      expect(performance.now() - t0).toBeLessThan(60_000);
    } finally {
      await engine.close();
    }
  });
});

describe('wasm worker hit by a fatal ngspice error (the instance hangs)', () => {
  it('a POLY source (needs XSPICE, absent from the wasm build) fails the corner at once with the engine\'s reason, not after the timeout', async () => {
    const lib = join(dir, 'poly.lib');
    writeFileSync(lib, '.subckt dpoly a k\nE1 a x POLY(1) a k 0 1\nD1 x k dinner\n.model dinner d(is=1e-12 n=1.2)\n.ends dpoly\n');
    const file = loadsDesign('poly.yaml', ['100%']);
    writeFileSync(file, `${readFileSync(file, 'utf8')}devices:\n  diodeModel: {file: poly.lib, name: dpoly}\n`);
    const r = await run([file, '--engine', 'wasm']);
    expect(r.code, r.stderr).toBe(3);
    const c = r.corners['v390_100pct_f110k_nom'];
    expect(c.failure!.message).toMatch(/XSPICE is required to run the 'poly' option/);
    expect(c.failure!.detail).toMatch(/fatal error in ngspice/);
    expect(r.ms).toBeLessThan(20_000); // the default per-run limit is 30 s
  });

  it('the same fatal error in one corner of a study: that corner fails, the worker is replaced, the next corner is simulated', async () => {
    const design = (await loadDesignOrThrow(loadsDesign('fatal-mixed.yaml', ['50%', '100%']))).design;
    const wasm = createWasmEngine({ workers: 1 });
    const engine = faultyEngine(wasm, TARGET, polyDeck);
    try {
      const { results } = await runStudy(design, { engine, jobs: 1 });
      const byId = Object.fromEntries(results.corners.map((c) => [c.id, c]));
      expect(byId[TARGET].status).toBe('failed');
      expect(byId[TARGET].failure!.message).toMatch(/XSPICE is required to run the 'poly' option/);
      expectKept(byId[KEEP] as unknown as Corner);
      expect(wasm.stats().workersStarted).toBe(2);
    } finally {
      await engine.close();
    }
  });
});
