import type { Inverter, Rectifier } from '../design/types.js';

/** One bridge switch as seen by the measurements. */
export interface SwitchTrace {
  name: string;
  /** Drain-source voltage, V. */
  vds: Float64Array;
  /** Gate command, 0..1 (on above 0.5). */
  gate: Float64Array;
  /** Device current (channel + body diode + Coss), positive drain -> source, A. */
  current: Float64Array;
}

/** One rectifier diode. */
export interface DiodeTrace {
  name: string;
  /** Forward current anode -> cathode, A. */
  current: Float64Array;
  /** Voltage cathode - anode (positive when reverse biased), V. */
  reverseVoltage: Float64Array;
}

/**
 * Simulated waveforms of one LLC run on a common time base, mapped from simulator vectors by the
 * netlist module. Signs: tank current positive from the bridge (HB switch node / FB leg A) into Lr.
 */
export interface Waveforms {
  t: Float64Array;
  inverter: Inverter;
  rectifier: Rectifier;
  vin: number;
  fs: number;
  turnsRatio: number;
  /** Rectifier forward drop used for the gain equivalent: VF (CT) or 2 VF (FB rectifier). */
  rectifierDrop: number;
  deadTime: number;
  tankCurrent: Float64Array;
  /** Magnetizing current referred to the primary, same sign convention as tankCurrent. */
  magnetizingCurrent: Float64Array;
  /** Cr voltage in the direction of the tank current (bridge side minus transformer side). */
  crVoltage: Float64Array;
  /** Bridge output voltage applied to the tank (HB: switch node; FB: leg A - leg B). */
  bridgeVoltage: Float64Array;
  /** HB: [high, low]; FB: [S1 (A high), S2 (A low), S3 (B high), S4 (B low)]. S1/S4 turn on with the HB high side. */
  switches: SwitchTrace[];
  /** CT: [D1, D2]; FB rectifier: [D1..D4] (D1/D4 conduct in the positive half). */
  diodes: DiodeTrace[];
  /** Output voltage across the load, V. */
  vout: Float64Array;
  /** Output capacitor current (into the capacitor), A. */
  outputCapCurrent: Float64Array;
  /** Secondary current referred to the primary, positive in the P interval (Lm clamped to +n V_rect). */
  secondaryCurrentReferred: Float64Array;
}

/** Measurement window: whole switching cycles [tStart, tStart + cycles/fs]. */
export interface MeasureWindow {
  tStart: number;
  cycles: number;
}

export type ZvsState = 'zvs' | 'partial' | 'hard';

/** Quantities measured from one steady-state window. Names match FhaResult where both exist. */
export interface SimMetrics {
  fs: number;
  gain: number;
  vout: number;
  voutRipple: number;
  iout: number;
  pout: number;
  tankCurrentRms: number;
  tankCurrentPeak: number;
  magnetizingCurrentPeak: number;
  crVoltagePeak: number;
  crVoltageMin: number;
  switchCurrentRms: number;
  switchTurnOffCurrent: number;
  diodeCurrentAvg: number;
  diodeCurrentPeak: number;
  diodeCurrentRms: number;
  diodeReverseVoltage: number;
  diodeReverseCurrent: number;
  outputRippleCurrentRms: number;
  /** True when every gate turn-on edge in the window is ZVS. */
  zvs: boolean;
  zvsState: ZvsState;
  /** Worst switch voltage at a turn-on edge, as a fraction of Vin. */
  zvsWorstVoltage: number;
  /** Worst (smallest) time between v_ds reaching the threshold and the gate edge, s; negative = late. */
  zvsMarginTime: number;
  zcs: boolean;
  /** Worst diode current at the primary switching edge divided by that conduction's peak. */
  zcsRatio: number;
  region: 'inductive' | 'capacitive';
  /** P/N/O sequence of the half period starting at the high-side turn-on, e.g. 'PO', 'NP'. */
  mode: string;
}
