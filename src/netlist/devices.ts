import type { Design } from '../design/types.js';

/** Thermal voltage kT/q at 27 degC (300.15 K), V; CODATA 2018 exact constants. */
export const THERMAL_VOLTAGE = (1.380649e-23 * 300.15) / 1.602176634e-19;

/** Diode current at which the fitted model drops exactly forwardVoltage (+ I rs): rated output current, A. */
export function diodeFitCurrent(design: Design): number {
  return design.operating.ratedPower / design.output.voltage;
}

/** Reverse saturation current of the fitted diode relative to the fit current (leakage 1e-9 of rated). */
export const DIODE_LEAKAGE_RATIO = 1e-9;

/** Smallest knee voltage the fitted diode is given: an "ideal" (0 V) diode is modelled with 0.2 V at rated current (a steeper exponential makes ngspice's Newton steps unreliable: reverse currents of amperes were seen at N = 0.1). */
export const MIN_KNEE_VOLTAGE = 0.2;

/**
 * Fitted rectifier diode: V = N Vt ln(I/Is) + I rs, with Is = 1e-9 of the rated output current (so
 * the reverse leakage stays negligible) and the emission coefficient N chosen so that the drop at
 * rated current is forwardVoltage + I rs. A large Is would make a low-drop diode conduct Is in
 * reverse, so the fit moves N, not Is.
 */
export function diodeFit(design: Design): { is: number; n: number; rs: number } {
  const vf = Math.max(design.rectifier.forwardVoltage, MIN_KNEE_VOLTAGE);
  const is = diodeFitCurrent(design) * DIODE_LEAKAGE_RATIO;
  return { is, n: vf / (THERMAL_VOLTAGE * Math.log(1 / DIODE_LEAKAGE_RATIO)), rs: Math.max(design.rectifier.resistance, 1e-6) };
}

/** kT/q ln(1/DIODE_LEAKAGE_RATIO), V: the emission coefficient is the knee voltage over this. */
const FIT_VOLTS = THERMAL_VOLTAGE * Math.log(1 / DIODE_LEAKAGE_RATIO);

/**
 * The fitted diode's model card, written over the deck parameters vf, rdiode and ifit (see diodeFit;
 * the same clamps as expressions), or '' when the design brings its own diode model.
 */
export function diodeModelCard(design: Design): string {
  if (design.devices.diodeModel) return '';
  const is = `ifit*${String(DIODE_LEAKAGE_RATIO)}`;
  const n = `max(vf, ${String(MIN_KNEE_VOLTAGE)})/${String(FIT_VOLTS)}`;
  return `.model tk_d d(is={${is}} n={${n}} rs={max(rdiode, 1e-6)} cjo=0 tt=0)\n`;
}

/** Rectifier diode i between anode and cathode: the fitted model, or the user's model or 2-pin subcircuit. */
export function diodeInstance(design: Design, i: number, anode: string, cathode: string): string {
  const m = design.devices.diodeModel;
  if (!m) return `D${i} ${anode} ${cathode} tk_d`;
  return isSubckt(m.text, m.name) ? `XD${i} ${anode} ${cathode} ${m.name}` : `D${i} ${anode} ${cathode} ${m.name}`;
}

/**
 * Bridge switch i (drain, source, gate command node). Default: an ideal switch with Ron = rdsOn and
 * an antiparallel body diode. With a user switch model (a 3-pin subcircuit: drain gate source) the
 * 0/1 gate command drives it through a 12 V source referred to the switch's source.
 */
export function switchInstance(design: Design, i: number, drain: string, source: string, gate: string): string {
  const m = design.devices.switchModel;
  if (!m) return `S${i} ${drain} ${source} ${gate} 0 tk_sw\nDb${i} ${source} ${drain} tk_body`;
  return `Eg${i} gd${i} ${source} ${gate} 0 12\nRg${i} gd${i} gi${i} 2\nXS${i} ${drain} gi${i} ${source} ${m.name}`;
}

function isSubckt(text: string, name: string): boolean {
  return new RegExp(`^\\s*\\.subckt\\s+${name}\\b`, 'im').test(text);
}

/** User model text (already line-filtered by the loader), inlined once. */
export function userModelCards(design: Design): string {
  const parts = [design.devices.diodeModel?.text, design.devices.switchModel?.text].filter(Boolean);
  return parts.length ? `* user device models (inlined, filtered)\n${parts.join('\n')}\n` : '';
}
