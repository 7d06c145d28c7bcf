import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine, SimFailure, Attempt } from '../engine/types.js';
import type { DeckSeed, StepProfile } from '../netlist/types.js';
import type { SimMetrics, Waveforms } from '../measure/types.js';
import { buildDeck, STEP_PROFILES } from '../netlist/deck.js';
import { runWithRetries, addRshunt, switchIntegrationMethod, type RetryRung } from '../engine/retry.js';
import { finalState, toWaveforms } from '../netlist/waveforms.js';
import { makeSpan, measure, spanAverage, valueAt, locate } from '../measure/index.js';

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
 * Settling error of one run with two windows: |avg2 - avg1| / avg2, and the drift that the output
 * capacitor's charge balance shows over the last window, Co dVco/dt / Io. For a first-order drift
 * towards steady state the remaining error is at most the latter (the output time constant cannot
 * exceed RL Co), so a slow exponential cannot pass as settled just because two windows look alike.
 */
export function settleError(w: Waveforms, vco: Float64Array, t0: number, period: number, cycles: number, co: number, load: number): number {
  const t1 = t0 + cycles * period;
  const t2 = t1 + cycles * period;
  // ngspice starts a UIC run's data one tiny step after 0: clamp the first window to the data.
  const a1 = spanAverage(makeSpan(w.t, Math.max(t0, w.t[0]!), t1), w.vout);
  const a2 = spanAverage(makeSpan(w.t, t1, t2), w.vout);
  const dv = valueAt(vco, locate(w.t, t2)) - valueAt(vco, locate(w.t, t1));
  const drift = (co * dv) / (t2 - t1) / (a2 / load);
  return Math.max(Math.abs(a2 - a1) / Math.abs(a2), Math.abs(drift));
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
    const err = settleError(w, res.vectors['v(co)']!, deck.tstart, period, K, design.output.capacitance, corner.load);
    state = finalState(w, res.vectors);
    last = { ok: true, settled: err <= opts.tolerance, settleError: err, waveforms: w, windowStart: deck.tstart + K * period, state };
    if (last.settled) break;
  }
  if (!last) return { fs, ok: false, failure: { kind: 'input', message: 'cycle cap below one run' }, settled: false, settleError: NaN, cycles, runs, windowStart: 0, attempts };
  const metrics = measure(last.waveforms!, { tStart: last.windowStart, cycles: K }, { zvsThreshold: design.simulation.zvsThreshold });
  return { fs, ...last, metrics, cycles, runs, attempts };
}
