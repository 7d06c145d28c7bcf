import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine, SimFailure, Attempt } from '../engine/types.js';
import type { DeckSeed, StepProfile } from '../netlist/types.js';
import type { SimMetrics, Waveforms } from '../measure/types.js';
import { buildDeck, STEP_PROFILES } from '../netlist/deck.js';
import { runWithRetries, addRshunt, switchIntegrationMethod, type RetryRung } from '../engine/retry.js';
import { finalState, toWaveforms } from '../netlist/waveforms.js';
import { makeSpan, measure, spanAverage } from '../measure/index.js';
import { predictCorner } from '../fha/predict.js';

/**
 * Retry ladder for convergence failures (they fail within milliseconds, so retrying is cheap):
 * a stronger shunt conductance, the other integration method, then a zero-state start.
 */
export const RETRY_RUNGS: readonly RetryRung[] = [
  { label: 'rshunt=1e7', transform: (d) => addRshunt(d, 1e7) },
  { label: 'other integration method', transform: switchIntegrationMethod },
  { label: 'zero-state start', transform: (d) => d.replace(/ ic=[^ \n]+/g, ' ic=0') },
];

/** Settling windows: each run simulates two windows of this many whole cycles. */
export const WINDOW_CYCLES = 10;

export interface SteadyOptions {
  /** Relative settle tolerance (design.simulation.settleTolerance). */
  tolerance: number;
  /** Cycle cap for this operating point. */
  maxCycles: number;
  /** Per-run wall-clock limit, ms; default from the cycle count. */
  timeoutMs?: number;
  signal?: AbortSignal;
  profile?: StepProfile;
}

export interface SteadyResult {
  fs: number;
  ok: boolean;
  failure?: SimFailure & { detail?: string };
  settled: boolean;
  /** Larger of the window-to-window change and the charge-balance drift estimate (both relative). */
  settleError: number;
  cycles: number;
  runs: number;
  metrics?: SimMetrics;
  waveforms?: Waveforms;
  /** Start of the measurement window, s (the last WINDOW_CYCLES cycles of the final run). */
  windowStart: number;
  state?: DeckSeed;
  attempts: Attempt[];
}

/**
 * Time constant of the slow output mode, s: Co (RL || Rth), where Rth = -dVo/dIo is the
 * converter's output resistance at this frequency from FHA (twice that, as FHA may err), capped
 * at RL Co. It turns a measured output slope into the error that is left to settle.
 */
export function outputTimeConstant(design: Design, corner: Corner, fs: number): number {
  const rl = corner.load;
  const vo = (r: number) => predictCorner(design, { ...corner, fs, load: r }).vout ?? 0;
  const v1 = vo(rl);
  const v2 = vo(rl * 1.01);
  const rth = Math.max(0, (2 * -(v2 - v1)) / (v2 / (rl * 1.01) - v1 / rl));
  const par = Number.isFinite(rth) ? (rth * rl) / (rth + rl || 1) : rl;
  return design.output.capacitance * Math.min(Math.max(par, 0), rl);
}

/**
 * Settling error of one run with two windows of whole cycles: the larger of the change between the
 * window averages, |a2 - a1| / a2, and the error still to come if the output keeps moving at that
 * rate for one output time constant, |a2 - a1| / (window length) * tau / a2. The second term keeps a
 * slow first-order drift from passing as settled just because two short windows look alike.
 */
export function settleError(w: Waveforms, t0: number, period: number, cycles: number, tau: number): number {
  const t1 = t0 + cycles * period;
  const t2 = t1 + cycles * period;
  const a1 = spanAverage(makeSpan(w.t, t0, t1), w.vout);
  const a2 = spanAverage(makeSpan(w.t, t1, t2), w.vout);
  const change = Math.abs(a2 - a1) / Math.abs(a2);
  return Math.max(change, (change * tau) / (t2 - t1));
}

/**
 * Simulate one operating point until it is verified to be in steady state: each run covers two
 * windows of WINDOW_CYCLES cycles; a run that has not settled is continued from its final state,
 * until the settle error is below tolerance or the cycle cap is reached ("not settled").
 */
export async function simulateSteady(engine: SimEngine, design: Design, corner: Corner, fs: number,
  seed: DeckSeed, opts: SteadyOptions): Promise<SteadyResult> {
  const K = WINDOW_CYCLES;
  const period = 1 / fs;
  const profile = opts.profile ?? STEP_PROFILES[design.simulation.accuracy];
  const attempts: Attempt[] = [];
  let state = seed;
  const tau = outputTimeConstant(design, corner, fs);
  let cycles = 0;
  let runs = 0;
  let last: Omit<SteadyResult, 'cycles' | 'runs' | 'attempts' | 'fs'> | undefined;
  while (cycles + 2 * K <= Math.max(opts.maxCycles, 2 * K)) {
    const deck = buildDeck({ design, corner, fs, seed: state, cycles: 2 * K, saveCycles: 2 * K, profile });
    const timeoutMs = opts.timeoutMs ?? Math.max(30_000, 2 * K * 100 * (profile.stepsPerPeriod / 350));
    const res = await runWithRetries(engine, { id: corner.id, deck: deck.text, timeoutMs, signal: opts.signal }, RETRY_RUNGS);
    runs++;
    cycles += 2 * K;
    attempts.push(...res.attempts);
    if (!res.ok) {
      const detail = res.diagnostics.filter((d) => d.level === 'error').map((d) => d.text).slice(-5).join('\n');
      return { fs, ok: false, failure: { ...res.failure!, detail }, settled: false, settleError: NaN, cycles, runs, windowStart: 0, attempts };
    }
    const w = toWaveforms(design, corner, fs, res.vectors);
    const err = settleError(w, deck.tstart, period, K, tau);
    state = finalState(w, res.vectors);
    last = { ok: true, settled: err <= opts.tolerance, settleError: err, waveforms: w, windowStart: deck.tstart + K * period, state };
    if (last.settled) break;
  }
  if (!last) return { fs, ok: false, failure: { kind: 'input', message: 'cycle cap below one run' }, settled: false, settleError: NaN, cycles, runs, windowStart: 0, attempts };
  const metrics = measure(last.waveforms!, { tStart: last.windowStart, cycles: K }, { zvsThreshold: design.simulation.zvsThreshold });
  return { fs, ...last, metrics, cycles, runs, attempts };
}
