import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine, SimFailure, Attempt } from '../engine/types.js';
import type { DeckSeed, StepProfile } from '../netlist/types.js';
import type { SimMetrics, Waveforms } from '../measure/types.js';
import { buildDeck, STEP_PROFILES } from '../netlist/deck.js';
import { runWithRetries, ZERO_START_LABEL } from '../engine/retry.js';
import { finalState, toWaveforms } from '../netlist/waveforms.js';
import { makeSpan, measure, spanAverage } from '../measure/index.js';
import { isSettled, stateBalance, type StateBalance } from '../measure/balance.js';
import { outputTimeConstant } from '../fha/dynamics.js';
import { equilibriumVoltage, secantResistance, shootState, slowMode, type SlowMode, type SlowPoint } from './shooting.js';

/** Settling and measurement window: whole switching cycles. */
export const WINDOW_CYCLES = 6;
/** Windows over which charge balance and tank periodicity are judged (the last ones of each run). */
export const BALANCE_WINDOWS = 2;

export interface SteadyOptions {
  /** Relative settle tolerance of the output voltage (design.simulation.settleTolerance). */
  tolerance: number;
  /** |avg(i_Co)| / Io that counts as balanced. @default design.simulation.chargeBalanceTolerance */
  chargeBalanceTolerance?: number;
  /** Tank state change over a window, relative to its swing. @default design.simulation.periodicityTolerance */
  periodicityTolerance?: number;
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
  /** Output-voltage settle error: window-to-window change, projected drift and geometric tail (relative). */
  settleError: number;
  /** Final window's avg(i_Co) / Io, signed (positive: still charging); NaN without a result. */
  chargeBalanceError: number;
  /** Final window's tank periodicity error (relative to the swing); NaN without a result. */
  periodicityError: number;
  /** Shooting steps taken on the output voltage. */
  shots: number;
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
 * Settling error after a sequence of window averages of the output voltage (oldest first), each
 * over `windowTime` seconds of whole cycles. The largest of:
 * - the change between the last two windows, |a_n - a_n-1| / a_n;
 * - that change projected over the output time constant tau (a first-order drift whose per-window
 *   change looks small);
 * - when the last two changes have the same sign (a monotone approach), the geometric tail still to
 *   come, |d_n| r / (1 - r) with r = d_n / d_n-1 (Aitken), capped by the longest time constant the
 *   output can have, RL Co (so a ratio near 1 at noise level cannot block settling forever).
 */
export function settleErrorOf(avgs: number[], windowTime: number, tau: number, tauMax: number): number {
  const n = avgs.length;
  if (n < 2) return Infinity;
  const a = Math.abs(avgs[n - 1]!);
  const d2 = avgs[n - 1]! - avgs[n - 2]!;
  const change = Math.abs(d2) / a;
  let err = Math.max(change, (change * tau) / windowTime);
  if (n >= 3) {
    const d1 = avgs[n - 2]! - avgs[n - 3]!;
    if (d1 !== 0 && Math.sign(d1) === Math.sign(d2)) {
      const r = d2 / d1;
      const bound = (change * tauMax) / windowTime;
      err = Math.max(err, r >= 1 ? bound : Math.min((change * r) / (1 - r), bound));
    }
  }
  return err;
}

/** Average output voltage over consecutive windows of `cycles` whole cycles from t0. */
function windowAverages(w: Waveforms, t0: number, period: number, cycles: number, count: number): number[] {
  const out: number[] = [];
  for (let k = 0; k < count; k++) {
    const a = t0 + k * cycles * period;
    out.push(spanAverage(makeSpan(w.t, Math.max(a, w.t[0]!), a + cycles * period), w.vout));
  }
  return out;
}

/**
 * Simulate one operating point until it is shown to be in a periodic steady state. The first run
 * covers three windows of WINDOW_CYCLES cycles, each continuation two more, started from the final
 * state of the previous run. The last window of each run is judged by isSettled: output voltage
 * (settleErrorOf over the window history), charge balance and tank periodicity. When the charge is
 * out of balance, the continuation starts with the output capacitor at the equilibrium voltage
 * that window predicts (one shooting step, see shooting.ts) instead of waiting out Co (R || RL).
 * At the cycle cap the corner is "not settled". The last window is measured.
 */
export async function simulateSteady(engine: SimEngine, design: Design, corner: Corner, fs: number,
  seed: DeckSeed, opts: SteadyOptions): Promise<SteadyResult> {
  const K = WINDOW_CYCLES;
  const period = 1 / fs;
  const profile = opts.profile ?? STEP_PROFILES[design.simulation.accuracy];
  const tol = {
    vout: opts.tolerance,
    chargeBalance: opts.chargeBalanceTolerance ?? design.simulation.chargeBalanceTolerance,
    periodicity: opts.periodicityTolerance ?? design.simulation.periodicityTolerance,
  };
  const attempts: Attempt[] = [];
  const tau = outputTimeConstant(design, corner, fs);
  const tauMax = corner.load * design.output.capacitance;
  const history: number[] = [];
  const shots: SlowPoint[] = [];
  let slow: SlowMode | undefined;
  let state = seed;
  let cycles = 0;
  let runs = 0;
  let last: (Omit<SteadyResult, 'cycles' | 'runs' | 'attempts' | 'fs' | 'shots'> & { balance: StateBalance }) | undefined;
  for (;;) {
    const windows = runs === 0 ? 3 : 2;
    if (runs > 0 && cycles + windows * K > opts.maxCycles) break;
    const deck = buildDeck({ design, corner, fs, seed: state, cycles: windows * K, saveCycles: windows * K, profile });
    const timeoutMs = opts.timeoutMs ?? Math.max(30_000, windows * K * 100 * (profile.stepsPerPeriod / 350));
    const res = await runWithRetries(engine, { id: corner.id, deck: deck.text, timeoutMs, signal: opts.signal });
    runs++;
    cycles += windows * K;
    attempts.push(...res.attempts);
    if (!res.ok) {
      const detail = res.diagnostics.filter((d) => d.level === 'error').map((d) => d.text).slice(-5).join('\n');
      return { fs, ok: false, failure: { ...res.failure!, detail }, settled: false, settleError: NaN, chargeBalanceError: NaN,
        periodicityError: NaN, shots: shots.length, cycles, runs, windowStart: 0, attempts };
    }
    const w = toWaveforms(design, corner, fs, res.vectors);
    // A zero-state retry is a new start: earlier windows no longer describe this trajectory.
    if (res.attempts.at(-1)?.label === ZERO_START_LABEL) history.length = 0;
    history.push(...windowAverages(w, deck.tstart, period, K, windows));
    const err = settleErrorOf(history, K * period, tau, tauMax);
    const windowStart = deck.tstop - K * period;
    // Charge balance and periodicity over the last two windows: the numerical noise of the default
    // step profile (a lightly damped ringing of Co with the tank) largely averages out over 12 cycles.
    const balance = stateBalance(w, deck.tstop - BALANCE_WINDOWS * K * period, deck.tstop, corner.load);
    state = finalState(w, res.vectors);
    const settled = isSettled(err, balance, tol);
    last = { ok: true, settled, settleError: err, chargeBalanceError: balance.chargeBalance, periodicityError: balance.periodicity,
      waveforms: w, windowStart, state, balance };
    if (settled) break;
    if (Math.abs(balance.chargeBalance) <= tol.chargeBalance) continue;
    slow ??= slowMode(design, corner, fs);
    // Shoot only when the capacitor is slow against a window: a faster one settles by itself within
    // the next run, and its window averages are dominated by the ringing of Co with the tank.
    if (design.output.capacitance * slow.r > K * period) {
      // Shooting step on the output capacitor voltage; the voltage history restarts with it.
      // The step reads the last window only: the one before it may still carry the previous step's transient.
      const lw = stateBalance(w, windowStart, deck.tstop, corner.load);
      const p: SlowPoint = { vco: lw.voutAvg - design.output.esr * lw.capCurrentAvg, icap: lw.capCurrentAvg };
      const prev = shots.at(-1);
      const secant = prev ? secantResistance(prev, p) : null;
      // The secant is trusted within a factor of a few of the model (a window still ringing gives nonsense).
      const r = secant !== null ? Math.min(Math.max(secant, slow.r / 2), slow.r * 4) : slow.r;
      shots.push(p);
      state = shootState(state, p, equilibriumVoltage(p, r), corner.load, slow.direction);
      history.length = 0;
    }
  }
  const { balance: _b, ...final } = last!;
  const metrics = measure(final.waveforms!, { tStart: final.windowStart, cycles: K }, { zvsThreshold: design.simulation.zvsThreshold });
  return { fs, ...final, metrics, cycles, runs, shots: shots.length, attempts };
}
