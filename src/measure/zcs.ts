import type { Waveforms } from './types.js';
import { findGateEdges, type GateEdges } from './edges.js';
import { locate, valueAt, type Span } from './window.js';

/** One diode conduction interval that ends inside the window. */
export interface ConductionInterval {
  /** Index into Waveforms.diodes. */
  diode: number;
  /** Times the current rose above / fell below the conduction level, s. */
  start: number;
  end: number;
  /** Largest current of the interval, A. */
  peak: number;
  /** 'P' when secondaryCurrentReferred > 0 at the peak (Lm clamped to +n V_rect), else 'N'. */
  polarity: 'P' | 'N';
  /** Time of the primary edge that ends this polarity (see zcsIntervals), s; NaN when none exists. */
  edge: number;
  /** max(0, i_D at that edge) / peak. */
  ratio: number;
}

/**
 * Rectifier commutation per conduction interval (docs/method.md#zcs, #zvs). An interval is a run of
 * i_D > level (A; measure() uses conductionThreshold * the largest diode current in the window;
 * level <= 0 means no conduction and returns no intervals); intervals
 * whose end lies in (start.t, end.t] are kept (whole-cycle windows give one per diode per cycle),
 * scanned from one period before the window so each is seen whole. `gates` should cover one period
 * either side of the window (measure() passes its shared set); by default they are found so.
 *
 * The edge that can cut a P interval is a gate falling edge of the high-side switch (bridge voltage
 * starts to swing from + to -); for an N interval, one of the low-side switch. Of those, the one
 * nearest the interval end is taken. Below resonance the current has died before that edge
 * (ratio ~ 0); above resonance the edge cuts it (ratio > 0). Choosing the edge by polarity keeps
 * a diode that merely conducts across an edge of the other polarity (PON modes) from reading as cut.
 */
export function zcsIntervals(w: Waveforms, span: Span, level: number, gates?: GateEdges): ConductionInterval[] {
  if (!(level > 0)) return [];
  const period = 1 / w.fs;
  const from = Math.max(w.t[0], span.start.t - period);
  const to = Math.min(w.t[w.t.length - 1], span.end.t + period);
  const jEnd = Math.min(locate(w.t, to).i, w.t.length - 2);
  const g = gates ?? findGateEdges(w, from, to);
  const cutP = g.fall[0].map((e) => e.t);
  const cutN = g.fall[1].map((e) => e.t);
  const out: ConductionInterval[] = [];
  w.diodes.forEach((d, k) => {
    const i = d.current;
    const t = w.t;
    let j = locate(t, from).i;
    while (j <= jEnd && i[j] > level) j++; // skip an interval already running at the scan start
    let start = NaN;
    let peak = 0;
    let tPeak = 0;
    for (; j <= jEnd; j++) {
      const a = i[j];
      const b = i[j + 1];
      if (a <= level && b > level) {
        start = t[j] + ((level - a) / (b - a)) * (t[j + 1] - t[j]);
        peak = b;
        tPeak = t[j + 1];
      } else if (a > level && b > level && b > peak) {
        peak = b;
        tPeak = t[j + 1];
      } else if (a > level && b <= level && !Number.isNaN(start)) {
        const end = t[j] + ((a - level) / (a - b)) * (t[j + 1] - t[j]);
        if (end > span.end.t) break;
        if (end > span.start.t) {
          const polarity = valueAt(w.secondaryCurrentReferred, locate(t, tPeak)) > 0 ? 'P' : 'N';
          const edge = nearest(polarity === 'P' ? cutP : cutN, end);
          const ratio = Number.isNaN(edge) ? 0 : Math.max(0, valueAt(i, locate(t, edge))) / peak;
          out.push({ diode: k, start, end, peak, polarity, edge, ratio });
        }
        start = NaN;
      }
    }
  });
  return out;
}

/** Element of the ascending list closest to x (bisection); NaN for an empty list. */
function nearest(list: number[], x: number): number {
  if (list.length === 0) return NaN;
  let lo = 0;
  let hi = list.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (list[mid] <= x) lo = mid;
    else hi = mid;
  }
  return Math.abs(list[lo] - x) <= Math.abs(list[hi] - x) ? list[lo] : list[hi];
}

/** zcs = every interval ratio <= threshold (true with no conduction); zcsRatio = the largest ratio (0 if none). */
export function summarizeZcs(intervals: ConductionInterval[], threshold: number) {
  const worst = intervals.reduce((m, c) => Math.max(m, c.ratio), 0);
  return { zcs: worst <= threshold, zcsRatio: worst };
}
