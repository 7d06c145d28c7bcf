/**
 * The output-voltage part of the steady-state proof over one check window of whole cycles. Two
 * things can still move the output after the window:
 * - the slow charge of the output capacitor toward its equilibrium. Near the equilibrium V* the
 *   capacitor current is linear in its voltage, i = (V* - v) / R with R = ESR + Rth || RL the
 *   resistance it sees, so the window's average capacitor current gives the distance still to go,
 *   |V* - avg(v)| = R |avg(i_Co)|, however slow the approach (the same relation as the shooting
 *   step of run/shooting.ts);
 * - a slow oscillation of the output with the tank (the beat between the switching and the
 *   resonant frequency): it shows as a change between the two halves of the window.
 * The settle error is the larger of the two, relative to the window's average output voltage.
 */

/** Settle error of a check window, relative. */
export interface WindowSettle {
  /** |second half average - first half average| / |second half average|. */
  halfChange: number;
  /** R |avg(i_Co)| / |avg(vout)|: the distance to the capacitor's equilibrium. */
  chargeShift: number;
  /** max(halfChange, chargeShift); Infinity when an input is not finite. */
  error: number;
}

/**
 * `halves`: output-voltage averages over the first and second half of the window, V;
 * `capCurrentAvg`: the window's average capacitor current, A; `voutAvg`: its average output, V;
 * `rSlow`: ESR + Rth || RL, ohm.
 */
export function windowSettle(halves: readonly [number, number], capCurrentAvg: number, voutAvg: number, rSlow: number): WindowSettle {
  const halfChange = Math.abs(halves[1] - halves[0]) / Math.abs(halves[1]);
  const chargeShift = (Math.abs(capCurrentAvg) * rSlow) / Math.abs(voutAvg);
  const error = Math.max(halfChange, chargeShift);
  return { halfChange, chargeShift, error: Number.isFinite(error) ? error : Infinity };
}
