// The hand-written reference decks of shared/reference/ as tool designs, and their recorded
// measurements. The decks and their measurement script share no code with the tool: the values
// here restate each deck's element values (see shared/reference/README.md), nothing more.
import { readFileSync } from 'node:fs';
import type { Design, Inverter, Rectifier } from '../../src/design/types.js';
import type { TdParams } from '../../src/tdmodel/types.js';
import { makeDesign } from '../support/design.js';
import { sharedFile } from '../support/shared.js';

export const REFERENCE_DIR = sharedFile('reference') + '/';

/** One reference deck: its scenario and the design that describes the same circuit to the tool. */
export interface ReferenceCase {
  deck: string;
  inverter: Inverter;
  rectifier: Rectifier;
  /** Switching frequency, Hz. */
  fs: number;
  /** Load resistance, ohm. */
  load: number;
  /** Output capacitance, F. */
  co: number;
  /** Rated output (sets the fitted diode's rated current = ratedPower / voltage). */
  voltage: number;
  ratedPower: number;
  /** False where the node never swings to the other rail (hard switching). */
  zvs: boolean;
  /**
   * The tool's accuracy setting for this case. 'fine' for fb-ct-above-full: at 'normal' (trap,
   * reltol 1e-4, T/350) the tool's own deck settles 0.19 % high in Vout with the Cr peak 1.5 % and
   * the turn-off current 2 % off, while the same deck at T/500, or with gear and reltol 1e-5,
   * agrees with the reference within 0.01 % (measured on ngspice-39): a step-size limit of the
   * 'normal' profile at this point (hard rectifier commutation above resonance), not a deck error.
   */
  accuracy?: 'normal' | 'fine';
}

export const REFERENCE_CASES: readonly ReferenceCase[] = [
  { deck: 'hb-ct-below-full', inverter: 'half-bridge', rectifier: 'center-tapped', fs: 95e3, load: 1.92, co: 100e-6, voltage: 24, ratedPower: 300, zvs: true },
  { deck: 'hb-ct-at-full', inverter: 'half-bridge', rectifier: 'center-tapped', fs: 117554, load: 1.92, co: 100e-6, voltage: 24, ratedPower: 300, zvs: true },
  { deck: 'hb-ct-above-light', inverter: 'half-bridge', rectifier: 'center-tapped', fs: 150e3, load: 19.2, co: 22e-6, voltage: 24, ratedPower: 300, zvs: true },
  { deck: 'hb-ct-capacitive', inverter: 'half-bridge', rectifier: 'center-tapped', fs: 50e3, load: 1.92, co: 100e-6, voltage: 24, ratedPower: 300, zvs: false },
  { deck: 'hb-fbr-below-light', inverter: 'half-bridge', rectifier: 'full-bridge', fs: 85e3, load: 9.6, co: 47e-6, voltage: 24, ratedPower: 300, zvs: true },
  { deck: 'fb-fbr-at-full', inverter: 'full-bridge', rectifier: 'full-bridge', fs: 117554, load: 1.92, co: 100e-6, voltage: 48, ratedPower: 1200, zvs: true },
  { deck: 'fb-ct-above-full', inverter: 'full-bridge', rectifier: 'center-tapped', fs: 140e3, load: 1.92, co: 100e-6, voltage: 48, ratedPower: 1200, zvs: true, accuracy: 'fine' },
];

/**
 * The design that describes a reference deck's circuit: Lr 47 uH, Cr 39 nF, Lm 235 uH, n = 8,
 * Vin 400 V, dead time 200 ns, Coss 300 pF, Ron 50 mohm, diodes 0.8 V at rated current + 5 mohm,
 * output ESR 10 mohm; one fixed-frequency corner.
 */
export function referenceDesign(c: ReferenceCase, over: { integrated?: boolean } = {}): Design {
  return makeDesign({
    name: `ref_${c.deck.replace(/-/g, '_')}`,
    topology: { inverter: c.inverter, rectifier: c.rectifier },
    // integrated: the winding ratio whose equivalent ideal transformer is the reference's 8:1 (8 / k, k = sqrt(Lm / (Lr + Lm)))
    tank: { lr: 47e-6, cr: 39e-9, lm: 235e-6, turnsRatio: over.integrated ? 8 / Math.sqrt(235 / (47 + 235)) : 8, integrated: over.integrated ?? false },
    switches: { deadTime: 200e-9, coss: 300e-12, rdsOn: 0.05 },
    rectifier: { forwardVoltage: 0.8, resistance: 0.005 },
    output: { voltage: c.voltage, capacitance: c.co, esr: 0.01 },
    operating: { vin: [400], load: [{ kind: 'ohm', value: c.load }], ratedPower: c.ratedPower, frequency: [c.fs], corners: [] },
    // tighter than the default 1e-3 so that the settle error stays well inside the 0.5 % check
    simulation: { accuracy: c.accuracy ?? 'normal', settleTolerance: 2e-4, maxCycles: 2000, zvsThreshold: 0.05 },
  });
}

/** Recorded values of one deck: quantity -> value (see shared/reference/measure.ctl for the names). */
export type Recorded = Record<string, number> & { ngspice?: never };

/** Reads shared/reference/results.csv (deck,quantity,value); the ngspice version rows are kept apart. */
export function readRecorded(): { values: Map<string, Record<string, number>>; versions: Map<string, string> } {
  const text = readFileSync(`${REFERENCE_DIR}results.csv`, 'utf8');
  const values = new Map<string, Record<string, number>>();
  const versions = new Map<string, string>();
  for (const line of text.trim().split('\n').slice(1)) {
    const [deck, quantity, value] = line.split(',');
    if (!deck || !quantity || value === undefined) throw new Error(`results.csv: bad line "${line}"`);
    if (quantity === 'ngspice') {
      versions.set(deck, value);
      continue;
    }
    const x = Number(value);
    if (!Number.isFinite(x)) throw new Error(`results.csv: ${deck}.${quantity} is not a number: "${value}"`);
    const row = values.get(deck) ?? {};
    row[quantity] = x;
    values.set(deck, row);
  }
  return { values, versions };
}

/** kT/q at 300.15 K, V (CODATA 2018 constants). */
const VT = (1.380649e-23 * 300.15) / 1.602176634e-19;

/**
 * Ideal time-domain model parameters of a reference deck's circuit. The model's diode is VF + rd i:
 * VF is the reference diode's drop (Is = 1e-9 rated current, N = 1.4925214) at the output current
 * `io`, A; rd its 5 mohm.
 */
export function referenceTdParams(c: ReferenceCase, io: number, fs = c.fs): TdParams {
  const is = (c.ratedPower / c.voltage) * 1e-9;
  return {
    inverter: c.inverter, rectifier: c.rectifier, vin: 400, fs, lr: 47e-6, cr: 39e-9, lm: 235e-6, n: 8,
    coss: 300e-12, deadTime: 200e-9, vf: 1.4925214 * VT * Math.log(io / is + 1), rd: 0.005, rdsOn: 0.05,
  };
}
