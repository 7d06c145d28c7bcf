/**
 * Window arithmetic on a simulator time grid. Samples are taken as a piecewise-linear (PWL) signal,
 * the way ngspice's own `.meas` interpolates, so every result below is exact for PWL data on any
 * (non-uniform) grid: integrals by the trapezoid rule, squares by the exact integral of a linear
 * segment squared, extremes over the samples plus the two interpolated end points. Nothing copies
 * the input arrays except `sliceWindow`.
 */

/** A time on the grid: segment [i, i + 1] and the fraction f in [0, 1] of the way along it. */
export interface GridPoint {
  t: number;
  i: number;
  f: number;
}

/** A time interval [start.t, end.t] on a grid. */
export interface Span {
  t: Float64Array;
  start: GridPoint;
  end: GridPoint;
}

/** Time-weighted statistics of one signal over a span. Units of the signal (rms, avg) or signal (min, max). */
export interface SpanStats {
  avg: number;
  rms: number;
  min: number;
  max: number;
}

/**
 * Locates `time` on a non-decreasing grid by bisection: the largest i <= n - 2 with t[i] <= time.
 * Times outside the grid are clamped to its ends (f = 0 or 1); callers check ranges first.
 */
export function locate(t: Float64Array, time: number): GridPoint {
  const last = t.length - 1;
  if (time <= t[0]) return { t: t[0], i: 0, f: 0 };
  if (time >= t[last]) return { t: t[last], i: last - 1, f: 1 };
  let lo = 0;
  let hi = last;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (t[mid] <= time) lo = mid;
    else hi = mid;
  }
  const dt = t[lo + 1] - t[lo];
  return { t: time, i: lo, f: dt > 0 ? (time - t[lo]) / dt : 0 };
}

/** Linear interpolation of y at a located grid point. */
export function valueAt(y: Float64Array, p: GridPoint): number {
  const a = y[p.i];
  return p.f === 0 ? a : a + p.f * (y[p.i + 1] - a);
}

/** Span [t0, t1] on grid t; throws when the interval is empty or reaches outside the data. */
export function makeSpan(t: Float64Array, t0: number, t1: number): Span {
  if (t.length < 2) throw new Error(`measure: need at least 2 time points, got ${t.length}`);
  if (!(t1 > t0)) throw new Error(`measure: empty window [${t0}, ${t1}] s`);
  // ngspice writes a run's first point a tiny step after tstart (and after 0 with UIC): accept a
  // gap of up to 1e-4 of the window at either end and clamp to the data.
  const slack = 1e-4 * (t1 - t0);
  const first = t[0];
  const last = t[t.length - 1];
  if (t0 < first - slack || t1 > last + slack) {
    throw new Error(`measure: window [${t0}, ${t1}] s reaches outside the data [${first}, ${last}] s`);
  }
  return { t, start: locate(t, Math.max(t0, first)), end: locate(t, Math.min(t1, last)) };
}

/** Copy of the samples of y inside the span, with interpolated end points at exactly t0 and t1. */
export function sliceWindow(span: Span, y: Float64Array): { t: Float64Array; y: Float64Array } {
  const { t, start, end } = span;
  const inner = end.i - start.i;
  const ts = new Float64Array(inner + 2);
  const ys = new Float64Array(inner + 2);
  ts[0] = start.t;
  ys[0] = valueAt(y, start);
  for (let k = 1; k <= inner; k++) {
    ts[k] = t[start.i + k];
    ys[k] = y[start.i + k];
  }
  ts[inner + 1] = end.t;
  ys[inner + 1] = valueAt(y, end);
  return { t: ts, y: ys };
}

/**
 * Average, RMS, minimum and maximum of the PWL signal y over the span, in one pass.
 * avg = (1/T) integral y dt; rms = sqrt((1/T) integral y^2 dt) with the exact per-segment
 * integral (dt/3)(a^2 + a b + b^2) of a linear segment from a to b.
 */
export function spanStats(span: Span, y: Float64Array): SpanStats {
  const { t, start, end } = span;
  let ta = start.t;
  let a = valueAt(y, start);
  let s1 = 0;
  let s2 = 0;
  let min = a;
  let max = a;
  for (let j = start.i + 1; j <= end.i; j++) {
    const tb = t[j];
    const b = y[j];
    const dt = tb - ta;
    s1 += dt * (a + b);
    s2 += dt * (a * a + a * b + b * b);
    if (b < min) min = b;
    else if (b > max) max = b;
    ta = tb;
    a = b;
  }
  const b = valueAt(y, end);
  const dt = end.t - ta;
  s1 += dt * (a + b);
  s2 += dt * (a * a + a * b + b * b);
  const T = end.t - start.t;
  return { avg: s1 / (2 * T), rms: Math.sqrt(s2 / (3 * T)), min: Math.min(min, b), max: Math.max(max, b) };
}

/** Time-weighted average of y over the span (trapezoid rule, exact for PWL data). */
export function spanAverage(span: Span, y: Float64Array): number {
  return spanStats(span, y).avg;
}

/** RMS of y over the span (exact for PWL data). */
export function spanRms(span: Span, y: Float64Array): number {
  return spanStats(span, y).rms;
}

/** Peak magnitude max |y| over the span. */
export function spanPeak(span: Span, y: Float64Array): number {
  const s = spanStats(span, y);
  return Math.max(Math.abs(s.min), Math.abs(s.max));
}
