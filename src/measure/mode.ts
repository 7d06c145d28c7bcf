import type { Waveforms } from './types.js';
import { findGateEdges, within, type GateEdges } from './edges.js';
import { locate, valueAt, type Span } from './window.js';

type State = 'P' | 'N' | 'O';

/** Run-length list of rectifier states: state and duration, s. */
export interface StateRun {
  state: State;
  duration: number;
}

/**
 * Rectifier state runs of i_sec over [a, b]: P while i_sec > eps, N while i_sec < -eps, O otherwise
 * (docs/method.md#zvs). Boundaries are the interpolated crossings of +-eps, exact for PWL data.
 */
export function stateRuns(t: Float64Array, isec: Float64Array, a: number, b: number, eps: number): StateRun[] {
  const runs: StateRun[] = [];
  const cls = (y: number): State => (y > eps ? 'P' : y < -eps ? 'N' : 'O');
  const p = locate(t, a);
  const q = locate(t, b);
  let ta = a;
  let ya = valueAt(isec, p);
  let s = cls(ya);
  let since = a; // start of the current run
  for (let j = p.i + 1; j <= q.i + 1; j++) {
    const tb = j <= q.i ? t[j] : b;
    const yb = j <= q.i ? isec[j] : valueAt(isec, q);
    const sb = cls(yb);
    while (s !== sb) {
      // Linear piece: leave the current state through the nearer level, towards sb.
      const up = yb > ya;
      const level = up ? (s === 'N' ? -eps : eps) : s === 'P' ? eps : -eps;
      const tc = ta + ((level - ya) / (yb - ya)) * (tb - ta);
      runs.push({ state: s, duration: tc - since });
      since = tc;
      s = up ? (s === 'N' ? 'O' : 'P') : s === 'P' ? 'O' : 'N';
    }
    ta = tb;
    ya = yb;
  }
  runs.push({ state: s, duration: b - since });
  return runs;
}

/**
 * Label from state runs: runs shorter than minDuration are dropped as spurious, neighbours of
 * equal state merged, states concatenated ('PO', 'NP', ...). If every run is short, the longest one.
 */
export function labelRuns(runs: StateRun[], minDuration: number): string {
  const kept: State[] = [];
  for (const r of runs) {
    if (r.duration < minDuration || r.duration <= 0) continue;
    if (kept[kept.length - 1] !== r.state) kept.push(r.state);
  }
  if (kept.length > 0) return kept.join('');
  const longest = runs.reduce<StateRun | undefined>((m, r) => (m && m.duration >= r.duration ? m : r), undefined);
  return longest ? longest.state : 'O';
}

/**
 * Operating-mode label of the window: for each high-side (HB high / FB S1) turn-on in the window, the
 * P/N/O sequence of secondaryCurrentReferred over that switch's on-time (gate rise to gate fall).
 * The on-time is the half period minus the dead time; it leaves out the rectifier commutation inside
 * the dead time, which would otherwise add a spurious trailing segment. eps = modeThreshold * peak
 * |i_sec| in the window; runs shorter than modeMinSegment * half period are dropped. Returns the most
 * frequent label (ties: the one seen first). `gates` should reach one period past the window.
 */
export function modeOfWindow(
  w: Waveforms, span: Span, isecPeak: number, modeThreshold: number, modeMinSegment: number, gates?: GateEdges,
): string {
  const half = 0.5 / w.fs;
  const eps = modeThreshold * isecPeak;
  const to = Math.min(w.t[w.t.length - 1], span.end.t + 2 * half);
  const g = gates ?? findGateEdges(w, span.start.t, to);
  const falls = within(g.fall[0], span.start.t, to).map((e) => e.t);
  const counts = new Map<string, number>();
  let f = 0;
  for (const rise of within(g.rise[0], span.start.t, span.end.t)) {
    while (f < falls.length && falls[f] <= rise.t) f++;
    if (f >= falls.length || falls[f] - rise.t > 2 * half) continue; // on-time runs past the data
    const label = labelRuns(stateRuns(w.t, w.secondaryCurrentReferred, rise.t, falls[f], eps), modeMinSegment * half);
    counts.set(label, (counts.get(label) ?? 0) + 1);
  }
  let best = '';
  let bestCount = 0;
  for (const [label, c] of counts) {
    if (c > bestCount) {
      best = label;
      bestCount = c;
    }
  }
  if (bestCount === 0) throw new Error('measure: no complete high-side on-time in the window for the mode label');
  return best;
}
