/**
 * The validated design model. Every number is in SI base units (H, F, ohm, V, A, W, s, Hz);
 * fractions (tolerances, compare limits) are plain ratios (5 % = 0.05).
 * Text such as "27 nF" never reaches this type: the loader parses it at the boundary.
 */
import type { CompareKey } from './fields.js';

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

/** Design limits, SI units. An absent key sets no limit; capacitive operation is always outside. */
export interface DesignLimits {
  /** The controller's switching-frequency window, Hz. */
  frequency?: { min?: number; max?: number };
  /** 'required': every turn-on edge must be ZVS. @default 'ignore' */
  zvs: 'required' | 'ignore';
  /** Turn-off current >= (1 + zvsMargin) x 2 Coss Vin / deadTime (fraction, 20 % = 0.2). */
  zvsMargin?: number;
  /** Ratings (V, A); each bound is rating x derating. */
  crVoltage?: number;
  tankCurrentRms?: number;
  switchCurrentRms?: number;
  diodeReverseVoltage?: number;
  diodeCurrentRms?: number;
  outputRippleCurrentRms?: number;
  /** Share of each rating that may be used. @default 1 */
  derating: number;
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
  tolerances: {
    lr: number;
    cr: number;
    lm: number;
    corners: 'extremes' | 'nominal' | 'random';
    /** Relative tolerance of the turns ratio; used by the random mode (extremes vary Lr, Cr, Lm only). @default 0 */
    turnsRatio?: number;
    /** Monte Carlo samples per operating point (corners: random). @default 100 */
    samples?: number;
    /** Seed of the random samples: the same seed gives the same samples everywhere. @default 1 */
    seed?: number;
    /** uniform over +-tolerance, or normal with the tolerance at 3 sigma, truncated there. @default 'uniform' */
    distribution?: 'uniform' | 'normal';
  };
  compare: {
    vout: number;
    fs: number;
    gain: number;
    currents: number;
    voltages: number;
    /** Simulation against a measured prototype point (`run --measured`). @default 0.05 */
    measured: number;
    /**
     * Tolerances set for single metrics by name (a fraction, or 'off': reported, never flagged);
     * they override the group value. A group written as `off` lists each of its metrics here.
     */
    metrics?: Partial<Record<CompareKey, number | 'off'>>;
  };
  /** Design limits (the optional `limits` section); absent when the file has none. */
  limits?: DesignLimits;
  simulation: {
    /** @default 'normal' */
    accuracy: Accuracy;
    /** Relative agreement of successive output averages that counts as settled. @default 0.001 */
    settleTolerance: number;
    /** |avg(i_Co)| / Io over the last two settle windows that counts as charge-balanced. @default 0.01 */
    chargeBalanceTolerance: number;
    /** Tank current and Cr voltage change over the last two settle windows, relative to their peaks. @default 0.01 */
    periodicityTolerance: number;
    /** Cycle cap per corner before it is reported as not settled. @default 2000 */
    maxCycles: number;
    /** ZVS: switch voltage at turn-on below this fraction of Vin counts as ZVS. @default 0.05 */
    zvsThreshold: number;
    /** Corners of a random (Monte Carlo) run that the simulation confirms; the rest are screened only. @default 20 */
    confirm?: number;
  };
  devices: { diodeModel?: DeviceModel; switchModel?: DeviceModel };
}
