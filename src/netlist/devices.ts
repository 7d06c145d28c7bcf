import type { Design } from '../design/types.js';
import { spiceNumber } from './render.js';

/** Thermal voltage kT/q at 27 degC (300.15 K), V; CODATA 2018 exact constants. */
export const THERMAL_VOLTAGE = (1.380649e-23 * 300.15) / 1.602176634e-19;

/** Diode current at which the fitted model drops exactly forwardVoltage (+ I rs): rated output current, A. */
export function diodeFitCurrent(design: Design): number {
  return design.operating.ratedPower / design.output.voltage;
}

/**
 * Saturation current of the fitted rectifier diode (n = 1): V = Vt ln(I/Is) + I rs equals
 * forwardVoltage + I rs at the rated current. A forwardVoltage of 0 (ideal) is modelled with a
 * drop of one thermal voltage (about 26 mV) at rated current, the smallest that still converges.
 */
export function diodeSaturationCurrent(design: Design): number {
  const vf = Math.max(design.rectifier.forwardVoltage, THERMAL_VOLTAGE);
  return diodeFitCurrent(design) * Math.exp(-vf / THERMAL_VOLTAGE);
}

export function diodeModelCard(design: Design): string {
  if (design.devices.diodeModel) return '';
  const is = spiceNumber(diodeSaturationCurrent(design));
  const rs = spiceNumber(Math.max(design.rectifier.resistance, 1e-6));
  return `.model tk_d d(is=${is} n=1 rs=${rs} cjo=0 tt=0)\n`;
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
