/** Periodic steady state of the ideal time-domain model under a resistive load (not the simulator loop: that is run/steady.ts). */
import { solveHeldOutput } from './held.js';
import { brent } from './root.js';
import { solveLoaded } from './loaded.js';
import { checkParams } from './model.js';
import type { HeldOutputResult, SteadyStateResult, TdParams } from './types.js';

/** Options of solveSteadyState. */
export interface SteadyOptions {
  /** Starting output voltage, V. @default FHA estimate (docs/method.md#gain) */
  voGuess?: number;
  /** Warm start: the t = 0 state of a nearby solution (e.g. a neighbouring frequency). */
  guess?: HeldOutputResult['seed'];
  /** Relative tolerance on vo in the bracketing fallback. @default 1e-10 */
  tolerance?: number;
  /** 'bracket' skips the combined Newton and brackets vo directly (slower). @default 'auto' */
  method?: 'auto' | 'bracket';
}

/**
 * Steady state with a resistive load rl (ohm; Infinity = no load): the output voltage at which
 * the average rectified current equals vo / rl. First Newton on the periodic state and vo
 * together (solveLoaded); if that fails, vo is bracketed from the FHA estimate and refined with
 * Brent's method (Io_rect falls with vo, so the root is unique), each evaluation a warm-started
 * solveHeldOutput; a held solve without a periodic state (current unbounded) counts as excess.
 */
export function solveSteadyState(p: TdParams, rl: number, opts: SteadyOptions = {}): SteadyStateResult {
  checkParams(p, 0);
  if (!(rl > 0)) throw new RangeError(`tdmodel: load resistance must be > 0 (got ${rl})`);
  const voStart = Math.max(opts.voGuess ?? fhaVo(p, rl), 1e-6 * p.vin);
  if (!Number.isFinite(rl)) return noLoad(p, voStart);
  const direct = opts.method === 'bracket' ? null : solveLoaded(p, rl, voStart, opts.guess);
  if (direct && direct.vo >= 0) return finish(rl, direct, 1);
  return bracketed(p, rl, voStart, opts);
}

function bracketed(p: TdParams, rl: number, vo0: number, opts: SteadyOptions): SteadyStateResult {
  const solved: HeldOutputResult[] = [];
  let evaluations = 0;
  const held = (vo: number): HeldOutputResult | null => {
    evaluations++;
    let near: HeldOutputResult | undefined;
    for (const r of solved) if (!near || Math.abs(r.vo - vo) < Math.abs(near.vo - vo)) near = r;
    const guess = near ? near.seed : opts.guess;
    try {
      const r = solveHeldOutput(p, vo, guess ? { guess } : {});
      solved.push(r);
      return r;
    } catch (err) {
      if (err instanceof RangeError) throw err;
      return null;
    }
  };
  const g = (vo: number): number => {
    const r = held(vo);
    return r ? r.ioRect - vo / rl : Infinity;
  };
  let a = vo0;
  let fa = g(a);
  let b = a;
  let fb = fa;
  let factor = 1.02;
  if (fa > 0) {
    do {
      a = b; fa = fb;
      b = a * factor;
      fb = g(b);
      factor = Math.min(2, factor * 1.5);
      if (b > 1e3 * p.vin) fail(p);
    } while (fb > 0);
  } else {
    do {
      b = a; fb = fa;
      a = a / factor < 1e-6 * vo0 ? 0 : a / factor;
      fa = g(a);
      factor = Math.min(2, factor * 1.5);
    } while (fa <= 0 && a > 0);
    if (fa <= 0) return finish(rl, held(0) ?? fail(p), evaluations);
  }
  const vo = brent(g, a, b, fa, fb, (opts.tolerance ?? 1e-10) * vo0);
  const best = solved.find((r) => r.vo === vo) ?? held(vo) ?? fail(p);
  return finish(rl, best, evaluations);
}

/**
 * No load: with the rectifier off the periodic state does not depend on vo, and the output
 * charges to the peak Lm voltage of that state divided by n, less the diode drop.
 */
function noLoad(p: TdParams, vo0: number): SteadyStateResult {
  const drop = (p.rectifier === 'center-tapped' ? 1 : 2) * p.vf;
  let vo = 2 * vo0;
  let off = solveHeldOutput(p, vo);
  let evaluations = 1;
  for (; off.ioRect > 0 && evaluations < 30; evaluations++) off = solveHeldOutput(p, (vo *= 2), { guess: off.seed });
  if (off.ioRect > 0) fail(p);
  const peak = Math.max(off.lmVoltagePeakOpen / p.n - drop, 0);
  return finish(Infinity, solveHeldOutput(p, peak, { guess: off.seed }), evaluations + 1);
}

function fail(p: TdParams): never {
  throw new Error(`tdmodel: no steady state found at fs = ${p.fs} Hz`);
}

function finish(rl: number, r: HeldOutputResult, evaluations: number): SteadyStateResult {
  return { ...r, rl, io: Number.isFinite(rl) ? r.vo / rl : 0, evaluations };
}

/** FHA output voltage (ideal diodes in Rac, gain capped at 4), less the diode drop: the start. */
export function fhaVo(p: TdParams, rl: number): number {
  const fn = p.fs * 2 * Math.PI * Math.sqrt(p.lr * p.cr);
  const ln = p.lm / p.lr;
  const q = Number.isFinite(rl) ? (Math.sqrt(p.lr / p.cr) * Math.PI ** 2) / (8 * p.n * p.n * rl) : 0;
  const m = 1 / Math.hypot(1 + (1 - 1 / (fn * fn)) / ln, q * (fn - 1 / fn));
  const vinEff = p.inverter === 'full-bridge' ? p.vin : p.vin / 2;
  const drop = (p.rectifier === 'center-tapped' ? 1 : 2) * p.vf;
  return (Math.min(m, 4) * vinEff) / p.n - drop;
}
