/**
 * Steady-state evidence from one window of whole switching cycles: the output capacitor's charge
 * balance and the periodicity of the tank state. A periodic steady state has both exactly: the
 * capacitor's average current over whole cycles is zero (its voltage returns to where it started),
 * and every state variable ends a whole number of cycles where it began. Output-voltage agreement
 * alone cannot show either: behind a large output capacitor a tiny voltage change hides a large
 * current imbalance (Io x window / Co).
 */
import { locate, makeSpan, spanStats, valueAt } from './window.js';

/** The traces the checks read (a subset of Waveforms). SI units. */
export interface BalanceTraces {
  t: Float64Array;
  /** Output voltage across the load, V. */
  vout: Float64Array;
  /** Output capacitor current (into the capacitor), A: rectifier output current minus load current. */
  outputCapCurrent: Float64Array;
  /** Tank (Lr) current, A. */
  tankCurrent: Float64Array;
  /** Cr voltage, V. */
  crVoltage: Float64Array;
}

/** Steady-state evidence of one window [t0, t1]. */
export interface StateBalance {
  /**
   * Charge-balance error avg(i_Co) / Io, signed (positive: the capacitor is still charging),
   * with Io = avg(vout) / load. The same for both rectifiers: i_Co is the rectifier's output current
   * (D1 + D2 centre-tapped, D1 + D3 full-bridge) minus the load current, so for a centre-tapped
   * rectifier it equals (2 Id,avg - Io) / Io with Id,avg the mean of the two diode averages.
   */
  chargeBalance: number;
  /**
   * Tank periodicity error: the larger of |i_r(t1) - i_r(t0)| and |v_Cr(t1) - v_Cr(t0)|, each relative
   * to that signal's peak magnitude max |x| in the window.
   */
  periodicity: number;
  /** Window averages, V and A: output voltage, capacitor current, load current. */
  voutAvg: number;
  capCurrentAvg: number;
  iout: number;
}

/** Change of y from t0 to t1 relative to its peak magnitude in the window (0 for a signal that stays 0). */
function endChange(w: BalanceTraces, y: Float64Array, t0: number, t1: number): number {
  const s = spanStats(makeSpan(w.t, t0, t1), y);
  const d = Math.abs(valueAt(y, locate(w.t, t1)) - valueAt(y, locate(w.t, t0)));
  const peak = Math.max(Math.abs(s.max), Math.abs(s.min));
  if (peak > 0) return d / peak;
  return d === 0 ? 0 : Infinity;
}

/**
 * Charge balance and tank periodicity over the window [t0, t1] (whole switching cycles; t0 and t1 at
 * the same switching phase). `load` is the load resistance, ohm.
 */
export function stateBalance(w: BalanceTraces, t0: number, t1: number, load: number): StateBalance {
  const span = makeSpan(w.t, t0, t1);
  const voutAvg = spanStats(span, w.vout).avg;
  const capCurrentAvg = spanStats(span, w.outputCapCurrent).avg;
  const iout = voutAvg / load;
  const chargeBalance = iout !== 0 ? capCurrentAvg / Math.abs(iout) : capCurrentAvg === 0 ? 0 : Infinity;
  const periodicity = Math.max(endChange(w, w.tankCurrent, t0, t1), endChange(w, w.crVoltage, t0, t1));
  return { chargeBalance, periodicity, voutAvg, capCurrentAvg, iout };
}

/** Tolerances of the steady-state criterion (design.simulation). Relative. */
export interface SteadyTolerances {
  /** Output-voltage settle error. */
  vout: number;
  /** |avg(i_Co)| / Io. */
  chargeBalance: number;
  /** Tank state change over the window relative to its swing. */
  periodicity: number;
}

/**
 * The steady-state criterion: a window counts as settled only when the output voltage agrees
 * (settle error from successive window averages) AND the capacitor's charge balances AND the tank
 * state repeats, each within its tolerance. NaN anywhere counts as not settled.
 */
export function isSettled(voutError: number, b: Pick<StateBalance, 'chargeBalance' | 'periodicity'>, tol: SteadyTolerances): boolean {
  return voutError <= tol.vout && Math.abs(b.chargeBalance) <= tol.chargeBalance && b.periodicity <= tol.periodicity;
}
