import type { Waveforms, ZvsState } from './types.js';
import { bridgeSign, findGateEdges, within, type GateEdges } from './edges.js';
import { valueAt, type GridPoint, type Span } from './window.js';

/** What one gate turn-on edge in the window looked like (docs/method.md#zvs). */
export interface TurnOnEdge {
  /** Index into Waveforms.switches. */
  switchIndex: number;
  /** Edge time (gate crossing 0.5 upward), s. */
  time: number;
  /** v_ds at the edge divided by Vin. */
  vdsFraction: number;
  state: ZvsState;
  /**
   * Edge time minus the last downward crossing of zvsThreshold * Vin before it, searched back over
   * half a period, s. When v_ds never rose above the threshold in that half period: the whole half
   * period. When v_ds is above the threshold at the edge (no ZVS): a fixed negative value, minus one
   * dead time (minus half a period when the dead time is 0), so "late" is always negative and finite.
   */
  marginTime: number;
  /**
   * Tank current at the edge in the direction that flows source -> drain through the incoming
   * switch's body diode, A: -i_t for the high-side group, +i_t for the others. Positive = inductive.
   */
  diodeCurrent: number;
}

/** ZVS state of one edge from v_ds / Vin: <= a zvs, >= 1 - a hard, else partial. */
export function classifyZvs(fraction: number, threshold: number): ZvsState {
  if (fraction <= threshold) return 'zvs';
  return fraction >= 1 - threshold ? 'hard' : 'partial';
}

/**
 * Every gate turn-on edge of every switch with start.t <= time < end.t. `gates` may cover a wider
 * range (measure() shares one set); by default they are found over the span.
 */
export function turnOnEdges(w: Waveforms, span: Span, threshold: number, gates?: GateEdges): TurnOnEdge[] {
  const g = gates ?? findGateEdges(w, span.start.t, span.end.t);
  const half = 0.5 / w.fs;
  const late = -(w.deadTime > 0 ? w.deadTime : half);
  const level = threshold * w.vin;
  const out: TurnOnEdge[] = [];
  w.switches.forEach((sw, k) => {
    for (const e of within(g.rise[k], span.start.t, span.end.t)) {
      const v = valueAt(sw.vds, e);
      const fraction = v / w.vin;
      const marginTime = v <= level ? zvsMargin(w.t, sw.vds, e, v, level, e.t - half) : late;
      const diodeCurrent = -bridgeSign(w, k) * valueAt(w.tankCurrent, e);
      out.push({ switchIndex: k, time: e.t, vdsFraction: fraction, state: classifyZvs(fraction, threshold), marginTime, diodeCurrent });
    }
  });
  return out;
}

/** Walks back from the edge (where v_ds = vEdge <= level) to the last downward crossing of level. */
function zvsMargin(t: Float64Array, vds: Float64Array, e: GridPoint, vEdge: number, level: number, limit: number): number {
  let tb = e.t;
  let b = vEdge;
  for (let j = e.i; j >= 0 && tb > limit; j--) {
    const ta = t[j];
    const a = vds[j];
    if (a > level && b <= level) {
      const tc = tb > ta ? ta + ((level - a) / (b - a)) * (tb - ta) : tb;
      return e.t - Math.max(tc, limit);
    }
    tb = ta;
    b = a;
  }
  return e.t - Math.max(limit, t[0]);
}

/** Worst case over the edges: zvs = every edge ZVS; worst voltage = largest fraction; margin = smallest. */
export function summarizeZvs(edges: TurnOnEdge[], threshold: number) {
  if (edges.length === 0) throw new Error('measure: no gate turn-on edge in the window');
  let worst = -Infinity;
  let margin = Infinity;
  for (const e of edges) {
    worst = Math.max(worst, e.vdsFraction);
    margin = Math.min(margin, e.marginTime);
  }
  return { zvs: worst <= threshold, zvsState: classifyZvs(worst, threshold), zvsWorstVoltage: worst, zvsMarginTime: margin };
}

/**
 * Region from the current sign at turn-on (docs/method.md#zvs, ZVS by current sign), worst case:
 * 'capacitive' as soon as one turn-on edge of any switch sees current in the wrong direction
 * (diodeCurrent < 0), else 'inductive'. Judged at the gate edge, so a dead time long enough for the
 * tank current to reverse before the edge also reads capacitive, which is the switch's real condition.
 */
export function regionOf(edges: TurnOnEdge[]): 'inductive' | 'capacitive' {
  return edges.some((e) => e.diodeCurrent < 0) ? 'capacitive' : 'inductive';
}

/**
 * Turn-off current, A: tank current at each gate falling edge in the window, signed so that positive
 * drives the bridge node towards the incoming switch (ZVS direction): +i_t when a high-side-group
 * switch turns off, -i_t otherwise. Returns the smallest (worst) value; negative = wrong direction.
 */
export function turnOffCurrent(w: Waveforms, span: Span, gates?: GateEdges): number {
  const g = gates ?? findGateEdges(w, span.start.t, span.end.t);
  let worst = Infinity;
  w.switches.forEach((_, k) => {
    for (const e of within(g.fall[k], span.start.t, span.end.t)) {
      worst = Math.min(worst, bridgeSign(w, k) * valueAt(w.tankCurrent, e));
    }
  });
  if (worst === Infinity) throw new Error('measure: no gate turn-off edge in the window');
  return worst;
}
