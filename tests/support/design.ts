import type { Design } from '../../src/design/types.js';

type DeepPartial<T> = { [K in keyof T]?: T[K] extends object ? (T[K] extends unknown[] ? T[K] : DeepPartial<T[K]>) : T[K] };

/**
 * A Design built in code for tests. Defaults are the worked example of shared/checks/worked-example.json
 * (HB, CT, ideal diodes, Vin 400 V, Lr 50 uH, Cr 50 nF, Lm 250 uH, n 4, RL 4 ohm, fs 90 kHz).
 */
export function makeDesign(over: DeepPartial<Design> = {}): Design {
  const base: Design = {
    name: 'test',
    topology: { inverter: 'half-bridge', rectifier: 'center-tapped' },
    tank: { lr: 50e-6, cr: 50e-9, lm: 250e-6, turnsRatio: 4, integrated: false },
    switches: { deadTime: 250e-9, coss: 300e-12, rdsOn: 0.05 },
    rectifier: { forwardVoltage: 0, resistance: 0 },
    output: { voltage: 52, capacitance: 100e-6, esr: 0.01 },
    operating: { vin: [400], load: [{ kind: 'ohm', value: 4 }], ratedPower: 676, frequency: [90e3], corners: [] },
    tolerances: { lr: 0, cr: 0, lm: 0, corners: 'nominal' },
    compare: { vout: 0.03, fs: 0.05, gain: 0.03, currents: 0.1, voltages: 0.1, measured: 0.05 },
    simulation: { accuracy: 'normal', settleTolerance: 0.001, chargeBalanceTolerance: 0.01, periodicityTolerance: 0.01, maxCycles: 2000, zvsThreshold: 0.05 },
    devices: {},
  };
  return merge(base, over) as Design;
}

function merge(a: any, b: any): any {
  if (b === undefined) return a;
  if (Array.isArray(b) || typeof b !== 'object' || b === null) return b;
  const out: any = { ...a };
  for (const [k, v] of Object.entries(b)) out[k] = merge(a?.[k], v);
  return out;
}
