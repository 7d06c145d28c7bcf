import { describe, expect, it } from 'vitest';
import { solveSteadyState } from './periodic.js';
import { loadForQ, params, rel, resonance } from './cases.test-support.js';
import { readChecks } from '../../tests/support/checks.js';

// Check values: shared/checks/ideal-gain.json (an independent fixed-step integration of the same
// ideal circuit, spot-checked in ngspice; the table states how they were computed and the published
// analyses they agree with).
interface IdealRow { fn: number; q: number; m: number; mFha: number; mode: string }
const ideal = readChecks<{ rows: IdealRow[] }>('ideal-gain.json');
const example = readChecks<{ fha: Record<string, number>; ideal: { gain: number; mode: string; turnOffCurrent: number; diodePeakOverHalfSine: number; tankCurrentRms: number; tolerance: number } }>('worked-example.json');

describe(`${ideal.title}`, () => {
  for (const { fn, q, m, mFha, mode } of ideal.rows) {
    it(`fn = ${fn}, Q = ${q}: M = ${m} within 0.5 %, mode ${mode}, on the side of FHA (${mFha}) that docs/method.md#fha-limits states`, () => {
      const p = params({ fs: fn * resonance(params()) });
      const r = solveSteadyState(p, loadForQ(p, q));
      expect(rel(r.gain, m)).toBeLessThan(0.005);
      expect(r.mode).toBe(mode);
      if (fn < 0.95) expect(r.gain).toBeGreaterThan(mFha);
      if (fn > 1.05) expect(r.gain).toBeLessThan(mFha);
    });
  }
});

// shared/checks/worked-example.json, "ideal": HB, CT, ideal diodes, 400 V, 50 uH / 50 nF / 250 uH,
// n = 4, RL = 4 ohm, 90 kHz.
describe('worked example, ideal time-domain values (shared/checks/worked-example.json)', () => {
  const r = solveSteadyState(params(), 4);
  const x = example.ideal;
  it(`M = ${x.gain} (${x.tolerance * 100} %) and mode ${x.mode}`, () => {
    expect(rel(r.gain, x.gain)).toBeLessThan(x.tolerance);
    expect(r.mode).toBe(x.mode);
  });
  it(`I_off = ${x.turnOffCurrent} A`, () => expect(rel(r.turnOffCurrent, x.turnOffCurrent)).toBeLessThan(x.tolerance));
  it(`diode peak = ${x.diodePeakOverHalfSine} (pi/2) Io`, () => {
    expect(rel(r.diodeCurrentPeak / ((Math.PI / 2) * r.io), x.diodePeakOverHalfSine)).toBeLessThan(x.tolerance);
  });
  // An independent fixed-step integration of the same orbit gave 4.1893 A, and ngspice-39 gave
  // 4.170 A with exponential diodes against our 4.175 A at the equivalent drop (spice.test.ts
  // repeats that run). FHA (3.853 A) is 8 % low here.
  it(`Ir,rms = ${x.tankCurrentRms} A (0.1 %)`, () => {
    expect(rel(r.tankCurrentRms, x.tankCurrentRms)).toBeLessThan(1e-3);
  });
  it('FHA underestimates Ir,rms and I_off below fr (docs/method.md#turn-off-current)', () => {
    expect(r.tankCurrentRms).toBeGreaterThan(example.fha.tankCurrentRms);
    expect(r.turnOffCurrent).toBeGreaterThan(example.fha.switchTurnOffCurrent);
  });
  // With ideal parts the circuit is linear in the drive, so doubling Vin_eff scales every
  // voltage and current by 2 (superposition, derived); FHA scales the same way.
  it('FB variant (Vin_eff = 400 V): same M, twice the output voltage and currents', () => {
    const fb = solveSteadyState(params({ inverter: 'full-bridge' }), 4);
    expect(rel(fb.gain, r.gain)).toBeLessThan(1e-9);
    expect(rel(fb.vo, 2 * r.vo)).toBeLessThan(1e-9);
    expect(rel(fb.tankCurrentRms, 2 * r.tankCurrentRms)).toBeLessThan(1e-9);
  });
});
