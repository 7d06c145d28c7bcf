import { solveSteadyState } from './periodic.js';
import { solveRegulatedDirect } from './regulated.js';
import { brent } from './root.js';
import { checkParams } from './model.js';
import type { FrequencyResult, SteadyStateResult, TdParams } from './types.js';

/** Options of solveFrequency. */
export interface FrequencyOptions {
  /** Highest frequency tried, Hz. @default min(20 fr, 0.45 / deadTime) */
  fsMax?: number;
  /** Lowest frequency tried, Hz; below fp the search would meet sub-harmonic resonances. @default fp = 1 / (2 pi sqrt((Lr + Lm) Cr)) */
  fsMin?: number;
  /** Relative tolerance on fs. @default 1e-9 */
  tolerance?: number;
  /** Try the direct Newton solve of state and frequency first (regulated.ts). @default true */
  direct?: boolean;
}

/**
 * Switching frequency at which the steady state with load rl (ohm) gives voTarget (V) (p.fs is
 * ignored), searched
 * from fsGuess (Hz, e.g. the FHA result) on the inductive branch: the tank current is positive
 * at the high-side turn-off and the output falls with rising fs. Steps outwards by growing
 * factors until the target is bracketed, then Brent's method. Returns fs null with the reason
 * when the target lies above the highest inductive output or below the output at fsMax.
 */
export function solveFrequency(p: TdParams, rl: number, voTarget: number, fsGuess: number, opts: FrequencyOptions = {}): FrequencyResult {
  checkParams(p, voTarget);
  const fr = 1 / (2 * Math.PI * Math.sqrt(p.lr * p.cr));
  const fsMax = Math.min(opts.fsMax ?? 20 * fr, p.deadTime > 0 ? 0.45 / p.deadTime : Infinity);
  const fsMin = opts.fsMin ?? 1 / (2 * Math.PI * Math.sqrt((p.lr + p.lm) * p.cr));
  let evaluations = 0;
  let last: SteadyStateResult | undefined;
  const cache = new Map<number, SteadyStateResult | null>();
  const at = (fs: number): SteadyStateResult | null => {
    if (cache.has(fs)) return cache.get(fs)!;
    evaluations++;
    let r: SteadyStateResult | null = null;
    try {
      r = solveSteadyState({ ...p, fs }, rl, last ? { guess: last.seed, voGuess: last.vo } : {});
      last = r;
    } catch (err) {
      if (err instanceof RangeError) throw err;
    }
    cache.set(fs, r);
    return r;
  };
  const inductive = (r: SteadyStateResult | null) => r !== null && r.turnOffCurrent > 0;
  const fail = (reason: string): FrequencyResult => ({ fs: null, reason, evaluations });

  // Fast path: state and frequency in one Newton solve from the guess (regulated.ts), accepted
  // when it lands on the falling inductive branch (checked 2 % higher, as the search does);
  // otherwise the search below, which brackets the branch explicitly.
  const direct = opts.direct === false ? null : solveRegulatedDirect(p, rl, voTarget, Math.min(Math.max(fsGuess, fsMin), fsMax), { fsMin, fsMax });
  if (direct) {
    evaluations++;
    last = direct.state;
    const up = direct.fs * 1.02 <= fsMax ? at(direct.fs * 1.02) : null;
    if (inductive(up) && up!.vo < direct.state.vo) return { fs: direct.fs, state: direct.state, evaluations };
  }

  // Onto the falling inductive branch: inductive at f0 and a lower output at 1.02 f0.
  let f0 = Math.min(Math.max(fsGuess, fsMin), fsMax / 1.02);
  let factor = 1.05;
  for (;;) {
    const r = at(f0);
    const up = inductive(r) ? at(f0 * 1.02) : null;
    if (r && up && up.vo < r.vo) break;
    f0 *= factor;
    factor = Math.min(1.5, factor * 1.3);
    if (f0 * 1.02 > fsMax) return fail(`no inductive operating point with the output falling with fs between ${fmt(fsGuess)} and ${fmt(fsMax)} Hz`);
  }
  const r0 = at(f0);
  let lo = f0; // higher output side
  let hi = f0;
  let rLo = r0!;
  let rHi = r0!;
  factor = 1.05;
  if (rLo.vo < voTarget) {
    for (;;) {
      const f = lo / factor;
      factor = Math.min(1.3, factor * 1.3);
      const r = at(f);
      if (f < fsMin || !inductive(r) || r!.vo <= rLo.vo) {
        return fail(`output ${fmt(voTarget)} V is above the highest output on the inductive branch, about ${fmt(rLo.vo)} V near ${fmt(lo)} Hz`);
      }
      hi = lo; rHi = rLo;
      lo = f; rLo = r!;
      if (rLo.vo >= voTarget) break;
    }
  } else {
    for (;;) {
      const f = hi * factor;
      factor = Math.min(2, factor * 1.5);
      if (f > fsMax) return fail(`output ${fmt(voTarget)} V is below the output at the highest frequency tried, ${fmt(rHi.vo)} V at ${fmt(hi)} Hz`);
      const r = at(f);
      if (!r) return fail(`no steady state at ${fmt(f)} Hz`);
      lo = hi; rLo = rHi;
      hi = f; rHi = r;
      if (rHi.vo <= voTarget) break;
    }
  }
  const g = (fs: number) => {
    const r = at(fs);
    return r ? r.vo - voTarget : NaN;
  };
  const fs = brent(g, lo, hi, rLo.vo - voTarget, rHi.vo - voTarget, (opts.tolerance ?? 1e-9) * hi);
  const state = at(fs);
  if (!state) return fail(`no steady state at ${fmt(fs)} Hz`);
  return { fs, state, evaluations };
}

const fmt = (x: number) => x.toPrecision(5);
