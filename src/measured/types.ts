import type { LoadSpec } from '../units/index.js';
import type { GapHint, MeasuredErrors } from './compare.js';

/**
 * One operating point measured on a prototype, in SI units (V, A, W, Hz).
 * `line` is the 1-based line of the row in its file, for messages and reports.
 */
export interface MeasuredPoint {
  line: number;
  vin: number;
  load: LoadSpec;
  fs: number;
  vout: number;
  /** Input current, A (gives efficiency with vin). */
  iin?: number;
  /** Input power, W (gives efficiency directly; wins over iin when both are given). */
  pin?: number;
  tankCurrentRms?: number;
  crVoltagePeak?: number;
  switchTurnOffCurrent?: number;
  note?: string;
}

/** A problem in a measured-points file, positioned at its cell (1-based line and character column). */
export interface MeasuredProblem {
  line: number;
  column: number;
  /** The column's header name, or '' for a problem with the file as a whole. */
  field: string;
  message: string;
}

export type MeasuredParse =
  | { ok: true; points: MeasuredPoint[] }
  | { ok: false; problems: MeasuredProblem[] };

/** What results.json keeps of a measured point: the measured values and each model's errors. */
export interface MeasuredSummary extends Omit<MeasuredPoint, 'load'> {
  /** Pout / Pin of the prototype, when the file gives iin or pin. */
  efficiency?: number;
  /**
   * The simulation's own pout / inputPower: conduction losses of the modelled parts only (no
   * switching, core, gate-drive or auxiliary losses), so it reads higher than the bench.
   */
  simEfficiency: number | null;
  /** (measured - model) / |model| per metric the point holds; null where the model has no values. */
  errors: { fha: MeasuredErrors | null; ideal: MeasuredErrors | null; sim: MeasuredErrors | null };
  /** compare.measured: the simulation misses the point when any |sim error| exceeds it. */
  tolerance: number;
  /** Every simulated metric within tolerance; null without a simulation. */
  within: boolean | null;
}

/** The measured-points part of results.json. */
export interface MeasuredReport {
  file: string;
  points: number;
  tolerance: number;
  /** Points whose simulation misses the measurement by more than the tolerance. */
  missed: number;
  /** What a consistent Vout gap between simulation and bench suggests (null: none). */
  hint: GapHint | null;
}

