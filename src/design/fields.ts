import type { UnitKind } from '../units/index.js';

/**
 * Leaf fields of the design file, as data. The parser, the JSON Schema and the reference
 * documentation all read these tables, so a field's unit, limits and default live in one place.
 *
 * Limits: `sign` is the physical lower limit (error). `below`/`atMost` is a hard upper limit
 * (error). `plausible` is a sanity window whose violation is an error "implausible, check the unit
 * prefix"; `usual` is a wider-than-typical window whose violation is only a warning. The windows
 * are common practice chosen to catch unit-prefix slips (a factor of 1000), not design rules.
 */
export interface QuantitySpec {
  kind: 'quantity';
  unit: UnitKind;
  sign: 'positive' | 'nonNegative';
  below?: number;
  atMost?: number;
  plausible?: readonly [number, number];
  usual?: readonly [number, number];
  integer?: boolean;
  default?: number;
  /** Shown in messages: `expected an inductance > 0 H such as "310 uH"`. */
  example: string;
  description: string;
}
export interface EnumSpec {
  kind: 'enum';
  values: readonly string[];
  default?: string;
  description: string;
}
export interface BoolSpec {
  kind: 'bool';
  default?: boolean;
  description: string;
}
export type FieldSpec = QuantitySpec | EnumSpec | BoolSpec;

const q = (unit: UnitKind, example: string, description: string, more: Partial<QuantitySpec> = {}): QuantitySpec =>
  ({ kind: 'quantity', unit, sign: 'positive', example, description, ...more });
const tol = (description: string): QuantitySpec =>
  q('ratio', '5%', description, { sign: 'nonNegative', below: 0.5, default: 0 });
const limit = (dflt: number, description: string): QuantitySpec =>
  q('ratio', `${dflt * 100}%`, description, { atMost: 1, default: dflt });

const L_WINDOW = [1e-9, 1] as const;

export const TANK_FIELDS = {
  lr: q('henry', '60 uH', 'Series resonant inductance Lr referred to the primary (discrete inductor plus leakage).', { plausible: L_WINDOW }),
  cr: q('farad', '42 nF', 'Series resonant capacitance Cr (for a split capacitor, the sum of both halves).', { plausible: [1e-12, 1e-3], usual: [1e-12, 1e-4] }),
  lm: q('henry', '310 uH', 'Magnetizing inductance Lm referred to the primary; must exceed Lr.', { plausible: L_WINDOW }),
  turnsRatio: q('number', '8', 'Turns ratio n = Np/Ns; with a center-tapped rectifier Ns is one half of the secondary.', { plausible: [1e-3, 1000] }),
  integrated: { kind: 'bool', default: false, description: 'Lr is the transformer leakage instead of a discrete inductor: lr = primary inductance with the secondary shorted, lm = open-circuit primary inductance minus lr, turnsRatio = winding ratio Np/Ns (the models use k Np/Ns, k = sqrt(Lm/(Lr+Lm))).' } as BoolSpec,
} satisfies Record<string, FieldSpec>;

export const SECTION_FIELDS = {
  topology: {
    inverter: { kind: 'enum', values: ['half-bridge', 'full-bridge'], description: 'Primary bridge: half-bridge (tank sees +-Vin/2) or full-bridge (+-Vin).' } as EnumSpec,
    rectifier: { kind: 'enum', values: ['center-tapped', 'full-bridge'], description: 'Secondary rectifier: center-tapped (one diode drop) or full-bridge (two diode drops).' } as EnumSpec,
  },
  tank: TANK_FIELDS,
  switches: {
    deadTime: q('second', '200 ns', 'Dead time between the gate signals of one bridge leg; must be shorter than half the switching period.', { plausible: [1e-12, 1e-4], usual: [1e-9, 1e-5] }),
    coss: q('farad', '150 pF', 'Output capacitance of one switch at the working voltage (charge-equivalent), used for ZVS.', { plausible: [1e-15, 1e-6] }),
    rdsOn: q('ohm', '120 mohm', 'On-state resistance of one switch.', { plausible: [1e-6, 100] }),
  },
  rectifier: {
    forwardVoltage: q('volt', '0.5 V', 'Forward voltage of one rectifier diode; 0 for ideal diodes.', { sign: 'nonNegative', plausible: [0, 10] }),
    resistance: q('ohm', '5 mohm', 'Series resistance of one rectifier diode; may be 0.', { sign: 'nonNegative', plausible: [0, 100] }),
  },
  output: {
    voltage: q('volt', '24 V', 'Output voltage: the regulation target, and the voltage at which loads in %, A or W are converted to a resistance.', { plausible: [1e-3, 1e5] }),
    capacitance: q('farad', '470 uF', 'Output filter capacitance.', { plausible: [1e-12, 1] }),
    esr: q('ohm', '20 mohm', 'Equivalent series resistance of the output capacitor; may be 0.', { sign: 'nonNegative', plausible: [0, 100] }),
  },
  tolerances: {
    lr: tol('Relative tolerance of Lr, 0 to below 50 %.'),
    cr: tol('Relative tolerance of Cr, 0 to below 50 %.'),
    lm: tol('Relative tolerance of Lm, 0 to below 50 %.'),
    turnsRatio: tol('Relative tolerance of the turns ratio, 0 to below 50 %; used by corners: random (extremes vary Lr, Cr, Lm only).'),
    corners: { kind: 'enum', values: ['extremes', 'nominal', 'random'], default: 'nominal', description: 'nominal: tank at nominal values only; extremes: nominal plus every low/high combination of Lr, Cr, Lm (9 sets; an element with 0 tolerance stays nominal); random: Monte Carlo samples of Lr, Cr, Lm and the turns ratio within their tolerances.' } as EnumSpec,
    samples: q('number', '500', 'Monte Carlo samples (corners: random); each sample is checked at every operating point.', { integer: true, default: 100, atMost: 100000, usual: [10, 10000] }),
    seed: q('number', '42', 'Seed of the Monte Carlo samples (corners: random), a whole number 0 .. 2^53-1: the same seed gives the same samples on any machine and with any --jobs.', { sign: 'nonNegative', integer: true, default: 1, atMost: Number.MAX_SAFE_INTEGER }),
    distribution: { kind: 'enum', values: ['uniform', 'normal'], default: 'uniform', description: 'How a toleranced value spreads (corners: random): uniform over +-tolerance, or normal with the tolerance at 3 sigma, truncated there.' } as EnumSpec,
  },
  compare: {
    vout: limit(0.03, 'Allowed relative difference between FHA and simulated output voltage.'),
    fs: limit(0.05, 'Allowed relative difference between FHA and simulated switching frequency (regulated corners).'),
    gain: limit(0.03, 'Allowed relative difference between FHA and simulated tank gain.'),
    currents: limit(0.1, 'Allowed relative difference for currents (tank rms, magnetizing peak, turn-off current, ...).'),
    voltages: limit(0.1, 'Allowed relative difference for voltages (Cr peak, ...).'),
    measured: limit(0.05, 'Allowed relative difference between the simulation and a measured prototype point (run --measured).'),
  },
  simulation: {
    accuracy: { kind: 'enum', values: ['fast', 'normal', 'fine'], default: 'normal', description: 'Simulation accuracy profile (time step and tolerances).' } as EnumSpec,
    settleTolerance: q('ratio', '0.1%', 'Output voltage within this fraction of its equilibrium (from the charge balance) and steady between the check window\'s halves, for steady state.', { default: 0.001, below: 0.5, usual: [1e-6, 0.01] }),
    chargeBalanceTolerance: q('ratio', '1%', 'Output capacitor charge balance that counts as steady state: |average capacitor current over the check window| / Io (the last 4 cycles of a run, or the whole check run).', { default: 0.01, below: 0.5, usual: [1e-5, 0.05] }),
    periodicityTolerance: q('ratio', '1%', 'Tank periodicity that counts as steady state: change of tank current and Cr voltage over the check window, relative to each one\'s peak.', { default: 0.01, below: 0.5, usual: [1e-5, 0.05] }),
    maxCycles: q('number', '2000', 'Switching periods simulated at most per corner before it is reported as not settled.', { default: 2000, integer: true, plausible: [1, 1e6], usual: [50, 1e5] }),
    zvsThreshold: q('ratio', '5%', 'Switch voltage at turn-on below this fraction of Vin counts as ZVS.', { default: 0.05, below: 0.5 }),
    confirm: q('number', '20', 'Corners of a Monte Carlo run (corners: random) simulated to confirm the screening: the worst per limit plus a seeded random validation set; 0 screens only.', { sign: 'nonNegative', integer: true, default: 20, atMost: 10000 }),
  },
} satisfies Record<string, Record<string, FieldSpec>>;

export type SectionName = keyof typeof SECTION_FIELDS;

/**
 * Compared metrics that `compare` may name one by one, with the group whose tolerance they take
 * otherwise. `fs`, `vout` and `gain` are groups of one. Keep in step with compare/compare.ts
 * (it builds its list from this table).
 */
export const COMPARE_METRIC_GROUP = {
  fs: 'fs',
  vout: 'vout',
  gain: 'gain',
  tankCurrentRms: 'currents',
  tankCurrentPeak: 'currents',
  magnetizingCurrentPeak: 'currents',
  switchCurrentRms: 'currents',
  switchTurnOffCurrent: 'currents',
  diodeCurrentAvg: 'currents',
  diodeCurrentPeak: 'currents',
  diodeCurrentRms: 'currents',
  outputRippleCurrentRms: 'currents',
  crVoltagePeak: 'voltages',
  diodeReverseVoltage: 'voltages',
} as const satisfies Record<string, keyof typeof SECTION_FIELDS.compare>;

/** Status metrics compared as yes/no; `compare` accepts only `off` for them. */
export const COMPARE_STATUS_METRICS = ['zvs', 'zcs', 'region'] as const;

export type ComparedMetric = keyof typeof COMPARE_METRIC_GROUP;
export type CompareKey = ComparedMetric | (typeof COMPARE_STATUS_METRICS)[number];

const rating = (unit: 'volt' | 'ampere', example: string, description: string): QuantitySpec =>
  q(unit, example, description, { plausible: unit === 'volt' ? [1e-3, 1e5] : [1e-6, 1e5] });

/**
 * Leaf fields of the optional `limits` section (`frequency` is a {min, max} mapping read apart).
 * Ratings are upper limits on the quantity with the same name in the results; `derating` scales
 * each rating (bound = rating x derating), not the frequency window or the ZVS margin.
 */
export const LIMIT_FIELDS = {
  zvs: { kind: 'enum', values: ['required', 'ignore'], default: 'ignore', description: 'required: every switch turn-on must be ZVS; ignore: ZVS is not a limit (capacitive operation always is).' } as EnumSpec,
  zvsMargin: q('ratio', '20%', 'The turn-off current must be at least (1 + zvsMargin) x the current that swings the bridge node within the dead time, 2 Coss Vin / deadTime.', { sign: 'nonNegative', atMost: 10 }),
  crVoltage: rating('volt', '450 V', 'Rating for the peak voltage across Cr (the larger of its highest and lowest value; a half-bridge Cr carries Vin/2 DC).'),
  tankCurrentRms: rating('ampere', '3 A', 'Rating for the RMS tank current.'),
  switchCurrentRms: rating('ampere', '2.5 A', 'Rating for the RMS current of the most stressed primary switch.'),
  diodeReverseVoltage: rating('volt', '60 V', 'Rating for the reverse voltage of the most stressed rectifier diode.'),
  diodeCurrentRms: rating('ampere', '15 A', 'Rating for the RMS current of the most stressed rectifier diode.'),
  outputRippleCurrentRms: rating('ampere', '8 A', 'Rating for the RMS ripple current of the output capacitor.'),
  derating: q('ratio', '80%', 'Share of each rating that may be used: bound = rating x derating.', { atMost: 1, default: 1 }),
} satisfies Record<string, FieldSpec>;

/** The controller's switching-frequency window, `limits.frequency: {min, max}`; either may be left out. */
export const FREQUENCY_WINDOW_FIELDS = {
  min: q('hertz', '60 kHz', 'Lowest switching frequency the controller can command.', { plausible: [1, 1e9] }),
  max: q('hertz', '150 kHz', 'Highest switching frequency the controller can command.', { plausible: [1, 1e9] }),
} satisfies Record<string, QuantitySpec>;


/** Sections that may be left out entirely (every field has a default). */
export const OPTIONAL_SECTIONS: readonly SectionName[] = ['tolerances', 'compare', 'simulation'];

/** Items of `operating` (each may be one value or a list, except ratedPower). */
export const OPERATING_FIELDS = {
  vin: q('volt', '390 V', 'DC input voltage(s).', { plausible: [1e-3, 1e5] }),
  ratedPower: q('watt', '240 W', 'Rated output power; loads written in % are shares of it.', { plausible: [1e-3, 1e8] }),
  frequency: q('hertz', '100 kHz', 'Fixed switching frequency (or frequencies), or "regulate" to solve fs for output.voltage.', { plausible: [1, 1e9] }),
} satisfies Record<string, QuantitySpec>;

/** Sanity windows per load kind (percent as a ratio: 1000 % = 10). */
export const LOAD_WINDOWS = {
  percent: [1e-6, 10],
  ohm: [1e-6, 1e9],
  ampere: [1e-9, 1e5],
  watt: [1e-6, 1e8],
} as const;

export const LOAD_DESCRIPTION =
  'Load: a share of ratedPower ("50%"), a resistance ("12 ohm"), a current ("5 A") or a power ("120 W"); must be > 0.';

/** Longest list accepted for operating.vin / load / frequency, and for operating.corners. */
export const MAX_LIST = 100;
export const MAX_CORNERS = 1000;
