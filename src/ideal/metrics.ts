import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { SimMetrics } from '../measure/types.js';
import { measure } from '../measure/measure.js';
import { solveFrequency, solveSteadyState, type SteadyStateResult, type TdParams } from '../tdmodel/index.js';
import { tracePeriod } from '../tdmodel/trace.js';
import { modelParams } from './params.js';
import { modelDrop } from '../netlist/waveforms.js';
import { idealWaveforms } from './waveforms.js';

/** Normalised frequencies fs/fr inside which the ideal model is evaluated (and used to start simulations). */
export const IDEAL_FN_RANGE: readonly [number, number] = [0.05, 20];

/**
 * The ideal time-domain model's metrics for one corner (results.json `ideal`): the same names and
 * definitions as the simulation's, because they are measured by the same `measure` on the model's
 * exact periodic solution sampled into the same waveform shape.
 */
export type IdealMetrics = SimMetrics;

/** Ideal metrics, or null with the reason the model does not apply (results.json `idealReason`). */
export type IdealOutcome =
  | { ideal: IdealMetrics; state: SteadyStateResult; params: TdParams }
  | { ideal: null; reason: string };

/** Options of idealCorner. */
export interface IdealOptions {
  /**
   * Samples per half period of the traced solution (tdmodel tracePeriod; at least 40 per radian of
   * the resonance are taken anyway). Fewer make the measurement cheaper: Monte Carlo screening
   * uses SCREENING_POINTS. @default 400
   */
  pointsPerHalf?: number;
}

/**
 * Samples per half period used for Monte Carlo screening: cheaper than the default; RMS values,
 * peaks and the turn-off current stay within 0.1 % of the default's (src/ideal/screening.test.ts).
 */
export const SCREENING_POINTS = 100;

/**
 * Exact periodic steady state of the idealised converter at one corner (dead time, linear Coss,
 * Rds(on), diode VF + rd i, the O/N rectifier intervals; output held at a DC voltage), measured
 * like a simulation. Fixed frequency: at corner.fs. Regulated (corner.fs null): at the frequency
 * the model finds for output.voltage, searched from FHA's (or the zero-phase) frequency on the
 * inductive branch. Pure; never throws: a corner where the model does not apply (far from
 * resonance, no periodic state, a target outside the model's inductive range, dead time of half
 * a period or more) comes back as null with the reason.
 */
export function idealCorner(design: Design, corner: Corner, fha: FhaResult, opts: IdealOptions = {}): IdealOutcome {
  const regulated = corner.fs === null;
  const fsStart = regulated ? fha.fs ?? fha.fsZeroPhase : corner.fs!;
  const fn = fsStart / fha.fr;
  if (!(fn > IDEAL_FN_RANGE[0] && fn < IDEAL_FN_RANGE[1])) {
    return { ideal: null, reason: `fs/fr = ${fn.toPrecision(3)} lies outside ${IDEAL_FN_RANGE[0]}..${IDEAL_FN_RANGE[1]}, where the ideal model is evaluated` };
  }
  try {
    let p = modelParams(design, corner, fsStart);
    let state: SteadyStateResult;
    if (regulated) {
      const f = solveFrequency(p, corner.load, design.output.voltage, fsStart);
      if (f.fs === null) return { ideal: null, reason: `ideal model: ${f.reason}` };
      p = { ...p, fs: f.fs };
      state = f.state;
    } else {
      state = solveSteadyState(p, corner.load);
    }
    const ideal = measureState(p, state, corner.load, modelDrop(design), design.simulation.zvsThreshold, opts.pointsPerHalf);
    return { ideal, state, params: p };
  } catch (e) {
    return { ideal: null, reason: `ideal model: ${e instanceof Error ? e.message.replace(/^tdmodel: /, '') : String(e)}` };
  }
}

/**
 * Measures a solved periodic state of the model (params p, load in ohm) the way a simulation is
 * measured: sampled into Waveforms and passed to `measure` over one whole period. rectifierDrop (V)
 * enters only the gain definition; zvsThreshold as simulation.zvsThreshold.
 */
export function measureState(p: TdParams, state: SteadyStateResult, load: number, rectifierDrop: number, zvsThreshold?: number, pointsPerHalf?: number): IdealMetrics {
  const w = idealWaveforms(p, tracePeriod(p, state, pointsPerHalf), state.vo, load, rectifierDrop);
  return measure(w, { tStart: 1 / p.fs, cycles: 1 }, zvsThreshold === undefined ? {} : { zvsThreshold });
}
