/**
 * Case 4: FHA predictions per second. Large in-memory corner lists built from the two example
 * designs (20 input voltages x 20 loads x 9 tolerance sets, and the charger's two fixed
 * frequencies), each predicted in a loop; the rate is the median of several timed passes.
 */
import type { Design, LoadSpec } from '../src/design/types.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import type { BenchDesign } from './settling.js';
import { log, median } from './util.js';

export interface FhaRate {
  design: string;
  mode: string;
  corners: number;
  /** Median predictions per second over the passes. */
  perSecond: number;
  passes: number;
  /** Corners FHA reports unreachable (fs null), for context. */
  unreachable: number;
}

const linspace = (a: number, b: number, n: number) => Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));

/** The design with a 20 x 20 grid of input voltage (+-15 % around the listed span) and load (5-100 %), all tolerance extremes. */
export function bigDesign(design: Design): Design {
  const vins = design.operating.vin;
  const lo = Math.min(...vins) * 0.95;
  const hi = Math.max(...vins) * 1.05;
  const loads: LoadSpec[] = linspace(0.05, 1, 20).map((value) => ({ kind: 'percent', value }));
  return {
    ...design,
    operating: { ...design.operating, vin: linspace(lo, hi, 20), load: loads, corners: [] },
    tolerances: { ...design.tolerances, corners: 'extremes' },
  };
}

export function measureFhaRate(d: BenchDesign, passes = 7): FhaRate {
  const design = bigDesign(d.design);
  const corners = expandCorners(design);
  let sink = 0;
  let unreachable = 0;
  for (const c of corners) {
    const r = predictCorner(design, c); // warm-up pass
    if (r.fs === null) unreachable += 1;
    sink += r.vout ?? 0;
  }
  const rates: number[] = [];
  for (let p = 0; p < passes; p++) {
    const t0 = performance.now();
    for (const c of corners) sink += predictCorner(design, c).vout ?? 0;
    rates.push(corners.length / ((performance.now() - t0) / 1000));
  }
  if (!Number.isFinite(sink)) log('fha: non-finite sum of predicted Vout (a prediction returned NaN or Infinity)');
  const mode = design.operating.frequency === 'regulate' ? 'regulated' : 'fixed fs';
  const r: FhaRate = { design: d.key, mode, corners: corners.length, perSecond: median(rates), passes, unreachable };
  log(`fha ${d.key} (${mode}): ${r.corners} corners, ${r.perSecond.toFixed(0)} predictions/s`);
  return r;
}
