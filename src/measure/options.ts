/** Thresholds of the waveform measurements (docs/method.md#zvs). All are plain ratios. */
export interface MeasureOptions {
  /**
   * ZVS: v_ds at a turn-on edge <= zvsThreshold * Vin is ZVS, >= (1 - zvsThreshold) * Vin is hard,
   * anything between is partial. Same value as the design's simulation.zvsThreshold. @default 0.05
   */
  zvsThreshold?: number;
  /**
   * ZCS: a rectifier conduction interval counts as zero-current commutated when the diode current
   * at the cutting primary edge is <= zcsThreshold times the interval's peak. @default 0.05
   */
  zcsThreshold?: number;
  /** A diode conducts while its current exceeds this fraction of the largest diode peak in the window. @default 0.01 */
  conductionThreshold?: number;
  /** Mode label: |i_sec| <= modeThreshold * peak |i_sec| in the window counts as O. @default 0.02 */
  modeThreshold?: number;
  /** Mode label: segments shorter than this fraction of the half period are dropped as spurious. @default 0.02 */
  modeMinSegment?: number;
  /** Largest accepted relative difference between the gate-edge frequency and Waveforms.fs. @default 1e-3 */
  fsTolerance?: number;
}

export type ResolvedMeasureOptions = Required<MeasureOptions>;

export const MEASURE_DEFAULTS: ResolvedMeasureOptions = {
  zvsThreshold: 0.05,
  zcsThreshold: 0.05,
  conductionThreshold: 0.01,
  modeThreshold: 0.02,
  modeMinSegment: 0.02,
  fsTolerance: 1e-3,
};

/** Fills defaults and rejects values outside their meaningful range. */
export function resolveMeasureOptions(opts: MeasureOptions = {}): ResolvedMeasureOptions {
  const r: ResolvedMeasureOptions = { ...MEASURE_DEFAULTS };
  for (const key of Object.keys(MEASURE_DEFAULTS) as (keyof ResolvedMeasureOptions)[]) {
    const v = opts[key];
    if (v === undefined) continue;
    const max = key === 'zvsThreshold' ? 0.5 : 1;
    if (!Number.isFinite(v) || v < 0 || v >= max) {
      throw new Error(`measure: option ${key} must be in [0, ${max}), got ${v}`);
    }
    r[key] = v;
  }
  return r;
}
