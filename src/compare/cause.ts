import type { SimMetrics } from '../measure/types.js';
import type { ComparisonRow } from './types.js';

/**
 * Why FHA and simulation differ at a metric (results.json `divergences[].cause`):
 * - 'approximation': the ideal time-domain model agrees with the simulation within the metric's
 *   compare tolerance, so the gap is FHA's own error;
 * - 'circuit': the simulation departs from the ideal model by more than the tolerance but within
 *   CIRCUIT_FACTOR times it (diode reverse voltage: up to twice the ideal value), the size that
 *   the parts the ideal model leaves out can account for;
 * - 'unexplained': neither, or the ideal model does not apply at the corner.
 */
export type DivergenceCause = 'approximation' | 'circuit' | 'unexplained';

/** A simulation within this many tolerances of the ideal model counts as a circuit effect. A stated choice, see docs/ideal.md. */
export const CIRCUIT_FACTOR = 2;

export interface CauseVerdict {
  cause: DivergenceCause;
  /** One sentence naming the effect, to append to the divergence reason. */
  note: string;
}

type Value = ComparisonRow['sim'];

/** The full metric sets behind a row, for the status metrics' margins; deadTime in s. */
export interface CauseContext {
  sim: SimMetrics;
  ideal: SimMetrics | null;
  deadTime: number;
}

/** Classifies one diverged row; `ideal` is the ideal model's value of the same metric (null: not available). */
export function classifyCause(metric: string, sim: Value, ideal: Value | undefined, tolerance: number | null, ctx?: CauseContext): CauseVerdict {
  if (ideal === undefined || ideal === null) {
    return { cause: 'unexplained', note: 'the ideal time-domain model gives no value here, so nothing separates FHA\'s approximation from a circuit effect or a fault' };
  }
  if (typeof sim === 'number' && typeof ideal === 'number') {
    const tol = tolerance ?? 0.05;
    const err = ideal === 0 ? (sim === 0 ? 0 : Infinity) : (sim - ideal) / Math.abs(ideal);
    const vs = `simulation ${pct(err)} from the ideal model`;
    if (Math.abs(err) <= tol) return { cause: 'approximation', note: `the ideal time-domain model agrees (${vs}): FHA's own error, ${APPROX[metric] ?? 'its sinusoidal waveforms'}` };
    const circuit = metric === 'diodeReverseVoltage' ? err >= -tol && sim <= 2 * ideal : Math.abs(err) <= CIRCUIT_FACTOR * tol;
    if (circuit) return { cause: 'circuit', note: `${vs}: ${LEFT_OUT[metric] ?? LEFT_OUT_DEFAULT}` };
    return { cause: 'unexplained', note: `${vs}, more than the parts the ideal model leaves out account for: check the design values, the netlist and the measurement` };
  }
  if (sim === ideal) return { cause: 'approximation', note: `the ideal time-domain model agrees (${String(ideal)}): FHA's own error, ${APPROX[metric] ?? 'its sinusoidal waveforms'}` };
  return ctx && marginal(metric, ctx)
    ? { cause: 'circuit', note: `the ideal model says ${String(ideal)} with little margin: ${LEFT_OUT[metric] ?? LEFT_OUT_DEFAULT}` }
    : { cause: 'unexplained', note: `the ideal model says ${String(ideal)} with a clear margin: check the design values, the netlist and the measurement` };
}

/**
 * A status verdict close enough to its threshold that second-order effects can flip it:
 * ZCS when the diode current at the cutting edge is at most 1/4 of its peak in both; ZVS and
 * region when either edge is partial or the ideal node reaches its rail in the last quarter of
 * the dead time.
 */
export function marginal(metric: string, { sim, ideal, deadTime }: CauseContext): boolean {
  if (!ideal) return false;
  if (metric === 'zcs') return Math.max(sim.zcsRatio, ideal.zcsRatio) <= 0.25;
  if (metric === 'zvs' || metric === 'region') {
    return sim.zvsState === 'partial' || ideal.zvsState === 'partial' || (ideal.zvs && ideal.zvsMarginTime < 0.25 * deadTime);
  }
  return false;
}

const SINE_LM = 'the magnetizing current is a triangle, not the sinusoid FHA assumes (its peak up to pi^2/8 = 1.23 x FHA\'s)';

/** FHA's own approximation behind each metric, named. */
const APPROX: Record<string, string> = {
  fs: 'the gain FHA gets wrong away from resonance (Lm joins the resonance while the rectifier is off below fr; the edge cuts the secondary current above fr) moves the regulated frequency',
  gain: 'Lm joins the resonance while the rectifier is off (below fr) or the edge cuts the secondary current (above fr); FHA sees neither',
  vout: 'Lm joins the resonance while the rectifier is off (below fr) or the edge cuts the secondary current (above fr); FHA sees neither',
  tankCurrentRms: SINE_LM,
  tankCurrentPeak: SINE_LM,
  magnetizingCurrentPeak: SINE_LM,
  switchCurrentRms: SINE_LM,
  switchTurnOffCurrent: 'the switch turns off on the magnetizing peak (plus the load share at the edge), not on a sinusoid shifted by the input phase',
  diodeCurrentAvg: 'the diode current is a half-sine minus the magnetizing ramp, with gaps below fr',
  diodeCurrentPeak: 'the diode current is a half-sine minus the magnetizing ramp, with gaps below fr',
  diodeCurrentRms: 'the diode current is a half-sine minus the magnetizing ramp, with gaps below fr',
  outputRippleCurrentRms: 'the rectified current is not a pure half-sine (gaps below fr, cut edges above)',
  crVoltagePeak: 'the Cr swing follows the real tank current, not FHA\'s sinusoid',
  diodeReverseVoltage: 'FHA takes the clamp without the drop at the actual current',
  zvs: 'the real turn-off current is the magnetizing peak, not FHA\'s phase-shifted sinusoid',
  zcs: 'the diode commutation follows the rectifier interval sequence, which FHA does not model',
  region: 'the real inductive/capacitive boundary moves with the rectifier interval sequence',
};

const LEFT_OUT_DEFAULT = 'what the ideal model leaves out (nonlinear Coss, diode junction capacitance and recovery, the exponential diode characteristic, output ripple and ESR) accounts for a difference of this size';

/** What the ideal model leaves out that moves each metric, named. */
const LEFT_OUT: Record<string, string> = {
  fs: 'the ideal model takes the diode as VF + rd i and holds the output flat; the exponential diode and the output ripple move the regulated frequency this much',
  gain: 'the ideal model takes the diode as VF + rd i and holds the output flat; the exponential diode and the output ripple and ESR move the gain this much',
  vout: 'the ideal model takes the diode as VF + rd i and holds the output flat; the exponential diode and the output ripple and ESR move the output this much',
  switchTurnOffCurrent: 'the switch and diode capacitances charged around the edge, which the ideal model takes as linear or leaves out, shift the turn-off current',
  diodeCurrentPeak: 'diode dynamics (junction capacitance, recovery) and the output ripple, which the ideal model leaves out, shape the diode current',
  diodeCurrentRms: 'diode dynamics (junction capacitance, recovery) and the output ripple, which the ideal model leaves out, shape the diode current',
  diodeCurrentAvg: 'diode dynamics (junction capacitance, recovery) and the output ripple, which the ideal model leaves out, shape the diode current',
  outputRippleCurrentRms: 'the output capacitor and its ESR, which the ideal model replaces by a held voltage, shape the ripple current',
  diodeReverseVoltage: 'the leakage inductance rings with the diode and winding capacitances, which the ideal model leaves out (an undamped step overshoots to at most twice its size)',
  zvs: 'nonlinear Coss and the finite switching edges, which the ideal model leaves out, decide a transition this close',
  region: 'nonlinear Coss and the finite switching edges, which the ideal model leaves out, decide a transition this close',
  zcs: 'diode junction capacitance and recovery, which the ideal model leaves out, decide a commutation this close to zero current',
};

function pct(x: number): string {
  return Number.isFinite(x) ? `${x >= 0 ? '+' : ''}${(x * 100).toFixed(1)} %` : 'far';
}
