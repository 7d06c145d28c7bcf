import { decideRect, setCircuitClamp, type BridgeKind, type Circuit } from './model.js';
import { evalState, expand, newPoly, project, scalarIntegral, type Poly } from './taylor.js';
import { firstCrossing } from './crossing.js';
import { accumulate, type HalfStats } from './stats.js';
import { floatVoltage, guardsFor, pinnedSlope, RECT_GUARDS, type Bridge, type Guard, type GuardId } from './guards.js';
import type { RectMode } from './types.js';

export type { Bridge };

/** Called once per integration step [t, t + tau] (normalized) with the step's exact polynomial. */
export type StepHook = (poly: Poly, t: number, tau: number, rect: RectMode, bridge: Bridge) => void;

const W_SEC = [1, -1, 0, 0];
const MAX_EVENTS = 400;
const MAX_STEPS = 200_000;

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
  /** Integral of |i_sec| over the last run (normalized), for the output current. */
  absSec = 0;
  /** Optional observer of every step (dense output for sampled waveforms); null = none. */
  onStep: StepHook | null = null;

  constructor(readonly c: Circuit) {}

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
        if (bridge === 'float') x[3] = floatVoltage(c, x, rect);
        if (stats) {
          Object.assign(stats, { vAtGate: x[3], irAtGate: x[0], railAtGate: bridge === 'clampH', hardDv: c.ce > 0 ? c.vh - x[3] : 0 });
        }
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
      for (const gd of this.guardList(bridge, rect) as Guard[]) {
        project(poly, gd.w, gd.e, this.g);
        const r = firstCrossing(this.g, poly.order, tau, zeroRun >= 2);
        if (r !== null && r < tau) { tau = r; hit = gd.id; }
      }
      if (this.onStep) this.onStep(poly, t, tau, rect, bridge);
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
        case 'exitH': case 'exitL': {
          const from: 'clampL' | 'clampH' = hit === 'exitH' ? 'clampH' : 'clampL';
          bridge = c.ce > 0 ? 'free' : this.leaveClamp(x, rect, from, stats, t);
          break;
        }
        case 'floatHigh': bridge = 'clampH'; x[3] = c.vh; if (stats && stats.zvsTime === null) stats.zvsTime = t; break;
        case 'floatLow': bridge = 'clampL'; x[3] = c.vl; break;
      }
      if (!RECT_GUARDS.has(hit)) rect = redecide(c, x, bridge, rect);
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
    if (!list) this.guards.set(key, (list = guardsFor(this.c, bridge, rect)));
    return list;
  }

  /**
   * Without node capacitance the tank current reached zero in a dead-time clamp: the other
   * rail takes it if the current then grows towards that rail, otherwise the current stays at
   * zero with the node floating between the rails.
   */
  private leaveClamp(x: Float64Array, rect: RectMode, from: 'clampL' | 'clampH', stats: HalfStats | null, t: number): Bridge {
    const { c } = this;
    const to = from === 'clampL' ? c.vh : c.vl;
    const s = pinnedSlope(c, x, rect, to);
    if (from === 'clampL' ? s < 0 : s > 0) {
      x[3] = to;
      if (from === 'clampL' && stats && stats.zvsTime === null) stats.zvsTime = t;
      return from === 'clampL' ? 'clampH' : 'clampL';
    }
    x[0] = 0;
    if (rect === 'O') x[1] = 0;
    x[3] = floatVoltage(c, x, rect);
    return 'float';
  }
}

function kind(b: Bridge): BridgeKind {
  return b === 'free' || b === 'float' ? b : 'pin';
}

/** After a bridge change only O can become invalid (its Lm voltage depends on the bridge). */
function redecide(c: Circuit, x: Float64Array, bridge: Bridge, rect: RectMode): RectMode {
  return rect === 'O' ? decideRect(c, x, kind(bridge), Infinity) : rect;
}
