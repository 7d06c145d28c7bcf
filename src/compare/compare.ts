import type { Design } from '../design/types.js';
import { COMPARE_METRIC_GROUP, type CompareKey, type ComparedMetric } from '../design/fields.js';
import type { FhaResult } from '../fha/types.js';
import type { SimMetrics } from '../measure/types.js';
import type { ComparisonRow, Divergence } from './types.js';
import { applyCauses } from './causeRows.js';
import { doc, explainCurrent, explainFrequency, explainGain, explainStatus, zoneOf, type Zone } from './reasons.js';

type Group = 'fs' | 'vout' | 'gain' | 'currents' | 'voltages';

/** Numeric metrics compared, with the compare group that supplies their tolerance (from the design's table). */
export const COMPARED: { metric: ComparedMetric & keyof SimMetrics & keyof FhaResult; group: Group }[] =
  (Object.entries(COMPARE_METRIC_GROUP) as [ComparedMetric, Group][]).map(([metric, group]) => ({ metric, group }));

/** Tolerance of one metric: its own `compare` setting, else its group's; null when set to `off`. */
export function toleranceOf(design: Design, metric: CompareKey, group?: Group): number | null {
  const own = design.compare.metrics?.[metric];
  if (own === 'off') return null;
  return own ?? (group ? design.compare[group] : null);
}

const STATUS: ('zvs' | 'zcs' | 'region')[] = ['zvs', 'zcs', 'region'];

export interface Comparison {
  rows: ComparisonRow[];
  divergences: Divergence[];
  zone: Zone;
}

/**
 * FHA against simulation for one corner: relative error (sim - fha)/|fha| per metric, the
 * tolerance of its group, a verdict, and for each divergence a short reason pointing at docs/method.md.
 * Status metrics (ZVS, ZCS, region) diverge when they disagree. In fixed-frequency mode fs is equal
 * by construction and reported for information; in regulated mode Vout is the search target.
 * With the ideal time-domain model's metrics (`ideal`; null where it does not apply) every row
 * carries the ideal value and every divergence a `cause` (see applyCauses).
 */
export function compareCorner(design: Design, fha: FhaResult, sim: SimMetrics, regulated: boolean, ideal: SimMetrics | null = null): Comparison {
  const zone = zoneOf(sim.fs, fha.fr, fha.fp);
  const rows: ComparisonRow[] = [];
  for (const { metric, group } of COMPARED) {
    const f = fha[metric] as number | null;
    const s = sim[metric] as number;
    const informational = (metric === 'fs' && !regulated) || (metric === 'vout' && regulated);
    const tolerance = informational ? null : toleranceOf(design, metric, group);
    // A zero or non-finite FHA value has no relative error (the table shows '!' for a diverged one).
    if (f === null || !Number.isFinite(s) || !Number.isFinite(f) || f === 0) {
      const diverged = f === null && metric === 'fs' && regulated && tolerance !== null;
      rows.push({ metric, fha: f, sim: s, error: null, tolerance, verdict: diverged ? 'diverged' : 'info',
        ...(diverged ? { reason: `FHA finds no ZVS-compatible frequency for this gain; simulation regulates here, as FHA under-predicts gain below resonance (${doc('below-resonance')})` } : {}) });
      continue;
    }
    const error = (s - f) / Math.abs(f);
    const over = tolerance !== null && Math.abs(error) > tolerance;
    const row: ComparisonRow = { metric, fha: f, sim: s, error, tolerance, verdict: tolerance === null ? 'info' : over ? 'diverged' : 'ok' };
    if (over) {
      const ex = metric === 'fs' ? explainFrequency(zone, error, sim.mode)
        : metric === 'gain' || metric === 'vout' ? explainGain(zone, error, sim.mode)
        : { reason: group === 'currents' ? explainCurrent(metric, zone, fha, sim) : voltageReason(metric), unexpectedSign: false };
      row.reason = ex.reason;
      if (ex.unexpectedSign) row.unexpectedSign = true;
    }
    rows.push(row);
  }
  for (const metric of STATUS) {
    const f = fha[metric];
    const s = sim[metric];
    const off = design.compare.metrics?.[metric] === 'off';
    const diverged = f !== null && f !== s && !off;
    rows.push({ metric, fha: f, sim: s, error: null, tolerance: null, verdict: diverged ? 'diverged' : off ? 'info' : 'ok',
      ...(diverged ? { reason: explainStatus(metric, zone, fha, sim) } : {}) });
  }
  rows.push({ metric: 'mode', fha: null, sim: sim.mode, error: null, tolerance: null, verdict: 'info' });
  applyCauses(rows, sim, ideal, design.switches.deadTime);
  const divergences: Divergence[] = rows.filter((r) => r.verdict === 'diverged').map((r) => ({
    metric: r.metric, fha: r.fha, sim: r.sim, error: r.error, tolerance: r.tolerance, reason: r.reason ?? '',
    ...(r.unexpectedSign ? { unexpectedSign: true } : {}),
    ...(r.ideal !== undefined ? { ideal: r.ideal } : {}), ...(r.cause ? { cause: r.cause } : {}),
  }));
  return { rows, divergences, zone };
}

function voltageReason(metric: string): string {
  return metric === 'crVoltagePeak'
    ? `the Cr swing follows the tank current peak, which FHA underestimates away from resonance (${doc('cr-and-diode-voltage')})`
    : `FHA takes the ideal clamp 2 Vo + VF (center-tapped) or Vo + VF; simulation includes the drops at the actual current (${doc('cr-and-diode-voltage')})`;
}
