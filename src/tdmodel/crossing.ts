import { scalarAt, scalarRoot, scalarSlope } from './taylor.js';

/** Guard values below -TOL_G (normalized units) count as a crossing. */
const TOL_G = 1e-13;
/** Largest violation accepted while leaving a tangency point (see firstCrossing, lenient). */
const TOL_GRAZE = 1e-9;

/**
 * First time in (0, h] where the guard polynomial goes below zero, or null. The step is cut
 * into four pieces (< 0.25 rad of the fastest natural frequency each, so at most one extremum
 * per piece); a piece is entered if its end is negative or its interior minimum is.
 * lenient: the guard starts at a tangency (g ~ 0, both neighbouring modes exit at once); a
 * violation up to TOL_GRAZE is accepted until g turns positive.
 */
export function firstCrossing(g: Float64Array, order: number, h: number, lenient = false): number | null {
  const n = 4;
  let a = 0;
  let va = g[0];
  if (lenient && va <= 0) return grazeExit(g, order, h);
  let da = scalarSlope(g, order, 0);
  for (let s = 1; s <= n; s++) {
    const b = (h * s) / n;
    const vb = scalarAt(g, order, b);
    const db = scalarSlope(g, order, b);
    let end = vb < -TOL_G ? b : -1;
    if (end < 0 && da < 0 && db > 0) {
      const tm = slopeRoot(g, order, a, b);
      if (scalarAt(g, order, tm) < -TOL_G) end = tm;
    }
    if (end >= 0) {
      if (va > 0) return scalarRoot(g, order, a, end);
      // Starting on the boundary (g ~ 0) but rising first (slope or curvature): the crossing
      // follows the maximum.
      if (s === 1) {
        let tm = 0;
        let vm = va;
        for (let k = 1; k < 8; k++) {
          const tk = (end * k) / 8;
          const vk = scalarAt(g, order, tk);
          if (vk > vm) { tm = tk; vm = vk; }
        }
        if (vm > 0) return scalarRoot(g, order, tm, end);
      }
      return a;
    }
    a = b;
    va = vb;
    da = db;
  }
  return null;
}

/** Minimum of g in (lo, hi) where the slope goes from negative to positive. */
function slopeRoot(g: Float64Array, order: number, lo: number, hi: number): number {
  for (let it = 0; it < 100 && hi - lo > 1e-15 * (1 + hi); it++) {
    const m = 0.5 * (lo + hi);
    if (scalarSlope(g, order, m) < 0) lo = m;
    else hi = m;
  }
  return 0.5 * (lo + hi);
}

function grazeExit(g: Float64Array, order: number, h: number): number | null {
  const n = 16;
  for (let s = 1; s <= n; s++) {
    const b = (h * s) / n;
    const v = scalarAt(g, order, b);
    if (v < -TOL_GRAZE) return 0;
    if (v > 0) {
      const r = firstCrossing(shift(g, order, b), order, h - b);
      return r === null ? null : b + r;
    }
  }
  return null;
}

/** Coefficients of g(tau + b) (Taylor shift by repeated synthetic division). */
function shift(g: Float64Array, order: number, b: number): Float64Array {
  const out = g.slice(0, order + 1);
  for (let i = 0; i < order; i++) for (let k = order - 1; k >= i; k--) out[k] += b * out[k + 1];
  return out;
}
