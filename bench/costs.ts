/**
 * Informational: how much of a run's time goes into saving and reading back data. The same
 * first-run deck (APPROACH_CYCLES cycles, model start, one regulated demo corner) saving every cycle (what simulateSteady's
 * first run does: it reads the state at every cycle boundary) and saving only the last CHECK_CYCLES-cycle window, alternating, per engine.
 */
import { createEngine, type EngineName } from '../src/engine/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { startPoint } from '../src/plan/start.js';
import { buildDeck } from '../src/netlist/deck.js';
import { APPROACH_CYCLES, CHECK_CYCLES } from '../src/run/steady.js';
import type { BenchDesign } from './settling.js';
import { log, median } from './util.js';

export interface SaveCost {
  engine: EngineName;
  cornerId: string;
  reps: number;
  /** Median wall time of one run, ms. */
  saveAllMs: number;
  saveWindowMs: number;
}

export async function measureSaveCost(d: BenchDesign, cornerIndex: number, reps = 5): Promise<SaveCost[]> {
  const corner = expandCorners(d.design)[cornerIndex]!;
  const sp = startPoint(d.design, corner, predictCorner(d.design, corner), 'model');
  const cycles = APPROACH_CYCLES;
  const decks = [cycles, CHECK_CYCLES].map((saveCycles) => buildDeck({ design: d.design, corner, fs: sp.fs, seed: sp.seed, cycles, saveCycles }).text);
  const out: SaveCost[] = [];
  for (const name of ['ngspice', 'wasm'] as const) {
    const engine = createEngine(name, { workers: 1 });
    try {
      const run = async (deck: string) => {
        const t0 = performance.now();
        const r = await engine.run({ id: corner.id, deck, timeoutMs: 120_000 });
        if (!r.ok) throw new Error(`${name}: ${r.failure?.message}`);
        return performance.now() - t0;
      };
      await run(decks[0]!); // warm-up (wasm: engine start and JIT)
      await run(decks[1]!);
      const all: number[] = [];
      const win: number[] = [];
      for (let i = 0; i < reps; i++) {
        if (i % 2 === 0) { all.push(await run(decks[0]!)); win.push(await run(decks[1]!)); }
        else { win.push(await run(decks[1]!)); all.push(await run(decks[0]!)); }
      }
      const c: SaveCost = { engine: name, cornerId: corner.id, reps, saveAllMs: median(all), saveWindowMs: median(win) };
      out.push(c);
      log(`save cost ${name} ${corner.id}: ${cycles} cycles saving all ${c.saveAllMs.toFixed(0)} ms, saving the last ${CHECK_CYCLES} ${c.saveWindowMs.toFixed(0)} ms`);
    } finally {
      await engine.close();
    }
  }
  return out;
}
