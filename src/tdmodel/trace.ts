import { HalfPeriod, type Bridge } from './halfperiod.js';
import { normalize, type Circuit } from './model.js';
import { toNormalized } from './held.js';
import { evalState } from './taylor.js';
import type { HeldOutputResult, RectMode, TdParams } from './types.js';

/**
 * Where the bridge current flows at a sample: 'low' / 'high' the low- or high-side group
 * (switch or body diode) carries the tank current; 'free' the node capacitances share it
 * (each switch of the leg half of it); 'float' no current.
 */
export type BridgePath = 'low' | 'high' | 'free' | 'float';

/**
 * One switching period [0, T] of the periodic steady state, sampled from the exact solution. SI
 * units, signs as in the module conventions (t = 0 the low-side turn-off). Samples are ordered
 * by time; a time appears twice where a quantity jumps (a gate edge, a hard-switched node).
 */
export interface PeriodTrace {
  t: Float64Array;
  /** Tank current, A. */
  ir: Float64Array;
  /** Magnetizing current referred to the primary, A. */
  im: Float64Array;
  /** Cr voltage, bridge side minus transformer side, V. */
  vcr: Float64Array;
  /** Bridge voltage (HB node; FB v_A - v_B), V. */
  vb: Float64Array;
  /** Lm voltage referred to the primary, V (the secondary winding voltage is vm / n). */
  vm: Float64Array;
  /** 1 where the high-side group's gate is on, 0 elsewhere. */
  highGate: Uint8Array;
  /** 1 where the low-side group's gate is on. */
  lowGate: Uint8Array;
  path: BridgePath[];
}

interface Sample { t: number; x: [number, number, number, number]; vm: number; on: boolean; path: BridgePath }

const PATH: Record<Bridge, BridgePath> = { clampL: 'low', clampH: 'high', on: 'high', free: 'free', float: 'float' };

/**
 * Samples the periodic solution of `state` (a result of solveHeldOutput / solveSteadyState for
 * the same parameters) over one period: every integration step's ends plus a uniform grid of
 * at least `pointsPerHalf` points per half period (and 40 per radian of the resonance, so that
 * the ringing far below fr is resolved); the second half from half-wave symmetry. Pure.
 */
export function tracePeriod(p: TdParams, state: HeldOutputResult, pointsPerHalf = 400): PeriodTrace {
  const c = normalize(p, state.vo);
  const hp = new HalfPeriod(c);
  const dt = c.half / Math.max(pointsPerHalf, Math.ceil(40 * c.half));
  const half: Sample[] = [];
  const x = new Float64Array(4);
  const push = (t: number, rect: RectMode, bridge: Bridge) => {
    // a step's start is computed apart from the previous step's end and may fall one rounding
    // error before it: time must never run backwards for the measurement
    const last = half[half.length - 1];
    if (last && t < last.t) t = last.t;
    half.push({ t, x: [x[0], x[1], x[2], x[3]], vm: lmVoltage(c, x, rect, bridge), on: bridge === 'on', path: PATH[bridge] });
  };
  hp.onStep = (poly, t, tau, rect, bridge) => {
    evalState(poly, 0, x);
    const prev = half[half.length - 1];
    // A gate edge with the state unchanged: one sample before the edge with the gate already on,
    // so that a crossing found between the two reads the pre-edge voltage (hard switching).
    if (prev && bridge === 'on' && !prev.on) half.push({ ...prev, x: [...prev.x], on: true });
    push(t, rect, bridge);
    for (let g = Math.floor(t / dt) + 1; g * dt < t + tau; g++) {
      evalState(poly, g * dt - t, x);
      push(g * dt, rect, bridge);
    }
    evalState(poly, tau, x);
    push(t + tau, rect, bridge);
  };
  hp.run(toNormalized(c, state.seed));
  hp.onStep = null;
  return assemble(c, half);
}

/** Lm voltage of a sample, normalized: the clamp (plus the diode resistance) in P/N, else the loop share. */
function lmVoltage(c: Circuit, x: Float64Array, rect: RectMode, bridge: Bridge): number {
  const isec = x[0] - x[1];
  if (rect === 'P') return c.vc + c.rd * isec;
  if (rect === 'N') return -c.vc + c.rd * isec;
  if (bridge === 'float') return 0;
  const rs = bridge === 'free' ? 0 : c.rs;
  return c.k * (x[3] - rs * x[0] - x[2]);
}

/** Both halves in SI: the second is the first shifted by T/2 with currents and AC voltages negated. */
function assemble(c: Circuit, half: Sample[]): PeriodTrace {
  const n = half.length;
  const out: PeriodTrace = {
    t: new Float64Array(2 * n), ir: new Float64Array(2 * n), im: new Float64Array(2 * n), vcr: new Float64Array(2 * n),
    vb: new Float64Array(2 * n), vm: new Float64Array(2 * n), highGate: new Uint8Array(2 * n), lowGate: new Uint8Array(2 * n),
    path: new Array<BridgePath>(2 * n),
  };
  const { v, i, t: ts } = c.base;
  const mirrorPath: Record<BridgePath, BridgePath> = { low: 'high', high: 'low', free: 'free', float: 'float' };
  for (let k = 0; k < n; k++) {
    const s = half[k];
    for (const [j, sign] of [[k, 1], [k + n, -1]] as const) {
      out.t[j] = (s.t + (sign < 0 ? c.half : 0)) * ts;
      out.ir[j] = sign * s.x[0] * i;
      out.im[j] = sign * s.x[1] * i;
      out.vcr[j] = (c.vdc + sign * (s.x[2] - c.vdc)) * v;
      // HB: node 0..Vin mirrors to Vin - node; FB: v_A - v_B changes sign.
      out.vb[j] = (sign > 0 ? s.x[3] : c.vl + c.vh - s.x[3]) * v;
      out.vm[j] = sign * s.vm * v;
      out.highGate[j] = sign > 0 && s.on ? 1 : 0;
      out.lowGate[j] = sign < 0 && s.on ? 1 : 0;
      out.path[j] = sign > 0 ? s.path : mirrorPath[s.path];
    }
  }
  return out;
}
