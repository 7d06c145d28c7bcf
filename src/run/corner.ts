import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { SimEngine } from '../engine/types.js';
import type { Waveforms } from '../measure/types.js';
import type { CornerResult, SimSummary, WaveformExcerpt } from '../report/types.js';
import { fhaSeed } from '../netlist/seed.js';
import { compareCorner } from '../compare/compare.js';
import { simulateSteady, WINDOW_CYCLES } from './steady.js';
import { fhaSlope, regulate } from './regulate.js';
import { excerpt } from '../report/excerpt.js';

export interface CornerRunOptions {
  signal?: AbortSignal;
  timeoutMs?: number;
}

export interface CornerOutcome {
  result: CornerResult;
  waveform?: WaveformExcerpt;
}

export function cornerInputs(c: Corner): CornerResult['inputs'] {
  return { vin: c.vin, load: c.load, loadLabel: c.loadLabel, iout: c.iout, pout: c.pout, fs: c.fs, lr: c.lr, cr: c.cr, lm: c.lm, turnsRatio: c.turnsRatio, tolerance: c.tolerance };
}

/** Start frequency of a regulated search: the FHA solution, or the zero-phase boundary when FHA finds none. */
function startFrequency(fha: FhaResult): number {
  return fha.fs ?? fha.fsZeroPhase;
}

/**
 * Simulate one corner to a verified steady state (regulated: at the frequency that meets
 * output.voltage), measure it and compare it with FHA. Never throws for simulator problems:
 * they come back as a failed corner with the simulator's reason.
 */
export async function simulateCorner(engine: SimEngine, design: Design, corner: Corner, fha: FhaResult,
  opts: CornerRunOptions = {}): Promise<CornerOutcome> {
  const regulated = corner.fs === null;
  const steadyOpts = { tolerance: design.simulation.settleTolerance, maxCycles: design.simulation.maxCycles, signal: opts.signal, timeoutMs: opts.timeoutMs };
  const fs0 = regulated ? startFrequency(fha) : corner.fs!;
  const vo0 = regulated ? design.output.voltage : fha.vout ?? design.output.voltage;
  const seed = fhaSeed(design, corner, fs0, vo0);
  const base = { id: corner.id, inputs: cornerInputs(corner), fha };
  let steady;
  let simulations = 1;
  let cycles;
  let runs;
  let regulationMet = true;
  if (regulated) {
    const r = await regulate(engine, design, corner, fs0, seed, fhaSlope(design, corner, fs0), steadyOpts);
    ({ steady, simulations, cycles, runs } = r);
    regulationMet = r.met;
  } else {
    steady = await simulateSteady(engine, design, corner, fs0, seed, steadyOpts);
    ({ cycles, runs } = steady);
  }
  if (!steady.ok || !steady.metrics) {
    const f = steady.failure ?? { kind: 'engine', message: 'no result' };
    return { result: { ...base, sim: null, comparison: [], divergences: [], status: 'failed',
      failure: { kind: f.kind, message: f.message, ...(f.detail ? { detail: f.detail } : {}) } } };
  }
  const sim: SimSummary = { ...steady.metrics, cycles, runs, simulations, settled: steady.settled, settleError: steady.settleError, fromCache: false };
  const cmp = compareCorner(design, fha, steady.metrics, regulated);
  let status: CornerResult['status'] = !steady.settled ? 'not-settled' : cmp.divergences.length ? 'diverged' : 'ok';
  const result: CornerResult = { ...base, sim, comparison: cmp.rows, divergences: cmp.divergences, status };
  if (!regulationMet) {
    status = 'failed';
    result.status = status;
    result.failure = { kind: 'regulation', message: `no switching frequency met ${design.output.voltage} V within 0.5 % in ${simulations} simulations (closest ${steady.metrics.vout.toPrecision(5)} V at ${(steady.fs / 1e3).toPrecision(5)} kHz)` };
  }
  return { result, waveform: excerpt(corner.id, steady.waveforms as Waveforms, steady.windowStart, WINDOW_CYCLES) };
}
