import { describe, expect, it } from 'vitest';
import { solveSteadyState } from './periodic.js';
import { params, rel } from './cases.test-support.js';
import type { SteadyStateResult, TdParams } from './types.js';

const realistic: Partial<TdParams> = { coss: 300e-12, deadTime: 250e-9, vf: 0.7, rd: 0.02, rdsOn: 0.1 };

function same(a: SteadyStateResult, b: SteadyStateResult) {
  expect(rel(a.vo, b.vo)).toBeLessThan(1e-8);
  expect(a.mode).toBe(b.mode);
  expect(rel(a.tankCurrentRms, b.tankCurrentRms)).toBeLessThan(1e-8);
  expect(rel(a.power.input, b.power.input)).toBeLessThan(1e-8);
}

// Circuit identities (derived here): a full bridge at Vin is a half bridge at 2 Vin shifted
// by Vin (the Cr takes the DC), with two switches in the path (so rdsOn/2 each for the same
// resistance) and each leg of 2 Coss swinging half the voltage (so 2 Coss per switch for the
// same dead-time charge). A full-bridge rectifier has two diodes in the path: VF/2 and rd/2 each
// equal one diode of a center-tapped one.
describe('topology equivalences', () => {
  for (const fs of [70e3, 90e3, 130e3]) {
    for (const rl of [2, 4, 20]) {
      it(`FB inverter at Vin = 200 V equals HB at 400 V (fs ${fs / 1e3} kHz, RL ${rl} ohm)`, () => {
        const hb = solveSteadyState(params({ ...realistic, fs }), rl);
        const fb = solveSteadyState(params({ ...realistic, fs, inverter: 'full-bridge', vin: 200, coss: 600e-12, rdsOn: 0.05 }), rl);
        same(fb, hb);
        expect(fb.zvs).toBe(hb.zvs);
        expect(rel(fb.seed.vcr, hb.seed.vcr - 200)).toBeLessThan(1e-8); // Cr DC: Vin/2 vs 0
        expect(fb.seed.vNode).toEqual([0, 200]);
      });
      it(`FB rectifier with VF/2, rd/2 equals CT (fs ${fs / 1e3} kHz, RL ${rl} ohm)`, () => {
        const ct = solveSteadyState(params({ ...realistic, fs }), rl);
        const fbr = solveSteadyState(params({ ...realistic, fs, rectifier: 'full-bridge', vf: 0.35, rd: 0.01 }), rl);
        same(fbr, ct);
      });
    }
  }
  it('ideal FB inverter gives the HB gain at Vin_eff = Vin (docs/method.md#gain, k_b)', () => {
    const hb = solveSteadyState(params({ fs: 75e3 }), 3);
    const fb = solveSteadyState(params({ fs: 75e3, inverter: 'full-bridge', vin: 200 }), 3);
    expect(rel(fb.gain, hb.gain)).toBeLessThan(1e-9);
  });
});
