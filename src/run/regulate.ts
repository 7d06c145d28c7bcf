import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine } from '../engine/types.js';
import type { DeckSeed } from '../netlist/types.js';
import { formatSi } from '../units/index.js';
import { CHECK_CYCLES, simulateSteady, type SteadyOptions, type SteadyResult } from './steady.js';

/** Regulation is met when the simulated output is within this fraction of output.voltage. */
export const REGULATION_TOLERANCE = 0.005;
/** The search aims inside the tolerance so that simulator noise does not leave it on the edge. */
const AIM = 0.8;
const MAX_STEPS = 8;

export interface RegulateResult {
  /** The operating point kept (nearest the target; the closest point when unreachable); null when none ran. */
  steady: SteadyResult | null;
  simulations: number;
  cycles: number;
  runs: number;
  met: boolean;
  /** The target lies above the simulated peak gain. */
  unreachable?: { closest: ClosestPoint };
  /** The search reached a frequency the dead time does not fit. */
  deadTime?: { fs: number; message: string };
}


/** The simulated point nearest to an unreachable target: the highest output the search found. */
export interface ClosestPoint {
  /** Output voltage there, V. */
  vout: number;
  /** Switching frequency, Hz. */
  fs: number;
  region: 'inductive' | 'capacitive';
}

/**
 * Dead time against a switching frequency (the rule of the fixed-frequency design check): null
 * when td < T/2, else the reason. Used at every step of the search.
 */
export function deadTimeProblem(deadTime: number, fs: number): string | null {
  if (deadTime < 1 / (2 * fs)) return null;
  return `dead time ${formatSi(deadTime, 's')} is not shorter than half the switching period at ${formatSi(fs, 'Hz')} (${formatSi(1 / (2 * fs), 's')})`;
}

interface Point {
  fs: number;
  v: number;
  region: 'inductive' | 'capacitive';
  r: SteadyResult;
}

/** Bisection steps on the region boundary once the peak gain is bracketed below the target. */
const PEAK_STEPS = 2;

/**
 * Find in simulation the switching frequency at which Vout meets output.voltage: start at fs0,
 * take the first step along the slope `slope0` (from FHA or a better model), then secant steps on
 * the simulated points. Each step continues from the previous run's final state, with the output
 * capacitor preset to the voltage the step aims at.
 *
 * A target above the converter's peak gain: the output rises with frequency in the capacitive
 * region and falls in the inductive one, so once a capacitive point below the target lies under an
 * inductive one below it in frequency, the peak between them is below the target. The search then
 * bisects on the region boundary (PEAK_STEPS points) and reports the target unreachable with the
 * highest simulated output as the closest point. A step to a frequency where the dead time takes
 * half the period or more stops the search with `deadTime` (the circuit cannot run there).
 *
 * A point whose first run already shows, by the extrapolated steady output, that it misses the
 * search's aim is left without a proof (simulateSteady's `target`): its prediction steers the next
 * step, and the next point starts from its extrapolated state with a check run at once. A point
 * reported, the one nearest the target or the closest to an unreachable one, is always proven.
 */
export async function regulate(engine: SimEngine, design: Design, corner: Corner, fs0: number, seed: DeckSeed,
  slope0: number, opts: SteadyOptions): Promise<RegulateResult> {
  const target = design.output.voltage;
  const pts: Point[] = [];
  let fs = fs0;
  let state = seed;
  let cycles = 0;
  let runs = 0;
  let best: SteadyResult | undefined;
  let bracket: [number, number] | null = null;
  let peakSteps = 0;
  for (let step = 0; step < MAX_STEPS; step++) {
    const dt = deadTimeProblem(design.switches.deadTime, fs);
    if (dt) {
      if (best) return { steady: best, simulations: pts.length, cycles, runs, met: false, deadTime: { fs, message: dt } };
      return { steady: null, simulations: 0, cycles, runs, met: false, deadTime: { fs, message: dt } };
    }
    const r = await simulateSteady(engine, design, corner, fs, state,
      { ...opts, maxCycles: Math.max(opts.maxCycles - cycles, 40), target: { vout: target, band: AIM * REGULATION_TOLERANCE },
        ...(step > 0 ? { firstCycles: CHECK_CYCLES } : {}) });
    cycles += r.cycles;
    runs += r.runs;
    if (!r.ok || !r.metrics) return { steady: r, simulations: step + 1, cycles, runs, met: false };
    // A point the search leaves at once carries the extrapolated prediction instead of a proof.
    const v = r.predictedVout ?? r.metrics.vout;
    const region = r.metrics.region;
    pts.push({ fs, v, region, r });
    if (r.predictedVout === undefined && (!best || Math.abs(v - target) < Math.abs(best.metrics!.vout - target))) best = r;
    if (Math.abs(v - target) <= AIM * REGULATION_TOLERANCE * target) break;
    state = { ...r.state!, vo: target };
    bracket ??= peakBracket(pts, target);
    if (bracket) {
      if (peakSteps++ >= PEAK_STEPS) break;
      // bisect on the region boundary: the peak gain sits at or just below it
      const at = pts.at(-1)!;
      if (at.fs > bracket[0] && at.fs < bracket[1]) bracket = at.region === 'capacitive' ? [at.fs, bracket[1]] : [bracket[0], at.fs];
      fs = (bracket[0] + bracket[1]) / 2;
      continue;
    }
    if (v < target && region === 'capacitive') {
      fs *= 1.15; // below the peak: more gain lies above in frequency
      continue;
    }
    let slope = slope0 < 0 ? slope0 : -Math.abs(slope0 || 1e-4);
    if (pts.length >= 2) {
      const [a, b] = pts.slice(-2) as [Point, Point];
      const s = (b.v - a.v) / (b.fs - a.fs);
      if (Number.isFinite(s) && s < 0) slope = s;
    }
    fs = Math.min(Math.max(fs - (v - target) / slope, fs * 0.7), fs * 1.4);
  }
  // A point reported must be proven: one only predicted is simulated on from its extrapolated state.
  const prove = async (p: Point): Promise<SteadyResult> => {
    if (p.r.predictedVout === undefined) return p.r;
    const r = await simulateSteady(engine, design, corner, p.fs, p.r.state!, { ...opts, maxCycles: Math.max(opts.maxCycles - cycles, 40) });
    cycles += r.cycles;
    runs += r.runs;
    return r;
  };
  if (!best) {
    const near = pts.reduce((a, b) => (Math.abs(b.v - target) < Math.abs(a.v - target) ? b : a));
    best = await prove(near);
    if (!best.ok || !best.metrics) return { steady: best, simulations: pts.length, cycles, runs, met: false };
  }
  const met = Math.abs(best.metrics!.vout - target) <= REGULATION_TOLERANCE * target;
  if (!met && bracket) {
    const top = pts.reduce((a, b) => (b.v > a.v ? b : a));
    const steady = await prove(top);
    const vout = steady.metrics?.vout ?? top.v;
    return { steady, simulations: pts.length, cycles, runs, met: false,
      unreachable: { closest: { vout, fs: top.fs, region: steady.metrics?.region ?? top.region } } };
  }
  return { steady: best, simulations: pts.length, cycles, runs, met };
}

/**
 * [capacitive fs, inductive fs] of two simulated points both below the target, the capacitive one
 * lower in frequency and no point between them above the target; null when there is none.
 */
export function peakBracket(pts: readonly { fs: number; v: number; region: 'inductive' | 'capacitive' }[], target: number): [number, number] | null {
  const below = pts.filter((p) => p.v < target);
  const caps = below.filter((p) => p.region === 'capacitive');
  const inds = below.filter((p) => p.region === 'inductive');
  for (const c of [...caps].sort((a, b) => b.fs - a.fs)) {
    const above = inds.filter((p) => p.fs > c.fs).sort((a, b) => a.fs - b.fs)[0];
    if (above && !pts.some((p) => p.fs > c.fs && p.fs < above.fs && p.v >= target)) return [c.fs, above.fs];
  }
  return null;
}
