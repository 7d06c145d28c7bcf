/**
 * The validated design model. Every number is in SI base units (H, F, ohm, V, A, W, s, Hz);
 * fractions (tolerances, compare limits) are plain ratios (5 % = 0.05).
 * Text such as "27 nF" never reaches this type: the loader parses it at the boundary.
 */
export type Inverter = 'half-bridge' | 'full-bridge';
export type Rectifier = 'center-tapped' | 'full-bridge';
export type Accuracy = 'fast' | 'normal' | 'fine';

import type { LoadSpec } from '../units/load.js';

/** One load entry as written (defined in units/, where it is parsed; re-exported here). */
export type { LoadSpec } from '../units/load.js';

/** A corner listed by hand in `operating.corners`; absent tank values take the nominal ones. */
export interface ExplicitCorner {
  vin: number;
  load: LoadSpec;
  /** Switching frequency in Hz, or null to regulate to output.voltage. */
  frequency: number | null;
  lr?: number;
  cr?: number;
  lm?: number;
}

export interface DeviceModel {
  /** Path as written in the design file (resolved relative to it by the loader). */
  file: string;
  /** File text after the line filter (ASCII, no control blocks, no includes). */
  text: string;
  /** Model or subcircuit name to instantiate (sanitised to [A-Za-z0-9_]). */
  name: string;
}

export interface Design {
  name: string;
  /** Design file path as given by the user, for reports; absent for designs built in code. */
  file?: string;
  topology: { inverter: Inverter; rectifier: Rectifier };
  tank: {
    lr: number;
    cr: number;
    lm: number;
    /** Np/Ns; Ns is one half of the secondary when center-tapped. */
    turnsRatio: number;
    /** Lr realised as transformer leakage (coupling coefficient from Lr and Lm). @default false */
    integrated: boolean;
  };
  switches: { deadTime: number; coss: number; rdsOn: number };
  rectifier: { forwardVoltage: number; resistance: number };
  output: { voltage: number; capacitance: number; esr: number };
  operating: {
    vin: number[];
    load: LoadSpec[];
    ratedPower: number;
    /** 'regulate' finds fs for output.voltage; otherwise fixed frequencies in Hz. */
    frequency: 'regulate' | number[];
    corners: ExplicitCorner[];
  };
  tolerances: { lr: number; cr: number; lm: number; corners: 'extremes' | 'nominal' };
  compare: { vout: number; fs: number; gain: number; currents: number; voltages: number };
  simulation: {
    /** @default 'normal' */
    accuracy: Accuracy;
    /** Relative agreement of successive output averages that counts as settled. @default 0.001 */
    settleTolerance: number;
    /** Cycle cap per corner before it is reported as not settled. @default 2000 */
    maxCycles: number;
    /** ZVS: switch voltage at turn-on below this fraction of Vin counts as ZVS. @default 0.05 */
    zvsThreshold: number;
  };
  devices: { diodeModel?: DeviceModel; switchModel?: DeviceModel };
}
