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
  /** Design (commanded) switching frequency, Hz; the gate edges are checked against it. */
  fs: number;
  /**
   * Optional (added by measure): resistive load, ohm. With it iout = avg(vout) / load and
   * pout = avg(vout^2) / load; without it iout comes from the rectifier current balance.
   */
  load?: number;
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
  /** Current drawn from the input source (into the high-side drains, Coss included), A; optional. */
  inputCurrent?: Float64Array;
}

/** Measurement window: whole switching cycles [tStart, tStart + cycles/fs]. */
export interface MeasureWindow {
  tStart: number;
  cycles: number;
}

export type ZvsState = 'zvs' | 'partial' | 'hard';

/**
 * Quantities measured from one steady-state window (see measure/measure.ts). Names match FhaResult
 * where both exist. SI units. "Worst" = over every switch/diode and every edge/interval in the window.
 */
export interface SimMetrics {
  /** From the high-side gate rising edges, Hz. */
  fs: number;
  /** n (vout + rectifierDrop) / Vin_eff; Vin_eff = Vin/2 (HB) or Vin (FB). */
  gain: number;
  /** Time-weighted average, V. */
  vout: number;
  /** Peak-to-peak, V. */
  voutRipple: number;
  /** avg(vout) / load; without Waveforms.load, rectifier output current minus capacitor current, A. */
  iout: number;
  /** avg(vout^2) / load; without Waveforms.load, vout * iout, W. */
  pout: number;
  /**
   * Vin x avg(input current), W: the power the modelled circuit draws, so pout / inputPower is its
   * efficiency with the conduction losses of the modelled parts only. Absent without Waveforms.inputCurrent.
   */
  inputPower?: number;
  tankCurrentRms: number;
  /** max |i_t|, A. */
  tankCurrentPeak: number;
  /** max |i_m|, A. */
  magnetizingCurrentPeak: number;
  /** max v_Cr, V. */
  crVoltagePeak: number;
  /** min v_Cr, V. */
  crVoltageMin: number;
  /** Largest switch RMS current, A. */
  switchCurrentRms: number;
  /**
   * Smallest tank current at a gate falling edge, signed positive in the direction that swings the
   * node towards the incoming switch (+i_t at high-side-group turn-off, -i_t otherwise), A.
   */
  switchTurnOffCurrent: number;
  /** Largest per-diode average, peak and RMS current, A (0 without conduction). */
  diodeCurrentAvg: number;
  diodeCurrentPeak: number;
  diodeCurrentRms: number;
  /** Largest reverse (cathode - anode) voltage, V. */
  diodeReverseVoltage: number;
  /** Most negative diode current as a positive number, A; 0 when never negative. */
  diodeReverseCurrent: number;
  /** RMS of the output capacitor current (including any DC part), A. */
  outputRippleCurrentRms: number;
  /** True when every gate turn-on edge in the window is ZVS. */
  zvs: boolean;
  /** State of the worst edge. */
  zvsState: ZvsState;
  /** Worst (largest) switch voltage at a turn-on edge, as a fraction of Vin. */
  zvsWorstVoltage: number;
  /**
   * Worst (smallest) time from v_ds falling to the threshold to the gate edge, s. An edge without ZVS
   * gives -deadTime (-Ts/2 when deadTime = 0), so negative = late and the value stays finite.
   */
  zvsMarginTime: number;
  /** True when every conduction interval's zcsRatio is within the threshold (true without conduction). */
  zcs: boolean;
  /** Worst diode current at the primary edge that cuts it, divided by that conduction's peak (0 without conduction). */
  zcsRatio: number;
  /** 'capacitive' when any turn-on edge sees tank current in the wrong direction, else 'inductive'. */
  region: 'inductive' | 'capacitive';
  /** Most frequent P/N/O sequence over the high-side on-time (turn-on to turn-off), e.g. 'PO', 'NP'. */
  mode: string;
}
