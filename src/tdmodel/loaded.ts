import { HalfPeriod } from './halfperiod.js';
import { normalize } from './model.js';
import { phasorGuess } from './guess.js';
import { newton, safeRun } from './shooting.js';
import { resultAt, toNormalized } from './held.js';
import type { HeldOutputResult, SeedState, TdParams } from './types.js';

/**
 * Periodic state and output voltage together: Newton on (i_r, i_m, v_cr, Vo) at t = 0 with the
 * symmetry residual and the load equation Io_rect = Vo / RL. Well posed even where the held-
 * output problem is not (near fr the gain hardly depends on the load, so Io_rect(Vo) is almost
 * vertical). Returns null when Newton fails; the caller then brackets Vo instead.
 */
export function solveLoaded(
  p: TdParams, rl: number, vo0: number, guess?: Pick<SeedState, 'ir' | 'im' | 'vcr'>,
): HeldOutputResult | null {
  const c = normalize(p, vo0);
  const hp = new HalfPeriod(c);
  const dropN = ((p.rectifier === 'center-tapped' ? 1 : 2) * p.vf) / p.vin;
  const gLoad = c.base.z / rl;
  const count = { n: 0 };
  const res = (u: number[]): number[] | null => {
    if (u[3] < p.n * dropN) return null; // Vo < 0
    hp.setClamp(u[3]);
    const e = safeRun(hp, u);
    if (!e) return null;
    const io = (p.n * hp.absSec) / c.half;
    return [e[0] + u[0], e[1] + u[1], e[2] + u[2], io - (u[3] / p.n - dropN) * gLoad];
  };
  const z0 = guess ? toNormalized(c, guess) : phasorGuess(c);
  const sol = newton(res, [...z0, c.vc], count);
  if (!sol) return null;
  hp.setClamp(sol.z[3]);
  const vo = (sol.z[3] / p.n - dropN) * p.vin;
  return resultAt(p, hp, vo, sol.z.slice(0, 3), count.n, false);
}
