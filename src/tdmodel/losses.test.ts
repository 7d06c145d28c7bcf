import { describe, expect, it } from 'vitest';
import { solveSteadyState } from './periodic.js';
import { balance, params, rel, resonance } from './cases.test-support.js';
import type { TdParams } from './types.js';

const lossy: Partial<TdParams> = { coss: 300e-12, deadTime: 250e-9, vf: 0.7, rd: 0.02, rdsOn: 0.1 };

// Energy conservation (physics identity): the input power Vin * (average source current), taken
// from the charge drawn from the rail, equals Vo Io plus the losses in the switch and diode
// resistances, the diode drops and the node capacitance dumped at hard-switched edges.
describe('energy balance', () => {
  const cases: [string, Partial<TdParams>, number][] = [
    ['HB CT below fr, ZVS', {}, 4],
    ['HB CT below fr, light load', {}, 40],
    ['HB CT above fr', { fs: 140e3 }, 4],
    ['HB CT capacitive, hard switching', { fs: 60e3 }, 4],
    ['HB CT long dead time, current reverses', { deadTime: 1e-6 }, 4],
    ['HB CT large Coss, partial ZVS', { coss: 2e-9 }, 10],
    ['FB CT above fr', { inverter: 'full-bridge', fs: 140e3 }, 8],
    ['FB FBR below fr, hard switching', { inverter: 'full-bridge', rectifier: 'full-bridge', coss: 3e-9 }, 16],
    ['HB FBR no dead time (hard edges)', { rectifier: 'full-bridge', deadTime: 0 }, 4],
  ];
  for (const [name, over, rl] of cases) {
    it(`${name}: input = output + losses to 1e-6`, () => {
      const r = solveSteadyState(params({ ...lossy, ...over }), rl);
      expect(Math.abs(balance(r.power))).toBeLessThan(1e-6);
      expect(rel(r.power.output, r.vo * r.io)).toBeLessThan(1e-6);
    });
  }

  it('without dead time each switch carries Ir,rms / sqrt 2 (docs/method.md#switches)', () => {
    const r = solveSteadyState(params({ fs: 75e3 }), 3);
    expect(rel(r.switchCurrentRms, r.tankCurrentRms / Math.SQRT2)).toBeLessThan(1e-9);
  });
});

// docs/method.md#diodes, #output-ripple: at fs = fr with Lm >> Lr the secondary current is a train of
// half sines of peak (pi/2) Io: diode rms (pi/4) Io, average Io/2, output ripple 0.483426 Io.
describe('rectifier stresses in the half-sine limit (docs/method.md#diodes, #output-ripple)', () => {
  it('Ln = 2000 at fr: diode peak, rms, average and capacitor ripple', () => {
    const p = params({ lm: 2000 * 50e-6 });
    const r = solveSteadyState({ ...p, fs: resonance(p) }, 4);
    expect(rel(r.diodeCurrentPeak, (Math.PI / 2) * r.io)).toBeLessThan(1e-3);
    expect(rel(r.diodeCurrentRms, (Math.PI / 4) * r.io)).toBeLessThan(1e-3);
    expect(rel(r.diodeCurrentAvg, r.io / 2)).toBeLessThan(1e-9);
    expect(rel(r.outputRippleCurrentRms, 0.483426 * r.io)).toBeLessThan(2e-3);
  });
});

describe('dead time and ZVS (docs/method.md#zvs)', () => {
  it('ample turn-off current: ZVS, node swing time = 2 Coss Vin / I_off (charge, condition 2)', () => {
    const r = solveSteadyState(params({ coss: 300e-12, deadTime: 250e-9 }), 4);
    expect(r.zvs).toBe(true);
    expect(r.bridgeVoltageAtGate).toBe(400);
    expect(r.power.hardSwitching).toBe(0);
    expect(rel(r.zvsTransitionTime!, (600e-12 * 400) / r.turnOffCurrent)).toBeLessThan(0.02);
    expect(r.turnOnCurrent).toBeLessThan(0); // body diode conducts at the gate edge (4.3)
  });
  it('too much Coss: the node reaches I_off td / (2 Coss), the rest is dumped (0.5 C dV^2 per edge)', () => {
    const p = params({ coss: 2e-9, deadTime: 250e-9 });
    const r = solveSteadyState(p, 4);
    expect(r.zvs).toBe(false);
    expect(r.zvsTransitionTime).toBeNull();
    expect(rel(r.bridgeVoltageAtGate, (r.turnOffCurrent * p.deadTime) / 4e-9)).toBeLessThan(0.03);
    const dumped = 2 * p.fs * 0.5 * 4e-9 * (400 - r.bridgeVoltageAtGate) ** 2;
    expect(rel(r.power.hardSwitching, dumped)).toBeLessThan(1e-9);
  });
  it('dead time longer than the swing plus the current reversal: node leaves the rail, hard turn-on (condition 4)', () => {
    const r = solveSteadyState(params({ coss: 300e-12, deadTime: 1e-6 }), 4);
    expect(r.zvsTransitionTime).not.toBeNull();
    expect(r.turnOnCurrent).toBeGreaterThan(0);
    expect(r.zvs).toBe(false);
    expect(r.bridgeVoltageAtGate).toBeLessThan(400);
  });
  it('capacitive operation (below the zero-phase boundary): current leads, no ZVS (condition 1)', () => {
    const r = solveSteadyState(params({ coss: 300e-12, deadTime: 250e-9, fs: 60e3 }), 4);
    expect(r.turnOnCurrent).toBeGreaterThan(0);
    expect(r.zvs).toBe(false);
  });
  it('no node capacitance: the node follows the current at once (ZVS, zero swing time)', () => {
    const r = solveSteadyState(params({ deadTime: 250e-9 }), 4);
    expect(r.zvs).toBe(true);
    expect(r.zvsTransitionTime).toBe(0);
  });
  it('no dead time with Coss: every edge is hard, 2 fs 0.5 (2 Coss) Vin^2', () => {
    const r = solveSteadyState(params({ coss: 300e-12 }), 4);
    expect(r.zvs).toBe(false);
    expect(rel(r.power.hardSwitching, 2 * 90e3 * 0.5 * 600e-12 * 400 ** 2)).toBeLessThan(1e-12);
  });
});
