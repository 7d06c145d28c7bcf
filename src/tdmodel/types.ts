import type { Inverter, Rectifier } from '../design/types.js';

/**
 * Converter parameters of the time-domain model, SI units. Primary-referred circuit: DC input,
 * half- or full-bridge inverter, series Lr and Cr, Lm across the ideal n:1 transformer, diode
 * rectifier into a stiff output voltage.
 */
export interface TdParams {
  inverter: Inverter;
  rectifier: Rectifier;
  /** DC input voltage, V (> 0). */
  vin: number;
  /** Switching frequency, Hz (> 0). */
  fs: number;
  /** Series (resonant) inductance referred to the primary, H. */
  lr: number;
  /** Series (resonant) capacitance, F. */
  cr: number;
  /** Magnetizing inductance referred to the primary, H. */
  lm: number;
  /** Turns ratio Np/Ns; center-tapped: Ns is one half of the secondary. */
  n: number;
  /** Linear output capacitance of ONE switch, F (the node sees 2 Coss per leg). 0 = ideal switch. */
  coss: number;
  /** Dead time, s; 0 = ideal complementary switching. Must be below half a period. */
  deadTime: number;
  /** Forward drop of one rectifier diode, V. */
  vf: number;
  /** Series resistance of one rectifier diode, ohm. */
  rd: number;
  /** On-resistance of one switch, ohm (the body diode is modelled with the same resistance). */
  rdsOn: number;
}

/** Rectifier state: P conducts with i_sec > 0, N with i_sec < 0, O off (Lm in the resonance). */
export type RectMode = 'P' | 'N' | 'O';

/** One rectifier interval, times in s after t = 0 (the low-side turn-off). */
export interface Segment {
  mode: RectMode;
  start: number;
  end: number;
}

/**
 * Periodic state at t = 0 (low-side / S2-S3 turn-off), the initial condition for a SPICE run.
 * Currents in A, voltages in V, signs as in the module conventions.
 */
export interface SeedState {
  /** Tank current, positive from the bridge node (FB: leg A) into Lr. */
  ir: number;
  /** Magnetizing current referred to the primary, same sign convention. */
  im: number;
  /** Cr voltage, bridge side minus transformer side. */
  vcr: number;
  /** Node voltages to ground: HB [v_node]; FB [v_legA, v_legB]. */
  vNode: number[];
  /** Secondary current referred to the primary, i_r - i_m (positive in P). */
  iSecPrimary: number;
  /** Secondary current on the secondary side, n (i_r - i_m), A. */
  iSecondary: number;
  /** Current of the diode (CT) or diode pair (FB) conducting in P, and in N, A (>= 0). */
  iDiodeP: number;
  iDiodeN: number;
  /** Output capacitor voltage, V. */
  vo: number;
}

/** Average powers over one period, W. input = output + the four loss terms (energy balance). */
export interface PowerBalance {
  input: number;
  output: number;
  switchConduction: number;
  diodeResistive: number;
  diodeForward: number;
  /** Node-capacitance energy dumped at hard-switched gate edges, 0.5 C dV^2 per edge. */
  hardSwitching: number;
}

/** Periodic steady state with the output held at a DC voltage. SI units. */
export interface HeldOutputResult {
  vo: number;
  /** Average rectified output current, A. */
  ioRect: number;
  /** Tank gain n (Vo + V_drop) / Vin_eff (docs/method.md#gain). */
  gain: number;
  /** Rectifier sequence in the half period that starts at the high-side turn-on, e.g. 'PO', 'NP'. */
  mode: string;
  /** Rectifier intervals over [td, T/2 + td) (the same half period as `mode`). */
  segments: Segment[];
  tankCurrentRms: number;
  tankCurrentPeak: number;
  magnetizingCurrentPeak: number;
  crVoltageMax: number;
  crVoltageMin: number;
  /** Tank current at T/2, when the high side turns off (> 0 inductive), A. */
  turnOffCurrent: number;
  /** Tank current at the high-side gate edge t = td, A (< 0: the body diode carries it). */
  turnOnCurrent: number;
  switchCurrentRms: number;
  diodeCurrentPeak: number;
  diodeCurrentRms: number;
  diodeCurrentAvg: number;
  /** Largest |Lm voltage| during rectifier-off (O) intervals, V; 0 without O. A no-load output charges to it / n - V_drop. */
  lmVoltagePeakOpen: number;
  /** RMS of rectified current minus its average (output capacitor ripple), A. */
  outputRippleCurrentRms: number;
  /** Node reached the rail before the gate edge (with no node capacitance and no dead time: i_r(0) <= 0). */
  zvs: boolean;
  /** Bridge voltage (HB node; FB v_A - v_B) just before the high-side gate edge, V. */
  bridgeVoltageAtGate: number;
  /** Time from t = 0 until the node reached the high rail, s; null if it did not before td. */
  zvsTransitionTime: number | null;
  power: PowerBalance;
  seed: SeedState;
  /** Shooting iterations and whether the fixed-point fallback was needed. */
  iterations: number;
  usedFallback: boolean;
}

/** Steady state with a resistive load: Io_rect(vo) = vo / RL. */
export interface SteadyStateResult extends HeldOutputResult {
  /** Load resistance, ohm. */
  rl: number;
  /** Output current vo / RL, A. */
  io: number;
  /** Held-output solves used to find vo. */
  evaluations: number;
}

/** Outcome of solveFrequency: a frequency and its steady state, or null with the reason. */
export type FrequencyResult =
  | { fs: number; state: SteadyStateResult; evaluations: number }
  | { fs: null; reason: string; evaluations: number };
