/**
 * TEST-ONLY parameter sets. The default is the worked example of shared/checks/worked-example.json
 * (HB, CT, 400 V, Lr 50 uH, Cr 50 nF, Lm 250 uH, n = 4) with ideal parts (no dead time,
 * no Coss, ideal diodes and switches); every test states what it changes.
 */
import type { TdParams } from './types.js';

export const EXAMPLE: TdParams = {
  inverter: 'half-bridge', rectifier: 'center-tapped', vin: 400, fs: 90e3,
  lr: 50e-6, cr: 50e-9, lm: 250e-6, n: 4, coss: 0, deadTime: 0, vf: 0, rd: 0, rdsOn: 0,
};

/** The example with some fields replaced. */
export const params = (over: Partial<TdParams> = {}): TdParams => ({ ...EXAMPLE, ...over });

export const resonance = (p: TdParams) => 1 / (2 * Math.PI * Math.sqrt(p.lr * p.cr));

/** Load resistance giving the FHA quality factor q: Q = Zr / Rac, Rac = 8 n^2 RL / pi^2 (docs/method.md#fha-rectifier). */
export const loadForQ = (p: TdParams, q: number) => (Math.PI ** 2 * Math.sqrt(p.lr / p.cr)) / (8 * p.n * p.n * q);

export const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Input power minus output power and every modelled loss, relative to the input power. */
export function balance(pw: { input: number; output: number; switchConduction: number; diodeResistive: number; diodeForward: number; hardSwitching: number }) {
  const out = pw.output + pw.switchConduction + pw.diodeResistive + pw.diodeForward + pw.hardSwitching;
  return (pw.input - out) / pw.input;
}
