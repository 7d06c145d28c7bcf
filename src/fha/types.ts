export type Region = 'inductive' | 'capacitive';

/** FHA prediction for one corner. SI units; angles in radians. Field names are part of results.json. */
export interface FhaResult {
  /** Switching frequency (given, or solved when regulating); null when no ZVS-compatible solution exists. */
  fs: number | null;
  fr: number;
  fp: number;
  zr: number;
  rac: number;
  fn: number | null;
  q: number;
  ln: number;
  /** Tank gain M = n V_rect / Vin_eff (not Vout/Vin). */
  gain: number | null;
  /** Gain the corner needs to reach output.voltage (regulated) or reaches (fixed). */
  gainTarget: number;
  vout: number | null;
  iout: number | null;
  region: Region | null;
  /** Input-impedance phase, rad (positive = inductive). */
  phase: number | null;
  zvs: boolean | null;
  /** Turn-off current minus the current needed to swing the node in the dead time, A. */
  zvsMargin: number | null;
  zvsRequiredCurrent: number;
  zcs: boolean | null;
  fsZeroPhase: number;
  gainAtZeroPhase: number;
  fsPeakGain: number;
  peakGain: number;
  tankCurrentRms: number | null;
  tankCurrentPeak: number | null;
  magnetizingCurrentPeak: number | null;
  crVoltagePeak: number | null;
  crVoltageMin: number | null;
  switchCurrentRms: number | null;
  switchTurnOffCurrent: number | null;
  diodeCurrentAvg: number | null;
  diodeCurrentPeak: number | null;
  diodeCurrentRms: number | null;
  diodeReverseVoltage: number | null;
  outputRippleCurrentRms: number | null;
  /** Plain-language notes: unreachable gain, light-load limit, ZVS energy shortfall... */
  warnings: string[];
}
