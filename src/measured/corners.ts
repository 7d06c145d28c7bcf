import { effectiveTurnsRatio } from '../design/transformer.js';
import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { idNumber, loadLabel } from '../corners/expand.js';
import type { MeasuredPoint } from './types.js';

/**
 * The load resistance a prototype actually saw at a measured point, in ohm. Unlike design corners
 * (converted at output.voltage), a bench point is converted at its measured output voltage: an
 * electronic load set to 10 A at 23.5 V is a 2.35 ohm load, and that is what the models must see.
 * A share of power is a share of operating.ratedPower.
 */
export function measuredLoad(point: MeasuredPoint, design: Design): number {
  const v = point.vout;
  const l = point.load;
  switch (l.kind) {
    case 'ohm': return l.value;
    case 'ampere': return v / l.value;
    case 'watt': return (v * v) / l.value;
    case 'percent': return (v * v) / (l.value * design.operating.ratedPower);
  }
}

/**
 * One fixed-frequency corner per measured point, at the measured fs, input voltage and load, with
 * the nominal tank. Ids start with `m` and the point's line number (`m3_v390_12p5ohm_f98p5k`), so
 * they never collide with the design's own corners and stay stable while the file's rows do.
 */
export function measuredCorners(design: Design, points: readonly MeasuredPoint[]): Corner[] {
  const { tank } = design;
  return points.map((p) => {
    const r = measuredLoad(p, design);
    return {
      id: `m${p.line}_v${idNumber(p.vin)}_${idNumber(r)}ohm_f${idNumber(p.fs / 1e3)}k`,
      vin: p.vin, load: r, loadLabel: loadLabel(p.load), iout: p.vout / r, pout: (p.vout * p.vout) / r, fs: p.fs,
      lr: tank.lr, cr: tank.cr, lm: tank.lm, turnsRatio: effectiveTurnsRatio(tank.integrated, tank.lr, tank.lm, tank.turnsRatio),
      ...(tank.integrated ? { windingRatio: tank.turnsRatio } : {}), tolerance: { lr: 0, cr: 0, lm: 0 },
    };
  });
}
