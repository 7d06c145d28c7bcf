/**
 * Cases 1 and 2: every corner of every design, started three ways ('zero', 'fha', 'model'), on one
 * engine, one corner at a time. Methods are interleaved per corner so that machine drift hits all
 * three alike.
 */
import type { Design } from '../src/design/types.js';
import type { Corner } from '../src/corners/types.js';
import type { SimEngine } from '../src/engine/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { simulateCorner } from '../src/run/corner.js';
import { startPoint, type SeedMethod } from '../src/plan/start.js';
import { simulateSteady } from '../src/run/steady.js';
import { instrument, log } from './util.js';

export const METHODS: readonly SeedMethod[] = ['zero', 'fha', 'model'];

/** A design under test, with a short key for tables. */
export interface BenchDesign {
  key: string;
  file: string;
  design: Design;
}

export interface SettleRow {
  design: string;
  corner: Corner;
  method: SeedMethod;
  status: string;
  failure?: string;
  /** sim.cycles, sim.runs, sim.simulations of the corner. */
  cycles: number;
  runs: number;
  simulations: number;
  /** Engine run() calls (retries included) and the wall time inside them, ms. */
  engineCalls: number;
  engineMs: number;
  /** Wall time of simulateCorner, ms. */
  wallMs: number;
  /** Wall time of one startPoint() call for this corner and method (timed apart), ms. */
  startMs: number;
  vout: number | null;
  /** Final switching frequency: the corner's fs, or the regulated one (measured from the gate edges). */
  fs: number | null;
  settled: boolean;
}

export async function runSettling(designs: readonly BenchDesign[], engine: SimEngine): Promise<SettleRow[]> {
  const rows: SettleRow[] = [];
  for (const d of designs) {
    for (const corner of expandCorners(d.design)) {
      const fha = predictCorner(d.design, corner);
      for (const method of METHODS) {
        const t0 = performance.now();
        startPoint(d.design, corner, fha, method);
        const startMs = performance.now() - t0;
        const { engine: counted, counter } = instrument(engine);
        const t1 = performance.now();
        const out = await simulateCorner(counted, d.design, corner, fha, { seed: method });
        const wallMs = performance.now() - t1;
        const r = out.result;
        const s = r.sim;
        const row: SettleRow = {
          design: d.key, corner, method, status: r.status, cycles: s?.cycles ?? NaN, runs: s?.runs ?? NaN,
          simulations: s?.simulations ?? NaN, engineCalls: counter.calls, engineMs: counter.ms, wallMs, startMs,
          vout: s?.vout ?? null, fs: corner.fs ?? s?.fs ?? null, settled: s?.settled ?? false,
          ...(r.failure ? { failure: `${r.failure.kind}: ${r.failure.message}` } : {}),
        };
        rows.push(row);
        log(`settle ${d.key} ${corner.id} ${method.padEnd(5)} ${r.status}: ${row.cycles} cycles, ${row.runs} runs, ` +
          `${row.simulations} op. points, Vout ${row.vout?.toFixed(4) ?? '-'} V, ${wallMs.toFixed(0)} ms`);
      }
    }
  }
  return rows;
}

/** The first operating point of a regulated corner: Vout at the start method's frequency against output.voltage. */
export interface FirstPoint {
  design: string;
  cornerId: string;
  method: SeedMethod;
  fs: number;
  vout: number;
  /** vout / output.voltage - 1. */
  error: number;
  cycles: number;
}

/**
 * For every regulated corner, simulate only the first operating point of the 'fha' and 'model'
 * starts (what regulate() does first), to show how close each start's frequency is.
 */
export async function firstPoints(designs: readonly BenchDesign[], engine: SimEngine): Promise<FirstPoint[]> {
  const out: FirstPoint[] = [];
  for (const d of designs) {
    for (const corner of expandCorners(d.design).filter((c) => c.fs === null)) {
      const fha = predictCorner(d.design, corner);
      for (const method of ['fha', 'model'] as const) {
        const sp = startPoint(d.design, corner, fha, method);
        const r = await simulateSteady(engine, d.design, corner, sp.fs, sp.seed,
          { tolerance: d.design.simulation.settleTolerance, maxCycles: d.design.simulation.maxCycles });
        if (!r.metrics) continue;
        const p = { design: d.key, cornerId: corner.id, method, fs: sp.fs, vout: r.metrics.vout, error: r.metrics.vout / d.design.output.voltage - 1, cycles: r.cycles };
        out.push(p);
        log(`first point ${d.key} ${corner.id} ${method}: ${(p.fs / 1e3).toFixed(3)} kHz, Vout ${p.vout.toFixed(4)} V (${(p.error * 100).toFixed(3)} % from target)`);
      }
    }
  }
  return out;
}
