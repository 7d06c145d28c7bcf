import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { DeckSeed } from '../netlist/types.js';
import { fhaSeed } from '../netlist/fhaState.js';
import { solveFrequency, solveSteadyState, type SeedState } from '../tdmodel/index.js';
import { modelParams } from '../ideal/params.js';
import type { IdealOutcome } from '../ideal/metrics.js';
import { fhaSlope } from '../fha/dynamics.js';

/**
 * How a simulation is started: 'model' (default) from the periodic state of the time-domain model
 * (it includes dead time, drops and the O/N intervals FHA misses), 'fha' from the FHA phasors,
 * 'zero' from rest (for comparison only).
 */
export type SeedMethod = 'model' | 'fha' | 'zero';

/** Where a corner's simulation starts: frequency, state and the expected slope dVo/dfs (V/Hz). */
export interface StartPoint {
  fs: number;
  seed: DeckSeed;
  slope: number;
  source: SeedMethod;
}

function fromModel(s: SeedState): DeckSeed {
  return { vo: s.vo, ir: s.ir, im: s.im, vcr: s.vcr, va: s.vNode[0] ?? 0, vb: s.vNode[1] ?? 0 };
}

/** Normalised frequencies fs/fr inside which the time-domain model is used for the start. */
export const MODEL_FN_RANGE: readonly [number, number] = [0.05, 20];

const ZERO: DeckSeed = { vo: 0, ir: 0, im: 0, vcr: 0, va: 0, vb: 0 };

/**
 * Start of a corner's simulation. Regulated corners start at the frequency the model predicts for
 * output.voltage (FHA's when the model finds none); the slope for the first search step comes
 * from the same model. Any model failure falls back to FHA, so a start always exists. With the
 * corner's ideal-model outcome (`ideal`, see ideal/metrics.ts) its solved state is reused.
 */
export function startPoint(design: Design, corner: Corner, fha: FhaResult, method: SeedMethod = 'model', ideal?: IdealOutcome): StartPoint {
  const regulated = corner.fs === null;
  const fhaFs = regulated ? fha.fs ?? fha.fsZeroPhase : corner.fs!;
  const fallback = (): StartPoint => ({
    fs: fhaFs,
    seed: method === 'zero' ? ZERO : fhaSeed(design, corner, fhaFs, regulated ? design.output.voltage : fha.vout ?? design.output.voltage),
    slope: fhaSlope(design, corner, fhaFs),
    source: method === 'zero' ? 'zero' : 'fha',
  });
  if (method !== 'model') return fallback();
  // The model integrates every resonant cycle inside a switching period: far from resonance it gets
  // slow (seconds per corner at fs/fr = 1e-3) while FHA is a fine start there anyway.
  const fn = fhaFs / fha.fr;
  if (!(fn > MODEL_FN_RANGE[0] && fn < MODEL_FN_RANGE[1])) return fallback();
  if (ideal && ideal.ideal === null) return fallback();
  try {
    const p = ideal?.ideal ? ideal.params : modelParams(design, corner, fhaFs);
    if (!regulated) {
      const r = ideal?.ideal ? ideal.state : solveSteadyState(p, corner.load);
      const up = solveSteadyState({ ...p, fs: fhaFs * 1.005 }, corner.load, { guess: r.seed, voGuess: r.vo });
      return { fs: fhaFs, seed: fromModel(r.seed), slope: (up.vo - r.vo) / (fhaFs * 0.005), source: 'model' };
    }
    const f = ideal?.ideal ? { fs: ideal.params.fs, state: ideal.state } : solveFrequency(p, corner.load, design.output.voltage, fhaFs);
    if (f.fs === null) return fallback();
    const up = solveSteadyState({ ...p, fs: f.fs * 1.005 }, corner.load, { guess: f.state.seed, voGuess: f.state.vo });
    const slope = (up.vo - f.state.vo) / (f.fs * 0.005);
    return { fs: f.fs, seed: fromModel(f.state.seed), slope: slope < 0 ? slope : fhaSlope(design, corner, f.fs), source: 'model' };
  } catch {
    return fallback();
  }
}
