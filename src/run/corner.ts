import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { SimEngine } from '../engine/types.js';
import type { Waveforms } from '../measure/types.js';
import type { CornerResult, SimSummary, WaveformExcerpt } from '../results/types.js';
import { failed, simulated } from '../results/build.js';
import { compareCorner } from '../compare/compare.js';
import { evaluateLimits } from '../limits/evaluate.js';
import { simulateSteady } from './steady.js';
import { deadTimeProblem, regulate, type RegulateResult } from './regulate.js';
import { unreachableResult } from './unreachable.js';
import { formatSi } from '../units/index.js';
import { startPoint, type SeedMethod, type StartPoint } from '../plan/start.js';
import { excerpt } from '../report/excerpt.js';
import { idealCorner, withIdeal, type IdealOutcome } from '../ideal/index.js';

export interface CornerRunOptions {
  signal?: AbortSignal;
  timeoutMs?: number;
  /** How runs start. @default 'model' */
  seed?: SeedMethod;
  /** A start already computed (the study computes it once for the cache key too). */
  start?: StartPoint;
  /** The ideal model's outcome, computed once by the study (for the start and the comparison). */
  ideal?: IdealOutcome;
}

export interface CornerOutcome {
  result: CornerResult;
  waveform?: WaveformExcerpt;
}

export { cornerInputs } from '../results/build.js';

/**
 * Simulate one corner to a verified steady state (regulated: at the frequency that meets
 * output.voltage), measure it and compare it with FHA. Never throws for simulator problems:
 * they come back as a failed corner with the simulator's reason.
 */
export async function simulateCorner(engine: SimEngine, design: Design, corner: Corner, fha: FhaResult,
  opts: CornerRunOptions = {}): Promise<CornerOutcome> {
  const regulated = corner.fs === null;
  const steadyOpts = { tolerance: design.simulation.settleTolerance, maxCycles: design.simulation.maxCycles, signal: opts.signal, timeoutMs: opts.timeoutMs };
  const ideal = opts.ideal ?? idealCorner(design, corner, fha);
  const start = opts.start ?? startPoint(design, corner, fha, opts.seed, ideal);
  let steady;
  let simulations = 1;
  let cycles;
  let runs;
  let regulationMet = true;
  let unreachable: RegulateResult['unreachable'];
  if (regulated) {
    // The dead-time rule of the fixed-frequency check, at the frequency FHA solved for this corner.
    const dt = fha.fs !== null ? deadTimeProblem(design.switches.deadTime, fha.fs) : null;
    if (dt) return { result: withIdeal(failed(corner, fha, { kind: 'dead-time', message: `FHA regulates this corner at ${formatSi(fha.fs!, 'Hz')}: ${dt}` }), ideal) };
    const r = await regulate(engine, design, corner, start.fs, start.seed, start.slope, steadyOpts);
    if (r.deadTime) return { result: withIdeal(failed(corner, fha, { kind: 'dead-time', message: `the frequency search reached ${formatSi(r.deadTime.fs, 'Hz')}: ${r.deadTime.message}` }), ideal) };
    steady = r.steady!;
    ({ simulations, cycles, runs, unreachable } = r);
    regulationMet = r.met;
  } else {
    steady = await simulateSteady(engine, design, corner, start.fs, start.seed, steadyOpts);
    ({ cycles, runs } = steady);
  }
  if (!steady.ok || !steady.metrics) {
    return { result: withIdeal(failed(corner, fha, steady.failure ?? { kind: 'engine', message: 'no result' }, undefined, evaluateLimits(design, corner.vin, fha, null, ideal.ideal)), ideal) };
  }
  const sim: SimSummary = { ...steady.metrics, cycles, runs, simulations, settled: steady.settled, settleError: steady.settleError,
    chargeBalanceError: steady.chargeBalanceError, periodicityError: steady.periodicityError };
  if (unreachable) {
    const result = withIdeal(unreachableResult(design, corner, fha, { ...sim, closest: unreachable.closest }), ideal);
    return { result, waveform: excerpt(corner.id, steady.waveforms as Waveforms, steady.windowStart, steady.windowCycles) };
  }
  const cmp = compareCorner(design, fha, steady.metrics, regulated, ideal.ideal);
  const measured = { sim, comparison: cmp.rows, divergences: cmp.divergences, checks: evaluateLimits(design, corner.vin, fha, sim, ideal.ideal) };
  const result: CornerResult = withIdeal(regulationMet ? simulated(corner, fha, measured)
    : failed(corner, fha, { kind: 'regulation', message: `no switching frequency met ${design.output.voltage} V within 0.5 % in ${simulations} simulations (closest ${steady.metrics.vout.toPrecision(5)} V at ${(steady.fs / 1e3).toPrecision(5)} kHz)` }, measured), ideal);
  return { result, waveform: excerpt(corner.id, steady.waveforms as Waveforms, steady.windowStart, steady.windowCycles) };
}
