import { project, scalarIntegral, scalarRange, scalarSquareIntegral, type Poly } from './taylor.js';
import type { RectMode } from './types.js';
import type { Bridge } from './guards.js';

/** Integrals and extremes over one half period [0, T/2), normalized units. */
export interface HalfStats {
  /** Integral of |i_sec| (P: +i_sec, N: -i_sec). */
  absSec: number;
  sec2: number;
  ir2: number;
  /** Integral of i_r^2 while a switch or body diode conducts (bridge pinned to a rail). */
  pinIr2: number;
  /** Integral of i_r while pinned to the high rail, and to the low rail. */
  qH: number;
  qL: number;
  irMin: number; irMax: number;
  imMin: number; imMax: number;
  vcrMin: number; vcrMax: number;
  secMin: number; secMax: number;
  /** Extremes of the Lm voltage during O intervals (the peak a no-load output charges to). */
  vmMin: number; vmMax: number;
  /** Bridge voltage and tank current at the high-side gate edge; jump forced there. */
  vAtGate: number;
  irAtGate: number;
  hardDv: number;
  /** The node was on the high rail (body diode conducting) at the gate edge. */
  railAtGate: boolean;
  /** First time the node reached the high rail in the dead time, or null. */
  zvsTime: number | null;
  segments: { mode: RectMode; start: number; end: number }[];
}

export function newStats(): HalfStats {
  return {
    absSec: 0, sec2: 0, ir2: 0, pinIr2: 0, qH: 0, qL: 0,
    irMin: Infinity, irMax: -Infinity, imMin: Infinity, imMax: -Infinity,
    vcrMin: Infinity, vcrMax: -Infinity, secMin: Infinity, secMax: -Infinity, vmMin: Infinity, vmMax: -Infinity,
    vAtGate: NaN, irAtGate: NaN, hardDv: 0, railAtGate: false, zvsTime: null, segments: [],
  };
}

const W_IR = [1, 0, 0, 0];
const W_IM = [0, 1, 0, 0];
const W_VCR = [0, 0, 1, 0];
const W_SEC = [1, -1, 0, 0];

/**
 * Adds the step [t, t + tau] of polynomial p (state as in HalfPeriod) to s; g is scratch;
 * wOpen the functional of the O-interval Lm voltage for the present bridge state.
 */
export function accumulate(
  s: HalfStats, p: Poly, tau: number, t: number, rect: RectMode, bridge: Bridge, g: Float64Array, wOpen: number[],
): void {
  const k = p.order;
  project(p, W_IR, 0, g);
  const ir2 = scalarSquareIntegral(g, k, tau);
  s.ir2 += ir2;
  if (bridge !== 'free' && bridge !== 'float') {
    s.pinIr2 += ir2;
    if (bridge === 'clampL') s.qL += scalarIntegral(g, k, tau);
    else s.qH += scalarIntegral(g, k, tau);
  }
  let [lo, hi] = scalarRange(g, k, tau);
  s.irMin = Math.min(s.irMin, lo); s.irMax = Math.max(s.irMax, hi);
  project(p, W_IM, 0, g);
  [lo, hi] = scalarRange(g, k, tau);
  s.imMin = Math.min(s.imMin, lo); s.imMax = Math.max(s.imMax, hi);
  project(p, W_VCR, 0, g);
  [lo, hi] = scalarRange(g, k, tau);
  s.vcrMin = Math.min(s.vcrMin, lo); s.vcrMax = Math.max(s.vcrMax, hi);
  if (rect === 'O') {
    project(p, wOpen, 0, g);
    [lo, hi] = scalarRange(g, k, tau);
    s.vmMin = Math.min(s.vmMin, lo); s.vmMax = Math.max(s.vmMax, hi);
  } else {
    project(p, W_SEC, 0, g);
    const q = scalarIntegral(g, k, tau);
    s.absSec += rect === 'P' ? q : -q;
    s.sec2 += scalarSquareIntegral(g, k, tau);
    [lo, hi] = scalarRange(g, k, tau);
    s.secMin = Math.min(s.secMin, lo); s.secMax = Math.max(s.secMax, hi);
  }
  const last = s.segments[s.segments.length - 1];
  if (last && last.mode === rect && Math.abs(last.end - t) < 1e-12 * (1 + t)) last.end = t + tau;
  else if (tau > 0) s.segments.push({ mode: rect, start: t, end: t + tau });
}
