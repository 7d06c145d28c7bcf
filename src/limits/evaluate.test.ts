import { describe, expect, it } from 'vitest';
import { evaluateLimits, outsideInSimulation, usage, worstCheck, zvsCurrent } from './evaluate.js';
import { makeDesign } from '../../tests/support/design.js';
import { expandCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import type { Design } from '../design/types.js';

// Hand-computed rows. The ZVS current is the charge balance of the bridge node (common practice):
// I_zvs = 2 Coss Vin / td = 2 x 150 pF x 390 V / 200 ns = 0.585 A; with a 20 % margin the bound is 0.702 A.
const design: Design = makeDesign({
  switches: { deadTime: 200e-9, coss: 150e-12, rdsOn: 0.1 },
  limits: {
    frequency: { min: 60e3, max: 150e3 }, zvs: 'required', zvsMargin: 0.2, crVoltage: 450, tankCurrentRms: 3,
    switchCurrentRms: 2.5, diodeReverseVoltage: 60, diodeCurrentRms: 15, outputRippleCurrentRms: 8, derating: 0.8,
  },
});
const VIN = 390;
const fha = { fs: 100e3, region: 'inductive', zvs: true, switchTurnOffCurrent: 0.71, crVoltagePeak: 350, crVoltageMin: 40,
  tankCurrentRms: 2.39, switchCurrentRms: 1.7, diodeReverseVoltage: 48.5, diodeCurrentRms: 8, outputRippleCurrentRms: 4.8 };

const byName = (checks: ReturnType<typeof evaluateLimits>) => Object.fromEntries(checks.map((c) => [c.limit, c]));

describe('zvsCurrent', () => {
  it('is 2 Coss Vin / td, the same for a half- and a full-bridge (per leg)', () => {
    expect(zvsCurrent(design, VIN)).toBeCloseTo(0.585, 12);
    const fb = makeDesign({ topology: { inverter: 'full-bridge' }, switches: { deadTime: 200e-9, coss: 150e-12 } });
    expect(zvsCurrent(fb, VIN)).toBeCloseTo(0.585, 12);
  });
  it('agrees with the current FHA reports as needed for ZVS', () => {
    const d = makeDesign();
    const corner = expandCorners(d)[0]!;
    expect(zvsCurrent(d, corner.vin)).toBeCloseTo(predictCorner(d, corner).zvsRequiredCurrent, 12);
    // by hand: 2 x 300 pF x 400 V / 250 ns = 0.96 A
    expect(zvsCurrent(d, 400)).toBeCloseTo(0.96, 12);
  });
});

describe('evaluateLimits', () => {
  it('bounds: derating scales the ratings only; the margin multiplies the ZVS current', () => {
    const c = byName(evaluateLimits(design, VIN, fha, null));
    expect(Object.keys(c)).toEqual(['region', 'frequency.min', 'frequency.max', 'zvs', 'zvsMargin', 'crVoltage', 'tankCurrentRms',
      'switchCurrentRms', 'diodeReverseVoltage', 'diodeCurrentRms', 'outputRippleCurrentRms']);
    expect(c['frequency.min']!.bound).toBe(60e3);
    expect(c['frequency.max']!.bound).toBe(150e3);
    expect(c.zvsMargin!.bound).toBeCloseTo(0.702, 12);
    expect(c.crVoltage!.bound).toBeCloseTo(360, 12);
    expect(c.tankCurrentRms!.bound).toBeCloseTo(2.4, 12);
    expect(c.switchCurrentRms!.bound).toBeCloseTo(2.0, 12);
    expect(c.diodeReverseVoltage!.bound).toBeCloseTo(48, 12);
    expect(c.diodeCurrentRms!.bound).toBeCloseTo(12, 12);
    expect(c.outputRippleCurrentRms!.bound).toBeCloseTo(6.4, 12);
    expect(c.region).toMatchObject({ bound: 'inductive', kind: 'state' });
    expect(c.zvs).toMatchObject({ bound: true, kind: 'state' });
  });

  it('FHA row: within or outside against each bound; no sim or ideal column', () => {
    const c = byName(evaluateLimits(design, VIN, fha, null));
    expect(c.zvsMargin!.fha).toEqual({ value: 0.71, within: true }); // 0.71 >= 0.702
    expect(c.crVoltage!.fha).toEqual({ value: 350, within: true }); // 350 <= 360
    expect(c.tankCurrentRms!.fha).toEqual({ value: 2.39, within: true }); // 2.39 <= 2.4
    expect(c.diodeReverseVoltage!.fha).toEqual({ value: 48.5, within: false }); // 48.5 > 48
    for (const x of Object.values(c)) expect([x.sim, x.ideal, x.flip]).toEqual([null, null, false]);
  });

  it('simulation row: flips where FHA and simulation disagree; Cr peak takes the larger magnitude', () => {
    const sim = { ...fha, switchTurnOffCurrent: 0.70, crVoltagePeak: 300, crVoltageMin: -370, tankCurrentRms: 2.41, diodeReverseVoltage: 47.9 };
    const checks = evaluateLimits(design, VIN, fha, sim);
    const c = byName(checks);
    expect(c.zvsMargin).toMatchObject({ sim: { value: 0.7, within: false }, flip: true }); // 0.70 < 0.702
    expect(c.crVoltage).toMatchObject({ sim: { value: 370, within: false }, flip: true }); // |-370| > 360
    expect(c.tankCurrentRms).toMatchObject({ sim: { value: 2.41, within: false }, flip: true });
    expect(c.diodeReverseVoltage).toMatchObject({ fha: { within: false }, sim: { value: 47.9, within: true }, flip: true }); // the reverse flip
    expect(c.diodeCurrentRms).toMatchObject({ sim: { value: 8, within: true }, flip: false });
    expect(outsideInSimulation(checks)).toBe(true);
    expect(checks.filter((x) => x.flip).map((x) => x.limit)).toEqual(['zvsMargin', 'crVoltage', 'tankCurrentRms', 'diodeReverseVoltage']);
  });

  it('capacitive operation is outside even without a limits section; the ideal column is read by the same names', () => {
    const bare = makeDesign();
    const checks = evaluateLimits(bare, VIN, { region: 'inductive' }, { region: 'capacitive' }, { region: 'capacitive' });
    expect(checks).toEqual([{ limit: 'region', bound: 'inductive', kind: 'state', fha: { value: 'inductive', within: true },
      ideal: { value: 'capacitive', within: false }, sim: { value: 'capacitive', within: false }, flip: true }]);
    expect(outsideInSimulation(checks)).toBe(true);
  });

  it('a missing value (FHA unreachable) is neither within nor outside and never flips', () => {
    const c = byName(evaluateLimits(design, VIN, { fs: null, region: null }, { ...fha, fs: 155e3 }));
    expect(c['frequency.max']).toMatchObject({ fha: { value: null, within: null }, sim: { value: 155e3, within: false }, flip: false });
    expect(c.region!.fha).toEqual({ value: null, within: null });
  });

  it('the window edges are inside (min <= fs <= max)', () => {
    const c = byName(evaluateLimits(design, VIN, { fs: 60e3 }, { fs: 150e3 }));
    expect([c['frequency.min']!.fha.within, c['frequency.max']!.sim!.within]).toEqual([true, true]);
  });
});

describe('usage and worstCheck', () => {
  it('value / bound above, bound / value below; the worst simulated check wins', () => {
    const checks = evaluateLimits(design, VIN, fha, { ...fha, tankCurrentRms: 2.16, switchTurnOffCurrent: 0.9 });
    const c = byName(checks);
    expect(usage(c.tankCurrentRms!, c.tankCurrentRms!.sim)).toBeCloseTo(0.9, 12); // 2.16 / 2.4
    expect(usage(c.zvsMargin!, c.zvsMargin!.sim)).toBeCloseTo(0.78, 12); // 0.702 / 0.9
    const worst = worstCheck(checks)!;
    expect(worst.check.limit).toBe('diodeReverseVoltage'); // 48.5 / 48
    expect(worst.usage).toBeCloseTo(48.5 / 48, 12);
    expect(worst.source).toBe('sim');
  });
  it('a state not met is the worst; no checks give null', () => {
    const checks = evaluateLimits(design, VIN, fha, { ...fha, zvs: false });
    expect(worstCheck(checks)!.check.limit).toBe('zvs');
    expect(worstCheck([])).toBeNull();
  });
});
