import { solveHeldOutput } from './held.js';
import { brent } from './root.js';
import { solveLoaded } from './loaded.js';
import type { HeldOutputResult, SteadyStateResult, TdParams } from './types.js';
import { checkParams } from './model.js';

/** Options of solveSteadyState. */
export interface SteadyOptions {
  /** Starting output voltage, V. @default FHA estimate (method reference 2.4) */
  voGuess?: number;
  /** Warm start state at t = 0 (e.g. from a neighbouring frequency). */
  guess?: HeldOutputResult['seed'];
  /** Relative tolerance on vo. @default 1e-10 */
  tolerance?: number;
}

/**
 * Steady state with a resistive load rl (ohm, Infinity = no load): the output voltage at which
 * the average rectified current equals vo / rl. Io_rect falls with vo, so the root is unique;
 * it is bracketed from the FHA estimate and refined with Brent's method, each evaluation a
 * warm-started solveHeldOutput. A held solve that finds no periodic state (current unbounded,
 * e.g. an ideal tank at fr below its load-independent output) counts as a current excess.
 */
export function solveSteadyState(p: TdParams, rl: number, opts: SteadyOptions = {}): SteadyStateResult {
  checkParams(p, 0);
  if (!(rl > 0)) throw new RangeError(`tdmodel: load resistance must be > 0 (got ${rl})`);
  const solved: HeldOutputResult[] = [];
  let evaluations = 0;
  const held = (vo: number): HeldOutputResult | null => {
    const near = nearest(solved, vo);
    const guess = near ? near.seed : opts.guess;
    evaluations++;
    try {
      const r = solveHeldOutput(p, vo, guess ? { guess } : {});
      solved.push(r);
      return r;
    } catch (err) {
      if (err instanceof RangeError) throw err;
      return null;
    }
  };
  const finite = Number.isFinite(rl);
  const voStart = Math.max(opts.voGuess ?? fhaVo(p, rl), 1e-6 * p.vin);
  if (finite) {
    const direct = solveLoaded(p, rl, voStart, opts.guess);
    if (direct && direct.vo >= 0) return finish(p, rl, direct, 1);
  }
  const ioScale = p.vin / Math.sqrt(p.lr / p.cr);
  // No load: the smallest vo at which the rectifier stops conducting (peak detection).
  const g = (vo: number): number => {
    const r = held(vo);
    if (!r) return Infinity;
    return finite ? r.ioRect - vo / rl : r.ioRect - 1e-9 * ioScale;
  };
  const vo0 = voStart;
  const tol = (opts.tolerance ?? 1e-10) * vo0;
  let a = vo0;
  let fa = g(a);
  let b = a;
  let fb = fa;
  let factor = 1.02;
  if (fa > 0) {
    for (;;) {
      b = a * factor;
      fb = g(b);
      if (fb <= 0) break;
      a = b; fa = fb;
      factor = Math.min(2, factor * 1.5);
      if (b > 1e3 * p.vin) throw new Error(`tdmodel: output voltage unbounded at fs = ${p.fs} Hz`);
    }
  } else {
    for (;;) {
      a = b / factor;
      if (a < 1e-6 * vo0) a = 0;
      fa = g(a);
      if (fa > 0 || a === 0) break;
      b = a; fb = fa;
      factor = Math.min(2, factor * 1.5);
    }
    if (fa <= 0) return finish(p, rl, held(0) ?? fail(p), evaluations);
  }
  const vo = brent(g, a, b, fa, fb, tol);
  const best = solved.find((r) => r.vo === vo) ?? held(vo) ?? fail(p);
  return finish(p, rl, best, evaluations);
}

function fail(p: TdParams): never {
  throw new Error(`tdmodel: no steady state found at fs = ${p.fs} Hz`);
}

function finish(p: TdParams, rl: number, r: HeldOutputResult, evaluations: number): SteadyStateResult {
  void p;
  return { ...r, rl, io: r.vo / rl, evaluations };
}

function nearest(solved: HeldOutputResult[], vo: number): HeldOutputResult | undefined {
  let best: HeldOutputResult | undefined;
  for (const r of solved) if (!best || Math.abs(r.vo - vo) < Math.abs(best.vo - vo)) best = r;
  return best;
}

/** FHA output voltage (ideal diodes in Rac), minus the diode drop: the starting point. */
export function fhaVo(p: TdParams, rl: number): number {
  const fr = 1 / (2 * Math.PI * Math.sqrt(p.lr * p.cr));
  const fn = p.fs / fr;
  const ln = p.lm / p.lr;
  const q = Number.isFinite(rl) ? (Math.sqrt(p.lr / p.cr) * Math.PI ** 2) / (8 * p.n * p.n * rl) : 0;
  const m = 1 / Math.hypot(1 + (1 - 1 / (fn * fn)) / ln, q * (fn - 1 / fn));
  const vinEff = p.inverter === 'full-bridge' ? p.vin : p.vin / 2;
  const drop = (p.rectifier === 'center-tapped' ? 1 : 2) * p.vf;
  return Math.min(m, 4) * vinEff / p.n - drop;
}
