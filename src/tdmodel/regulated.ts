import { HalfPeriod } from './halfperiod.js';
import { normalize } from './model.js';
import { phasorGuess } from './guess.js';
import { newton, safeRun } from './shooting.js';
import { resultAt, toNormalized } from './held.js';
import type { SeedState, SteadyStateResult, TdParams } from './types.js';

/**
 * Periodic state and switching frequency together at a given output voltage: Newton on
 * (i_r, i_m, v_cr, T/2) at t = 0 with the symmetry residual and the load equation
 * Io_rect = Vo / RL, the output held at voTarget (V). The same equations as the load solve
 * (loaded.ts) with the half period as the fourth unknown instead of Vo, so one Newton solve
 * replaces the outer frequency search. The normalisation does not depend on fs (time base
 * sqrt(Lr Cr)), only the half-period length does.
 *
 * Returns null when Newton fails or lands outside the inductive branch (the tank current must be
 * positive at the high-side turn-off, and fs inside [fsMin, fsMax]); the caller then searches.
 */
export function solveRegulatedDirect(
  p: TdParams, rl: number, voTarget: number, fsGuess: number, range: { fsMin: number; fsMax: number },
  guess?: Pick<SeedState, 'ir' | 'im' | 'vcr'>,
): { fs: number; state: SteadyStateResult; iterations: number } | null {
  if (!(rl > 0) || !Number.isFinite(rl) || !(fsGuess > 0)) return null;
  const c = normalize({ ...p, fs: fsGuess }, voTarget);
  const hp = new HalfPeriod(c);
  const dropN = ((p.rectifier === 'center-tapped' ? 1 : 2) * p.vf) / p.vin;
  const ioTarget = (c.vc / p.n - dropN) * (c.base.z / rl);
  const halfMin = 0.5 / range.fsMax / c.base.t;
  const halfMax = 0.5 / range.fsMin / c.base.t;
  const count = { n: 0 };
  const res = (u: number[]): number[] | null => {
    if (!(u[3] > halfMin && u[3] < halfMax && u[3] > c.td)) return null;
    c.half = u[3];
    const e = safeRun(hp, u);
    if (!e) return null;
    const io = (p.n * hp.absSec) / c.half;
    return [e[0] + u[0], e[1] + u[1], e[2] + u[2], io - ioTarget];
  };
  const z0 = guess ? toNormalized(c, guess) : phasorGuess(c);
  const sol = newton(res, [...z0, c.half], count);
  if (!sol) return null;
  c.half = sol.z[3];
  const fs = 0.5 / (sol.z[3] * c.base.t);
  const held = resultAt({ ...p, fs }, hp, voTarget, sol.z.slice(0, 3), count.n, false);
  if (!(held.turnOffCurrent > 0)) return null;
  return { fs, state: { ...held, rl, io: voTarget / rl, evaluations: 1 }, iterations: count.n };
}
