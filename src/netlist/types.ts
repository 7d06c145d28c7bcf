/**
 * Circuit state at time 0 of a run (the low-side turn-off instant), used as initial conditions.
 * Currents in A with the Waveforms sign conventions; voltages in V.
 */
export interface DeckSeed {
  /** Output capacitor voltage. */
  vo: number;
  /** Tank (Lr) current. */
  ir: number;
  /** Magnetizing current referred to the primary. */
  im: number;
  /** Cr voltage, bridge side minus transformer side. */
  vcr: number;
  /** Bridge leg A (HB: switch node) and leg B voltages to ground. */
  va: number;
  vb: number;
}

/** Integration settings of an accuracy profile. */
export interface StepProfile {
  method: 'trap' | 'gear';
  reltol: number;
  /** Maximum time step as a fraction of the switching period. */
  stepsPerPeriod: number;
}
