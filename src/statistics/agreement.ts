/** How closely the ideal model matched the simulation on one metric over the confirmed corners. */
export interface MetricAgreement {
  metric: string;
  /** Corners with both values. */
  count: number;
  /** Median of |ideal - sim| / |sim|. */
  median: number;
  /** Largest |ideal - sim| / |sim|, and the corner where it occurs. */
  worst: number;
  worstId: string;
}

/** Metrics compared, in report order: the regulated frequency and output, then the limited stresses. */
export const AGREEMENT_METRICS = [
  'fs', 'vout', 'tankCurrentRms', 'crVoltagePeak', 'switchCurrentRms', 'switchTurnOffCurrent',
  'diodeCurrentRms', 'diodeReverseVoltage', 'outputRippleCurrentRms', 'magnetizingCurrentPeak',
] as const;

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/**
 * The ideal model's relative error against the simulation per metric, over the corners that have
 * both (a failed or unsettled simulation, or a corner where the model does not apply, is left out).
 * A metric whose simulated value is 0 is skipped at that corner (no relative error exists).
 */
export function agreement(corners: readonly { id: string; status: string; ideal?: object | null; sim: object | null }[]): MetricAgreement[] {
  const usable = corners.filter((c) => c.sim && c.ideal && c.status !== 'failed' && c.status !== 'not-settled');
  const out: MetricAgreement[] = [];
  for (const metric of AGREEMENT_METRICS) {
    const errors: { id: string; e: number }[] = [];
    for (const c of usable) {
      const i = (c.ideal as Record<string, unknown>)[metric];
      const s = (c.sim as Record<string, unknown>)[metric];
      if (typeof i === 'number' && typeof s === 'number' && Number.isFinite(i) && Number.isFinite(s) && s !== 0) {
        errors.push({ id: c.id, e: Math.abs(i - s) / Math.abs(s) });
      }
    }
    if (errors.length === 0) continue;
    const w = errors.reduce((a, b) => (b.e > a.e ? b : a));
    out.push({ metric, count: errors.length, median: median(errors.map((x) => x.e)), worst: w.e, worstId: w.id });
  }
  return out;
}
