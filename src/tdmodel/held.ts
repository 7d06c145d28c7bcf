import { HalfPeriod } from './halfperiod.js';
import { normalize, type Circuit } from './model.js';
import { phasorGuess } from './guess.js';
import { findPeriodic } from './shooting.js';
import { newStats } from './stats.js';
import { buildResult } from './result.js';
import type { HeldOutputResult, SeedState, TdParams } from './types.js';

/** Options of solveHeldOutput. */
export interface HeldOptions {
  /** Warm start: the t = 0 state of a nearby solution (SI). @default first-harmonic phasors */
  guess?: Pick<SeedState, 'ir' | 'im' | 'vcr'>;
}

/**
 * Periodic steady state of the converter with the output held at vo (V): average rectified
 * current, the t = 0 state, the rectifier mode label and the stresses. Pure; throws a RangeError
 * for invalid parameters and an Error when no periodic state is found (e.g. an ideal tank at
 * exactly fr held below its load-independent output: the current grows without bound).
 */
export function solveHeldOutput(p: TdParams, vo: number, opts: HeldOptions = {}): HeldOutputResult {
  const c = normalize(p, vo);
  const hp = new HalfPeriod(c);
  let per = opts.guess ? findPeriodic(hp, toNormalized(c, opts.guess)) : null;
  if (!per) per = findPeriodic(hp, phasorGuess(c));
  if (!per) throw new Error(`tdmodel: no periodic steady state found (fs = ${p.fs} Hz, vo = ${vo} V)`);
  return resultAt(p, hp, vo, per.z, per.iterations, per.usedFallback);
}

/** Normalized (i_r, i_m, v_cr - V_dc) of an SI state at t = 0. */
export function toNormalized(c: Circuit, s: Pick<SeedState, 'ir' | 'im' | 'vcr'>): number[] {
  return [s.ir / c.base.i, s.im / c.base.i, s.vcr / c.base.v - c.vdc];
}

/** Runs the converged half period once more with statistics and converts to SI. */
export function resultAt(p: TdParams, hp: HalfPeriod, vo: number, z: number[], iterations: number, usedFallback: boolean): HeldOutputResult {
  const st = newStats();
  hp.run(z, st);
  return buildResult(p, hp.c, vo, z, st, iterations, usedFallback);
}
