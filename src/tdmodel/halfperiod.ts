import { decideRect, setCircuitClamp, type BridgeKind, type Circuit } from './model.js';
import { evalState, expand, newPoly, project, scalarIntegral, type Poly } from './taylor.js';
import { firstCrossing } from './crossing.js';
import { accumulate, type HalfStats } from './stats.js';
import type { RectMode } from './types.js';

/** Bridge state in the first half period: dead-time clamps, free swing, or high side on. */
export type Bridge = 'clampL' | 'clampH' | 'free' | 'on';

type GuardId = 'secP' | 'secN' | 'oUp' | 'oLow' | 'nodeHigh' | 'nodeLow' | 'exitH' | 'exitL';
interface Guard { w: number[]; e: number; id: GuardId }

const W_SEC = [1, -1, 0, 0];
const MAX_EVENTS = 400;
const MAX_STEPS = 200_000;
const RECT_GUARDS = new Set<GuardId>(['secP', 'secN', 'oUp', 'oLow']);

/**
 * Integrates the normalized circuit over the half period [0, T/2) that starts at the low-side
 * turn-off, from z = (i_r, i_m, v_cr - V_dc) at t = 0 (bridge on the low rail), with exact
 * event location at every rectifier and bridge transition.
 */
export class HalfPeriod {
  private readonly poly: Poly = newPoly();
  private readonly g = new Float64Array(80);
  private readonly x = new Float64Array(4);
  private readonly guards = new Map<string, Guard[]>();

  constructor(readonly c: Circuit) {}

  /** Integral of |i_sec| over the last run (normalized), for the output current. */
  absSec = 0;

  /** Changes the output clamp n (Vo + V_drop) / Vin of the circuit. */
  setClamp(vc: number): void {
    setCircuitClamp(this.c, vc);
    this.guards.clear();
  }

  /** End state (i_r, i_m, v_cr - V_dc) at T/2; fills stats when given. */
  run(z: ArrayLike<number>, stats: HalfStats | null = null): [number, number, number] {
    const { c, x, poly } = this;
    x[0] = z[0]; x[1] = z[1]; x[2] = z[2] + c.vdc; x[3] = c.vl;
    let t = 0;
    let bridge: Bridge = 'clampL';
    if (c.td > 0 && x[0] < 0) {
      bridge = c.ce > 0 ? 'free' : 'clampH';
      if (bridge === 'clampH') { x[3] = c.vh; if (stats) stats.zvsTime = 0; }
    }
    let rect = decideRect(c, x, kind(bridge));
    let events = 0;
    let steps = 0;
    let zeroRun = 0; // rectifier events in a row without progress: a tangency (grazing) point
    this.absSec = 0;
    for (;;) {
      const tEnd = bridge === 'on' ? c.half : c.td;
      if (t >= tEnd) {
        if (bridge === 'on') break;
        if (stats) { stats.vAtGate = x[3]; stats.irAtGate = x[0]; stats.hardDv = c.vh - x[3]; }
        x[3] = c.vh;
        bridge = 'on';
        rect = redecide(c, x, bridge, rect);
        continue;
      }
      const sys = c.modes.get(kind(bridge) + rect)!;
      const h = Math.min(1 / sys.rho, tEnd - t);
      if (++steps > MAX_STEPS) throw new Error('tdmodel: step limit exceeded in one half period');
      expand(sys.a, sys.b, x, h, poly);
      let tau = h;
      let hit: GuardId | null = null;
      for (const gd of this.guardList(bridge, rect)) {
        project(poly, gd.w, gd.e, this.g);
        const r = firstCrossing(this.g, poly.order, tau, zeroRun >= 2);
        if (r !== null && r < tau) { tau = r; hit = gd.id; }
      }
      if (stats) accumulate(stats, poly, tau, t, rect, bridge, this.g, this.openVm(bridge));
      else if (rect !== 'O') {
        project(poly, W_SEC, 0, this.g);
        const q = scalarIntegral(this.g, poly.order, tau);
        this.absSec += rect === 'P' ? q : -q;
      }
      evalState(poly, tau, x);
      t = hit === null && tau === h && h === tEnd - t ? tEnd : t + tau;
      if (hit === null) {
        zeroRun = 0;
        continue;
      }
      if (++events > MAX_EVENTS) throw new Error('tdmodel: too many events in one half period');
      zeroRun = tau === 0 && RECT_GUARDS.has(hit) ? zeroRun + 1 : 0;
      if (zeroRun >= 2) {
        // P and O each exit at once: the Lm voltage only touches the clamp. Stay off (O).
        rect = decideRect(c, x, kind(bridge), Infinity, true);
        continue;
      }
      switch (hit) {
        case 'secP': case 'secN': rect = decideRect(c, x, kind(bridge), Infinity); break;
        case 'oUp': rect = 'P'; break;
        case 'oLow': rect = 'N'; break;
        case 'nodeHigh': bridge = 'clampH'; x[3] = c.vh; if (stats && stats.zvsTime === null) stats.zvsTime = t; break;
        case 'nodeLow': bridge = 'clampL'; x[3] = c.vl; break;
        case 'exitH': bridge = c.ce > 0 ? 'free' : 'clampL'; if (c.ce === 0) x[3] = c.vl; break;
        case 'exitL':
          bridge = c.ce > 0 ? 'free' : 'clampH';
          if (c.ce === 0) { x[3] = c.vh; if (stats && stats.zvsTime === null) stats.zvsTime = t; }
          break;
      }
      if (hit.startsWith('node') || hit.startsWith('exit')) rect = redecide(c, x, bridge, rect);
    }
    if (stats) this.absSec = stats.absSec;
    return [x[0], x[1], x[2] - c.vdc];
  }

  /** Functional w with w . x = Lm voltage of an O interval, k (v_b - R i_r - v_cr). */
  private openVm(bridge: Bridge): number[] {
    const { k } = this.c;
    return [-k * (bridge === 'free' ? 0 : this.c.rs), 0, -k, k];
  }

  private guardList(bridge: Bridge, rect: RectMode): Guard[] {
    const key = bridge + rect;
    let list = this.guards.get(key);
    if (list) return list;
    const { k, vc } = this.c;
    const rs = bridge === 'free' ? 0 : this.c.rs;
    list = [];
    if (rect === 'P') list.push({ w: [1, -1, 0, 0], e: 0, id: 'secP' });
    if (rect === 'N') list.push({ w: [-1, 1, 0, 0], e: 0, id: 'secN' });
    if (rect === 'O') {
      list.push({ w: [k * rs, 0, k, -k], e: vc, id: 'oUp' });
      list.push({ w: [-k * rs, 0, -k, k], e: vc, id: 'oLow' });
    }
    if (bridge === 'free') {
      list.push({ w: [0, 0, 0, -1], e: this.c.vh, id: 'nodeHigh' });
      list.push({ w: [0, 0, 0, 1], e: -this.c.vl, id: 'nodeLow' });
    }
    if (bridge === 'clampH') list.push({ w: [-1, 0, 0, 0], e: 0, id: 'exitH' });
    if (bridge === 'clampL') list.push({ w: [1, 0, 0, 0], e: 0, id: 'exitL' });
    this.guards.set(key, list);
    return list;
  }
}

function kind(b: Bridge): BridgeKind {
  return b === 'free' ? 'free' : 'pin';
}

/** After a bridge change only O can become invalid (its Lm voltage depends on the bridge). */
function redecide(c: Circuit, x: Float64Array, bridge: Bridge, rect: RectMode): RectMode {
  return rect === 'O' ? decideRect(c, x, kind(bridge), Infinity) : rect;
}
