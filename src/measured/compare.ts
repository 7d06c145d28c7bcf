import type { MeasuredPoint } from './types.js';

/** Metrics a bench file may hold that the models also predict (same names as `fha`/`ideal`/`sim`). */
export const MEASURED_METRICS = ['vout', 'tankCurrentRms', 'crVoltagePeak', 'switchTurnOffCurrent'] as const;
export type MeasuredMetric = (typeof MEASURED_METRICS)[number];

/**
 * Relative gap (measured - model) / |model| per metric the point holds: -3 % means the bench
 * read 3 % below the model.
 */
export type MeasuredErrors = Partial<Record<MeasuredMetric, number>>;

/** A model's values for the measured metrics; missing or non-finite values give no error. */
export type ModelValues = Partial<Record<MeasuredMetric, number | null | undefined>>;

/** Errors of one model against a measured point; null when the model has no values. */
export function measuredErrors(point: MeasuredPoint, model: ModelValues | null | undefined): MeasuredErrors | null {
  if (!model) return null;
  const out: MeasuredErrors = {};
  for (const m of MEASURED_METRICS) {
    const meas = point[m];
    const v = model[m];
    if (meas === undefined || typeof v !== 'number' || !Number.isFinite(v) || v === 0) continue;
    out[m] = (meas - v) / Math.abs(v);
  }
  return out;
}

/**
 * Output power the prototype delivered at a point, W: vout x iout with the load as set (a current,
 * a power, a resistance, or a share of operating.ratedPower). `loadOhm` is the converted resistance.
 */
export function measuredOutputPower(point: MeasuredPoint, loadOhm: number): number {
  return (point.vout * point.vout) / loadOhm;
}

/** Measured efficiency Pout / Pin, from `pin` or else vin x iin; undefined without either. */
export function measuredEfficiency(point: MeasuredPoint, loadOhm: number): number | undefined {
  const pin = point.pin ?? (point.iin !== undefined ? point.vin * point.iin : undefined);
  return pin === undefined ? undefined : measuredOutputPower(point, loadOhm) / pin;
}

/** One measured point's gap as used by the pattern finder. */
export interface GapSample {
  fs: number;
  /** Output current at the point, A. */
  iout: number;
  /** (measured - sim) / sim of Vout. */
  error: number;
}

/** What a set of gaps between simulation and bench suggests; null when there is no consistent gap. */
export interface GapHint {
  pattern: 'offset' | 'frequency' | 'load';
  /** Pearson correlation of the error with log(fs) or with iout (for 'offset': the mean error). */
  strength: number;
  message: string;
}

function pearson(x: number[], y: number[]): number {
  const n = x.length;
  const mx = x.reduce((a, b) => a + b, 0) / n;
  const my = y.reduce((a, b) => a + b, 0) / n;
  let sxy = 0;
  let sxx = 0;
  let syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
    syy += (y[i] - my) ** 2;
  }
  return sxx === 0 || syy === 0 ? 0 : sxy / Math.sqrt(sxx * syy);
}

/** |r| above which an error is said to follow fs or load (with at least 3 points). */
export const PATTERN_CORRELATION = 0.8;

/**
 * Which parameter would explain a consistent Vout gap between simulation and bench, as an engineer
 * would read it (common practice): a gap that follows the switching frequency points at the
 * resonant elements (Lm, Cr, Lr) because the gain curve's shape is set by them; one that follows
 * the load points at the load-dependent drops the models under-state (rectifier forward drop,
 * winding, switch and trace resistances); a uniform offset points at the turns ratio or at the
 * instruments. A gap counts from a fifth of `tolerance` (compare.measured): a pattern is worth
 * naming before any point fails. Returns null when there is none.
 */
export function gapHint(samples: readonly GapSample[], tolerance: number): GapHint | null {
  const significant = tolerance / 5;
  if (samples.length === 0 || !samples.some((s) => Math.abs(s.error) > significant)) return null;
  const err = samples.map((s) => s.error);
  if (samples.length >= 3) {
    const rf = pearson(samples.map((s) => Math.log(s.fs)), err);
    const rl = pearson(samples.map((s) => s.iout), err);
    const spread = Math.max(...err) - Math.min(...err);
    if (spread > significant && Math.max(Math.abs(rf), Math.abs(rl)) >= PATTERN_CORRELATION) {
      return Math.abs(rf) >= Math.abs(rl)
        ? { pattern: 'frequency', strength: rf, message: 'the gap follows the switching frequency: check Lm and Cr (and Lr) against their measured values; the gain curve\'s shape is set by them' }
        : { pattern: 'load', strength: rl, message: 'the gap follows the load: check the rectifier forward drop and the winding, switch and trace resistances, which the models under-state at high current' };
    }
  }
  const mean = err.reduce((a, b) => a + b, 0) / err.length;
  if (Math.abs(mean) <= significant) return null;
  return { pattern: 'offset', strength: mean, message: 'a uniform offset: check the turns ratio and the calibration of the probes and meters' };
}
