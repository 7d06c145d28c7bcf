/**
 * Case 3: wall time per corner, embedded wasm engine against system ngspice, same designs and
 * 'model' starts, one worker / one job each. The wasm worker is started (and timed) first; then one
 * untimed pass over all corners on both engines (JIT warm-up of the wasm engine, timed as a whole);
 * then ROUNDS timed rounds in which the engine order alternates from corner to corner and round to
 * round, so that machine drift does not favour one of them. Per corner, the median over the rounds.
 */
import { createEngine, type SimEngine } from '../src/engine/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { simulateCorner } from '../src/run/corner.js';
import type { BenchDesign } from './settling.js';
import { log, median } from './util.js';

/** Timed rounds per corner and engine. */
export const ROUNDS = 3;

export interface EngineRow {
  design: string;
  cornerId: string;
  /** Median over the rounds, ms. */
  ngspiceMs: number;
  wasmMs: number;
  /** Median over the rounds of the per-round ratio wasm / ngspice. */
  ratio: number;
  ngspiceCycles: number;
  wasmCycles: number;
  ngspiceVout: number | null;
  wasmVout: number | null;
}

export interface EngineCase {
  rows: EngineRow[];
  /** engine.version() of each. */
  ngspiceVersion: string;
  wasmVersion: string;
  /** First wasm engine.version(): worker start and engine load, ms. */
  wasmStartMs: number;
  /** Untimed warm-up pass over all corners, ms per engine (the wasm one includes its JIT warm-up). */
  warmupNgspiceMs: number;
  warmupWasmMs: number;
  rounds: number;
}

async function timeCorner(engine: SimEngine, d: BenchDesign, i: number) {
  const corner = expandCorners(d.design)[i]!;
  const t0 = performance.now();
  const out = await simulateCorner(engine, d.design, corner, predictCorner(d.design, corner), { seed: 'model' });
  return { ms: performance.now() - t0, cycles: out.result.sim?.cycles ?? NaN, vout: out.result.sim?.vout ?? null, id: corner.id };
}

export async function compareEngines(designs: readonly BenchDesign[]): Promise<EngineCase> {
  const ngspice = createEngine('ngspice');
  const wasm = createEngine('wasm', { workers: 1 });
  try {
    const ngspiceVersion = await ngspice.version();
    const t0 = performance.now();
    const wasmVersion = await wasm.version();
    const wasmStartMs = performance.now() - t0;
    log(`engines: wasm ${wasmVersion} started in ${wasmStartMs.toFixed(0)} ms; system ${ngspiceVersion}`);
    const list = designs.flatMap((d) => expandCorners(d.design).map((_, i) => ({ d, i })));
    let t1 = performance.now();
    for (const { d, i } of list) await timeCorner(ngspice, d, i);
    const warmupNgspiceMs = performance.now() - t1;
    t1 = performance.now();
    for (const { d, i } of list) await timeCorner(wasm, d, i);
    const warmupWasmMs = performance.now() - t1;
    log(`engines: warm-up pass over ${list.length} corners: ngspice ${warmupNgspiceMs.toFixed(0)} ms, wasm ${warmupWasmMs.toFixed(0)} ms`);
    const runs = list.map(() => ({ nat: [] as Awaited<ReturnType<typeof timeCorner>>[], wa: [] as Awaited<ReturnType<typeof timeCorner>>[] }));
    for (let round = 0; round < ROUNDS; round++) {
      for (let k = 0; k < list.length; k++) {
        const { d, i } = list[k]!;
        const nativeFirst = (k + round) % 2 === 0;
        const a = await timeCorner(nativeFirst ? ngspice : wasm, d, i);
        const b = await timeCorner(nativeFirst ? wasm : ngspice, d, i);
        runs[k]!.nat.push(nativeFirst ? a : b);
        runs[k]!.wa.push(nativeFirst ? b : a);
      }
      log(`engines: round ${round + 1}/${ROUNDS} done`);
    }
    const rows: EngineRow[] = list.map(({ d }, k) => {
      const { nat, wa } = runs[k]!;
      const row: EngineRow = { design: d.key, cornerId: nat[0]!.id, ngspiceMs: median(nat.map((x) => x.ms)), wasmMs: median(wa.map((x) => x.ms)),
        ratio: median(nat.map((x, j) => wa[j]!.ms / x.ms)), ngspiceCycles: nat[0]!.cycles, wasmCycles: wa[0]!.cycles,
        ngspiceVout: nat[0]!.vout, wasmVout: wa[0]!.vout };
      log(`engines ${d.key} ${row.cornerId}: ngspice ${row.ngspiceMs.toFixed(0)} ms (${row.ngspiceCycles} cycles), wasm ${row.wasmMs.toFixed(0)} ms ` +
        `(${row.wasmCycles} cycles), median ratio ${row.ratio.toFixed(2)}`);
      return row;
    });
    return { rows, ngspiceVersion, wasmVersion, wasmStartMs, warmupNgspiceMs, warmupWasmMs, rounds: ROUNDS };
  } finally {
    await wasm.close();
    await ngspice.close();
  }
}
