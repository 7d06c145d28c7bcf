import type { Circuit } from './model.js';
import type { RectMode } from './types.js';

/** Bridge state in the first half period: dead-time clamps, free swing, float, or high side on. */
export type Bridge = 'clampL' | 'clampH' | 'free' | 'float' | 'on';

export type GuardId =
  | 'secP' | 'secN' | 'oUp' | 'oLow' | 'nodeHigh' | 'nodeLow' | 'exitH' | 'exitL' | 'floatHigh' | 'floatLow';

/** Validity condition w . x + e >= 0 of the present interval; its crossing is an event. */
export interface Guard { w: number[]; e: number; id: GuardId }

export const RECT_GUARDS = new Set<GuardId>(['secP', 'secN', 'oUp', 'oLow']);

/**
 * Guards of one (bridge, rectifier) state, x = (i_r, i_m, v_cr, v_b): P needs i_sec > 0, N
 * i_sec < 0, O an Lm voltage inside +-vc; a free node stays between the rails; a dead-time clamp
 * (body diode) needs the current towards its rail; a float node needs v_cr + v_m between the rails.
 */
export function guardsFor(c: Circuit, bridge: Bridge, rect: RectMode): Guard[] {
  const { k, vc, rd, vh, vl } = c;
  const rs = bridge === 'free' || bridge === 'float' ? 0 : c.rs;
  const list: Guard[] = [];
  if (rect === 'P') list.push({ w: [1, -1, 0, 0], e: 0, id: 'secP' });
  if (rect === 'N') list.push({ w: [-1, 1, 0, 0], e: 0, id: 'secN' });
  if (rect === 'O' && bridge !== 'float') {
    list.push({ w: [k * rs, 0, k, -k], e: vc, id: 'oUp' });
    list.push({ w: [-k * rs, 0, -k, k], e: vc, id: 'oLow' });
  }
  if (bridge === 'free') {
    list.push({ w: [0, 0, 0, -1], e: vh, id: 'nodeHigh' });
    list.push({ w: [0, 0, 0, 1], e: -vl, id: 'nodeLow' });
  }
  if (bridge === 'clampH') list.push({ w: [-1, 0, 0, 0], e: 0, id: 'exitH' });
  if (bridge === 'clampL') list.push({ w: [1, 0, 0, 0], e: 0, id: 'exitL' });
  if (bridge === 'float') {
    // Node voltage v_cr + v_m with v_m = +-vc + rd (i_r - i_m) in P/N, 0 in O (currents frozen).
    const vm0 = rect === 'P' ? vc : rect === 'N' ? -vc : 0;
    const r = rect === 'O' ? 0 : rd;
    list.push({ w: [-r, r, -1, 0], e: vh - vm0, id: 'floatHigh' });
    list.push({ w: [r, -r, 1, 0], e: vm0 - vl, id: 'floatLow' });
  }
  return list;
}

/** Node voltage of the float state: v_cr + v_m. */
export function floatVoltage(c: Circuit, x: ArrayLike<number>, rect: RectMode): number {
  const vm = rect === 'P' ? c.vc : rect === 'N' ? -c.vc : 0;
  return x[2] + (rect === 'O' ? 0 : vm + c.rd * (x[0] - x[1]));
}

/**
 * Rate of i_r with i_r = 0 and the bridge pinned at rail voltage v (no node capacitance):
 * decides whether that rail's body diode can take the current when it leaves zero.
 */
export function pinnedSlope(c: Circuit, x: ArrayLike<number>, rect: RectMode, v: number): number {
  return (v - floatVoltage(c, x, rect)) / (rect === 'O' ? 1 + c.lm : 1);
}
