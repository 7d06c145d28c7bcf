import type { Design } from '../design/types.js';
import type { Corner } from './types.js';
import { drawSamples } from '../statistics/index.js';

/** One Monte Carlo sample of the tank, ready to be placed at every operating point. */
export interface TankSample {
  index: number;
  /** Id part: "s" and the sample number, at least 4 digits ("s0017"), so ids sort and never change with the count. */
  suffix: string;
  values: { lr: number; cr: number; lm: number };
  turnsRatio: number;
  deviation: NonNullable<Corner['deviation']>;
}

/** Defaults of the random mode (also in design/fields.ts, where the parser takes them from). */
export const RANDOM_DEFAULTS = { samples: 100, seed: 1, distribution: 'uniform', turnsRatio: 0 } as const;

/**
 * The tank samples of a design with tolerances.corners: random. Sample k depends only on the
 * seed and k (statistics/prng.ts), so the same file gives the same samples everywhere, and a
 * subset (a shard, a --only filter) gives the same values as the full run.
 */
export function sampleCorners(design: Design): TankSample[] {
  const t = design.tolerances;
  const { tank } = design;
  const tol = { lr: t.lr, cr: t.cr, lm: t.lm, turnsRatio: t.turnsRatio ?? RANDOM_DEFAULTS.turnsRatio };
  return drawSamples(t.seed ?? RANDOM_DEFAULTS.seed, t.samples ?? RANDOM_DEFAULTS.samples, tol, t.distribution ?? RANDOM_DEFAULTS.distribution)
    .map((s) => ({
      index: s.index,
      suffix: `s${String(s.index).padStart(4, '0')}`,
      values: { lr: tank.lr * (1 + s.deviation.lr), cr: tank.cr * (1 + s.deviation.cr), lm: tank.lm * (1 + s.deviation.lm) },
      turnsRatio: tank.turnsRatio * (1 + s.deviation.turnsRatio),
      deviation: { ...s.deviation },
    }));
}
