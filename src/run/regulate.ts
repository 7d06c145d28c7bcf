import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine } from '../engine/types.js';
import type { DeckSeed } from '../netlist/types.js';
import { simulateSteady, type SteadyOptions, type SteadyResult } from './steady.js';

/** Regulation is met when the simulated output is within this fraction of output.voltage. */
export const REGULATION_TOLERANCE = 0.005;
/** The search aims inside the tolerance so that simulator noise does not leave it on the edge. */
const AIM = 0.8;
const MAX_STEPS = 8;

export interface RegulateResult {
  steady: SteadyResult;
  simulations: number;
  cycles: number;
  runs: number;
  met: boolean;
}

export { fhaSlope } from './seed.js';

/**
 * Find in simulation the switching frequency at which Vout meets output.voltage: start at fs0,
 * take the first step along the slope `slope0` (from FHA or a better model), then secant steps on
 * the simulated points. Each step continues from the previous run's final state, with the output
 * capacitor preset to the voltage the step aims at.
 */
export async function regulate(engine: SimEngine, design: Design, corner: Corner, fs0: number, seed: DeckSeed,
  slope0: number, opts: SteadyOptions): Promise<RegulateResult> {
  const target = design.output.voltage;
  const pts: { fs: number; v: number }[] = [];
  let fs = fs0;
  let state = seed;
  let cycles = 0;
  let runs = 0;
  let best: SteadyResult | undefined;
  for (let step = 0; step < MAX_STEPS; step++) {
    const r = await simulateSteady(engine, design, corner, fs, state, { ...opts, maxCycles: Math.max(opts.maxCycles - cycles, 40) });
    cycles += r.cycles;
    runs += r.runs;
    if (!r.ok || !r.metrics) return { steady: r, simulations: step + 1, cycles, runs, met: false };
    const v = r.metrics.vout;
    pts.push({ fs, v });
    if (!best || Math.abs(v - target) < Math.abs(best.metrics!.vout - target)) best = r;
    if (Math.abs(v - target) <= AIM * REGULATION_TOLERANCE * target) break;
    let slope = slope0 < 0 ? slope0 : -Math.abs(slope0 || 1e-4);
    if (pts.length >= 2) {
      const [a, b] = pts.slice(-2) as [{ fs: number; v: number }, { fs: number; v: number }];
      const s = (b.v - a.v) / (b.fs - a.fs);
      if (Number.isFinite(s) && s < 0) slope = s;
    }
    const next = Math.min(Math.max(fs - (v - target) / slope, fs * 0.7), fs * 1.4);
    state = { ...r.state!, vo: target };
    fs = next;
  }
  const met = Math.abs(best!.metrics!.vout - target) <= REGULATION_TOLERANCE * target;
  return { steady: best!, simulations: pts.length, cycles, runs, met };
}
