import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine, SimFailure, Attempt } from '../engine/types.js';
import type { DeckSeed, StepProfile } from '../netlist/types.js';
import type { SimMetrics, Waveforms } from '../measure/types.js';
import { buildDeck, STEP_PROFILES } from '../netlist/deck.js';
import { runWithRetries } from '../engine/retry.js';
import { finalState, stateAt, toWaveforms } from '../netlist/waveforms.js';
import { makeSpan, measure, spanAverage } from '../measure/index.js';
import { isSettled, stateBalance } from '../measure/balance.js';
import { extrapolateSeed, windowSettle } from '../periodic/index.js';
import { equilibriumVoltage, secantResistance, shootState, slowMode, type SlowMode, type SlowPoint } from './shooting.js';

/** Cycles of the first run of an operating point: the approach whose boundary states are extrapolated. */
export const APPROACH_CYCLES = 7;
/** Cycles of the first check run (and the first run's check window); later check runs double, up to MAX_CHECK_CYCLES. */
export const CHECK_CYCLES = 4;
export const MAX_CHECK_CYCLES = 16;
/** Check window of plain continuation once the extrapolation is no longer trusted. */
export const PLAIN_CHECK_CYCLES = 8;
/** Longest check window of plain continuation, grown while only the output's distance to its equilibrium is unproven. */
export const MAX_PLAIN_CHECK_CYCLES = 64;
/**
 * Extrapolated restarts per operating point. Where two have not reached a provable steady state,
 * what is left is rarely a transient the extrapolation can skip: more often the numerical ringing of
 * a hard-commutated corner, which a further extrapolation would fit and so restart a transient.
 */
export const MAX_EXTRAPOLATIONS = 2;
/** Factor by which a run from an extrapolated start must cut the charge imbalance for the extrapolation to be trusted again. */
export const EXTRAPOLATION_GAIN = 4;

export interface SteadyOptions {
  /** Relative settle tolerance of the output voltage (design.simulation.settleTolerance). */
  tolerance: number;
  /** |avg(i_Co)| / Io that counts as balanced. @default design.simulation.chargeBalanceTolerance */
  chargeBalanceTolerance?: number;
  /** Tank state change over the check window, relative to its swing. @default design.simulation.periodicityTolerance */
  periodicityTolerance?: number;
  /** Cycle cap for this operating point. */
  maxCycles: number;
  /**
   * Cycles of the first run. @default APPROACH_CYCLES; a start already near this operating point's
   * steady state (the next step of a frequency search) takes CHECK_CYCLES: a check run at once.
   */
  firstCycles?: number;
  /** Per-run wall-clock limit, ms; default from the cycle count. */
  timeoutMs?: number;
  signal?: AbortSignal;
  profile?: StepProfile;
  /**
   * A frequency search's target: when the first run's extrapolated steady output misses `vout` by
   * more than `band` (relative), stop there without a proof and report the prediction
   * (`predictedVout`): the search steps the frequency anyway, and proving an operating point it
   * leaves costs a check run for nothing.
   */
  target?: { vout: number; band: number };
}

export interface SteadyResult {
  fs: number;
  ok: boolean;
  failure?: SimFailure & { detail?: string };
  settled: boolean;
  /** Output-voltage settle error of the check window (see periodic/settle.ts), relative. */
  settleError: number;
  /** Check window's avg(i_Co) / Io, signed (positive: still charging); NaN without a result. */
  chargeBalanceError: number;
  /** Check window's tank periodicity error (relative to the swing); NaN without a result. */
  periodicityError: number;
  /** Runs started from an extrapolated periodic state. */
  extrapolations: number;
  cycles: number;
  runs: number;
  metrics?: SimMetrics;
  waveforms?: Waveforms;
  /** Start of the check and measurement window, s (the last windowCycles cycles of the final run). */
  windowStart: number;
  /** Whole cycles in the check and measurement window. */
  windowCycles: number;
  /**
   * Set when the run stopped early on `opts.target`: the steady output predicted by the
   * extrapolation, V (the window average shifted by the extrapolated change of the capacitor
   * voltage). The metrics are then those of an unproven window and `settled` is false.
   */
  predictedVout?: number;
  state?: DeckSeed;
  attempts: Attempt[];
}

/** Peak magnitude of a trace. */
function peak(y: Float64Array): number {
  let m = 0;
  for (const v of y) m = Math.max(m, Math.abs(v));
  return m;
}

/**
 * Simulate one operating point until it is shown to be in a periodic steady state.
 *
 * The first run covers APPROACH_CYCLES cycles from the start state (the ideal model's periodic
 * state by default). Every run saves the state at each cycle boundary. When a run's check window
 * fails, the next run starts from:
 * - the limit of the run's boundary states by reduced rank extrapolation (periodic/extrapolate.ts):
 *   the transient's modes (fast tank modes, the slow beat of the tank with the output capacitor,
 *   the capacitor's charge) are skipped instead of waited out. At most MAX_EXTRAPOLATIONS times,
 *   and no more once a run from an extrapolated start has not cut the charge imbalance by
 *   EXTRAPOLATION_GAIN (the extrapolation was fitting noise);
 * - else, with an output capacitor much slower than a check run, one shooting step on its voltage
 *   (run/shooting.ts);
 * - else where the run ended.
 * Check runs last CHECK_CYCLES cycles, doubling after each failed check up to MAX_CHECK_CYCLES, or
 * PLAIN_CHECK_CYCLES once the extrapolation is no longer trusted (numerical ringing of a
 * hard-commutated corner: a longer window averages it, a shorter one tries again sooner). In plain
 * continuation a window whose charge balances but whose output is not yet proven near its
 * equilibrium doubles, up to MAX_PLAIN_CHECK_CYCLES: behind a stiff load line (far above resonance,
 * Rth >> RL) the balance must be finer than the noise of a short window.
 *
 * The proof of steady state is the check window (the last CHECK_CYCLES cycles of the first run, the
 * whole of a check run), judged by isSettled: the output capacitor's charge balances, the tank state
 * repeats, and the output voltage neither drifts toward the capacitor's equilibrium nor swings
 * between the window's halves (periodic/settle.ts). How the start was found does not enter the
 * proof. At the cycle cap the corner is "not settled". The check window is measured.
 */
export async function simulateSteady(engine: SimEngine, design: Design, corner: Corner, fs: number,
  seed: DeckSeed, opts: SteadyOptions): Promise<SteadyResult> {
  const period = 1 / fs;
  const profile = opts.profile ?? STEP_PROFILES[design.simulation.accuracy];
  const tol = {
    vout: opts.tolerance,
    chargeBalance: opts.chargeBalanceTolerance ?? design.simulation.chargeBalanceTolerance,
    periodicity: opts.periodicityTolerance ?? design.simulation.periodicityTolerance,
  };
  const attempts: Attempt[] = [];
  let slow: SlowMode | undefined;
  const shots: SlowPoint[] = [];
  let state = seed;
  let cycles = 0;
  let runs = 0;
  let extrapolations = 0;
  let check = CHECK_CYCLES;
  let trustExtrapolation = true;
  let fromExtrapolation = false;
  let imbalanceBefore = NaN;
  let last: Omit<SteadyResult, 'cycles' | 'runs' | 'attempts' | 'fs' | 'extrapolations'> | undefined;
  for (;;) {
    const n = runs === 0 ? Math.max(opts.firstCycles ?? APPROACH_CYCLES, check) : check;
    if (runs > 0 && cycles + n > opts.maxCycles) break;
    const deck = buildDeck({ design, corner, fs, seed: state, cycles: n, saveCycles: n, profile });
    const timeoutMs = opts.timeoutMs ?? Math.max(30_000, n * 100 * (profile.stepsPerPeriod / 350));
    const res = await runWithRetries(engine, { id: corner.id, deck: deck.text, timeoutMs, signal: opts.signal });
    runs++;
    cycles += n;
    attempts.push(...res.attempts);
    if (!res.ok) {
      const detail = res.diagnostics.filter((d) => d.level === 'error').map((d) => d.text).slice(-5).join('\n');
      return { fs, ok: false, failure: { ...res.failure!, detail }, settled: false, settleError: NaN, chargeBalanceError: NaN,
        periodicityError: NaN, extrapolations, cycles, runs, windowStart: 0, windowCycles: 0, attempts };
    }
    const w = toWaveforms(design, corner, fs, res.vectors);
    const c = Math.min(check, n);
    const windowStart = deck.tstop - c * period;
    const balance = stateBalance(w, windowStart, deck.tstop, corner.load);
    const mid = deck.tstop - (c / 2) * period;
    const halves: [number, number] = [spanAverage(makeSpan(w.t, windowStart, mid), w.vout), spanAverage(makeSpan(w.t, mid, deck.tstop), w.vout)];
    // The capacitor's distance to equilibrium needs the resistance it sees; the load alone bounds it
    // (Rth || RL < RL), and only when that bound fails is the model asked for the real one.
    const bound = windowSettle(halves, balance.capCurrentAvg, balance.voutAvg, design.output.esr + corner.load);
    let settle = bound;
    if (bound.error > tol.vout && bound.halfChange <= tol.vout) {
      slow ??= slowMode(design, corner, fs);
      settle = windowSettle(halves, balance.capCurrentAvg, balance.voutAvg, slow.r);
    }
    const settled = isSettled(settle.error, balance, tol);
    last = { ok: true, settled, settleError: settle.error, chargeBalanceError: balance.chargeBalance, periodicityError: balance.periodicity,
      waveforms: w, windowStart, windowCycles: c, state: finalState(w, res.vectors) };
    if (settled) break;
    // A run from an extrapolated start that did not cut the charge imbalance several times over
    // shows the extrapolation fitting noise, not a transient: from there on, plain continuation
    // with PLAIN_CHECK_CYCLES windows.
    if (fromExtrapolation && !(Math.abs(balance.chargeBalance) <= Math.abs(imbalanceBefore) / EXTRAPOLATION_GAIN)) {
      trustExtrapolation = false;
      check = PLAIN_CHECK_CYCLES;
    } else if (runs > 1 && trustExtrapolation) check = Math.min(check * 2, MAX_CHECK_CYCLES);
    else if (!trustExtrapolation && settle.chargeShift > tol.vout && Math.abs(balance.chargeBalance) <= tol.chargeBalance) {
      // Balanced within its tolerance, yet the output's distance to equilibrium is not proven: behind
      // a stiff load line (Rth >> RL, far above resonance) the charge balance must be finer than the
      // numerical noise of a short window. A longer window averages that noise.
      check = Math.min(check * 2, MAX_PLAIN_CHECK_CYCLES);
    }
    // The next run starts from the limit of this run's cycle-boundary states, or where it ended.
    let next: DeckSeed | null = null;
    if (trustExtrapolation && extrapolations < MAX_EXTRAPOLATIONS) {
      const boundaries = Array.from({ length: n + 1 }, (_, k) => stateAt(w, res.vectors, deck.tstart + k * period));
      const scales = { vo: Math.abs(balance.voutAvg), ir: peak(w.tankCurrent), im: peak(w.magnetizingCurrent), vcr: peak(w.crVoltage) };
      next = extrapolateSeed(boundaries, scales);
    }
    // Without a trusted extrapolation, an output capacitor much slower than a check run is the
    // transient left (the extrapolation cannot resolve a mode that barely moves within the run):
    // one shooting step on the capacitor voltage instead (run/shooting.ts), the tank moved along
    // the slow mode. A faster capacitor settles within the next runs by itself. Only for a charge
    // out of balance: within the balance tolerance the imbalance is at the numerical noise of the
    // step profile, and a step on noise moves the output away from its equilibrium.
    if (!next && Math.abs(balance.chargeBalance) > tol.chargeBalance) {
      slow ??= slowMode(design, corner, fs);
      if (design.output.capacitance * slow.r > MAX_CHECK_CYCLES * period) {
        const p: SlowPoint = { vco: balance.voutAvg - design.output.esr * balance.capCurrentAvg, icap: balance.capCurrentAvg };
        const prev = shots.at(-1);
        const secant = prev ? secantResistance(prev, p) : null;
        // The secant is trusted within a factor of a few of the model (a window still ringing gives nonsense).
        const r = secant !== null ? Math.min(Math.max(secant, slow.r / 2), slow.r * 4) : slow.r;
        shots.push(p);
        state = shootState(last.state!, p, equilibriumVoltage(p, r), corner.load, slow.direction);
        fromExtrapolation = false;
        continue;
      }
    }
    if (next) extrapolations++;
    if (next && runs === 1 && opts.target) {
      const predictedVout = balance.voutAvg + (next.vo - last.state!.vo);
      if (Math.abs(predictedVout - opts.target.vout) > opts.target.band * opts.target.vout) {
        const metrics = measure(w, { tStart: windowStart, cycles: c }, { zvsThreshold: design.simulation.zvsThreshold });
        return { fs, ...last, metrics, cycles, runs, extrapolations, attempts, predictedVout, state: next };
      }
    }
    fromExtrapolation = next !== null;
    imbalanceBefore = balance.chargeBalance;
    state = next ?? last.state!;
  }
  const final = last!;
  const metrics = measure(final.waveforms!, { tStart: final.windowStart, cycles: final.windowCycles }, { zvsThreshold: design.simulation.zvsThreshold });
  return { fs, ...final, metrics, cycles, runs, extrapolations, attempts };
}
