/**
 * Exact stepping of a linear system x' = A x + b (4 states) by its Taylor series:
 * x(tau) = sum_k c_k tau^k with c_0 = x0, c_1 = A x0 + b, c_k = A c_(k-1) / k. With
 * rho h <= 1 the series is summed until the terms fall below 1e-18 of the state, so a step is
 * the closed-form solution to rounding error, and the polynomial gives dense output for event
 * location, extrema and integrals.
 */
export const KMAX = 64;

/** Taylor coefficients of one step: c[4k + j] is coefficient k of state j; order = highest k. */
export interface Poly {
  c: Float64Array;
  order: number;
}

export function newPoly(): Poly {
  return { c: new Float64Array(4 * (KMAX + 1)), order: 0 };
}

/** Fills p with the series of x' = A x + b from x0, truncated for steps up to h. */
export function expand(a: Float64Array, b: Float64Array, x0: ArrayLike<number>, h: number, p: Poly): void {
  const c = p.c;
  let scale = 1;
  for (let j = 0; j < 4; j++) {
    c[j] = x0[j];
    scale = Math.max(scale, Math.abs(x0[j]));
  }
  const tol = 1e-18 * scale;
  let hk = 1;
  let k = 1;
  for (; k <= KMAX; k++) {
    const o = 4 * k;
    const q = 4 * (k - 1);
    let big = 0;
    for (let i = 0; i < 4; i++) {
      const r = 4 * i;
      let s = a[r] * c[q] + a[r + 1] * c[q + 1] + a[r + 2] * c[q + 2] + a[r + 3] * c[q + 3];
      if (k === 1) s += b[i];
      else s /= k;
      c[o + i] = s;
      big = Math.max(big, Math.abs(s));
    }
    hk *= h;
    if (big * hk < tol && k >= 2) break;
  }
  p.order = Math.min(k, KMAX);
}

/** State at tau into out. */
export function evalState(p: Poly, tau: number, out: Float64Array): void {
  const c = p.c;
  for (let j = 0; j < 4; j++) {
    let s = c[4 * p.order + j];
    for (let k = p.order - 1; k >= 0; k--) s = s * tau + c[4 * k + j];
    out[j] = s;
  }
}

/** Coefficients of the scalar w . x(tau) + e into g (length >= order + 1). */
export function project(p: Poly, w: ArrayLike<number>, e: number, g: Float64Array): void {
  const c = p.c;
  for (let k = 0; k <= p.order; k++) {
    const o = 4 * k;
    g[k] = w[0] * c[o] + w[1] * c[o + 1] + w[2] * c[o + 2] + w[3] * c[o + 3];
  }
  g[0] += e;
}

/** Value of the scalar polynomial g of the given order at tau (Horner). */
export function scalarAt(g: Float64Array, order: number, tau: number): number {
  let s = g[order];
  for (let k = order - 1; k >= 0; k--) s = s * tau + g[k];
  return s;
}

/** Derivative of the scalar polynomial g at tau. */
export function scalarSlope(g: Float64Array, order: number, tau: number): number {
  let s = order * g[order];
  for (let k = order - 1; k >= 1; k--) s = s * tau + k * g[k];
  return s;
}

/** Exact integral of the scalar polynomial g over [0, tau]. */
export function scalarIntegral(g: Float64Array, order: number, tau: number): number {
  let s = g[order] / (order + 1);
  for (let k = order - 1; k >= 0; k--) s = s * tau + g[k] / (k + 1);
  return s * tau;
}

/**
 * Root of g in (lo, hi) where g(lo) > 0 >= g(hi): Newton steps kept inside the bracket,
 * bisection otherwise, to a bracket of 1e-15 (relative to hi) or exact zero.
 */
export function scalarRoot(g: Float64Array, order: number, lo: number, hi: number): number {
  let x = 0.5 * (lo + hi);
  for (let it = 0; it < 200 && hi - lo > 1e-15 * (1 + hi); it++) {
    const v = scalarAt(g, order, x);
    if (v > 0) lo = x;
    else hi = x;
    if (v === 0) return x;
    const d = scalarSlope(g, order, x);
    let nx = d !== 0 ? x - v / d : NaN;
    if (!(nx > lo && nx < hi)) nx = 0.5 * (lo + hi);
    x = nx;
  }
  return hi;
}

/** Extreme values of the scalar polynomial g over [0, h]: endpoints and interior stationary points. */
export function scalarRange(g: Float64Array, order: number, h: number, samples = 8): [number, number] {
  let min = Math.min(g[0], scalarAt(g, order, h));
  let max = Math.max(g[0], scalarAt(g, order, h));
  let t0 = 0;
  let d0 = scalarSlope(g, order, 0);
  for (let s = 1; s <= samples; s++) {
    const t1 = (h * s) / samples;
    const d1 = scalarSlope(g, order, t1);
    if ((d0 > 0 && d1 <= 0) || (d0 < 0 && d1 >= 0)) {
      let lo = t0;
      let hi = t1;
      for (let it = 0; it < 60 && hi - lo > 1e-14 * (1 + hi); it++) {
        const m = 0.5 * (lo + hi);
        if (scalarSlope(g, order, m) > 0 === d0 > 0) lo = m;
        else hi = m;
      }
      const v = scalarAt(g, order, 0.5 * (lo + hi));
      min = Math.min(min, v);
      max = Math.max(max, v);
    }
    t0 = t1;
    d0 = d1;
  }
  return [min, max];
}

/** Gauss-Legendre 8-point nodes and weights on [0, 1]. */
const GL_X = [0.0198550717512319, 0.1016667612931866, 0.2372337950418355, 0.4082826787521751,
  0.5917173212478249, 0.7627662049581645, 0.8983332387068134, 0.9801449282487681];
const GL_W = [0.0506142681451881, 0.1111905172266872, 0.1568533229389436, 0.1813418916891810,
  0.1813418916891810, 0.1568533229389436, 0.1111905172266872, 0.0506142681451881];

/** Integral of g(tau)^2 over [0, h] (8-point Gauss-Legendre; g varies by < 1 rad per step). */
export function scalarSquareIntegral(g: Float64Array, order: number, h: number): number {
  let s = 0;
  for (let i = 0; i < 8; i++) {
    const v = scalarAt(g, order, GL_X[i] * h);
    s += GL_W[i] * v * v;
  }
  return s * h;
}
