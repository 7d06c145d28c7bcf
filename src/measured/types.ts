import type { LoadSpec } from '../design/types.js';

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
