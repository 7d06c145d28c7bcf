import { describe, expect, it } from 'vitest';
import { monteCarloStatistics } from './summary.js';
import { clopperPearson } from './interval.js';
import { drawSamples } from './sample.js';
import type { CheckLike, SampleCornerLike } from './corners.js';

// Synthetic corners: two operating points per sample, one upper-limit check "crVoltage" whose
// value is a given function of the sample's Cr deviation (monotonic, symmetric about nominal).
function corners(n: number, value: (d: number, op: number) => number, bound: number): SampleCornerLike[] {
  return drawSamples(11, n, { lr: 0.02, cr: 0.05, lm: 0.1, turnsRatio: 0 }, 'uniform').flatMap((s) => [0, 1].map((op) => {
    const v = value(s.deviation.cr, op);
    const check: CheckLike = { limit: 'crVoltage', kind: 'max', bound, fha: { value: v, within: v <= bound }, ideal: { value: v * 1.001, within: v * 1.001 <= bound }, sim: null };
    return { id: `v${op}_100pct_reg_s${String(s.index).padStart(4, '0')}`, inputs: { vin: 390, load: 2.4, fs: null, sample: s.index, deviation: s.deviation }, status: 'screened', checks: [check], ideal: {}, sim: null };
  }));
}
const facts = { seed: 11, distribution: 'uniform' as const };

describe('monteCarloStatistics: yield', () => {
  it('is 100 % with wide limits, the interval by Clopper-Pearson', () => {
    const s = monteCarloStatistics(corners(200, (d) => 400 * (1 + d), 1000), facts);
    expect(s.samples).toBe(200);
    expect(s.yield.fha).toMatchObject({ value: 1, meets: 200, unknown: 0, high: 1 });
    expect(s.yield.fha.low).toBeCloseTo(0.025 ** (1 / 200), 9); // closed form of the exact interval at n of n
    expect(s.yield.ideal.value).toBe(1);
  });

  it('is about 50 %, inside its own interval, with the limit at the nominal value of a symmetric metric', () => {
    const s = monteCarloStatistics(corners(400, (d) => 400 * (1 + d), 400), facts);
    expect(s.yield.fha.low).toBeLessThan(0.5);
    expect(s.yield.fha.high).toBeGreaterThan(0.5);
    expect(s.yield.fha).toMatchObject(clopperPearson(s.yield.fha.meets, 400));
  });

  it('is 0 % when every sample is outside at one operating point only', () => {
    const s = monteCarloStatistics(corners(50, (d, op) => (op === 1 ? 900 : 400) * (1 + d), 800), facts);
    expect(s.yield.fha).toMatchObject({ value: 0, low: 0, meets: 0 });
    expect(s.yield.fha.high).toBeCloseTo(1 - 0.025 ** (1 / 50), 9);
  });

  it('counts a sample with a missing value as not meeting, and says how many', () => {
    const cs = corners(10, (d) => 400 * (1 + d), 1000);
    cs[0]!.checks = [{ ...cs[0]!.checks![0]!, ideal: null }];
    const s = monteCarloStatistics(cs, facts);
    expect(s.yield.ideal).toMatchObject({ meets: 9, unknown: 1, value: 0.9 });
    expect(s.yield.fha.meets).toBe(10);
  });
});

describe('monteCarloStatistics: worst sample and sensitivity', () => {
  it('names the sample with the highest usage and ranks Cr first when the value follows Cr only', () => {
    const cs = corners(300, (d, op) => (op ? 420 : 400) * (1 + d), 450);
    const s = monteCarloStatistics(cs, facts);
    const maxCr = Math.max(...cs.map((c) => c.inputs.deviation!.cr!));
    expect(s.worst[0]).toMatchObject({ limit: 'crVoltage', source: 'ideal' });
    expect(s.worst[0]!.id).toMatch(/^v1_/);
    expect(s.worst[0]!.usage).toBeCloseTo((420 * (1 + maxCr) * 1.001) / 450, 12);
    expect(s.sensitivity[0]!.ranking[0]).toMatchObject({ parameter: 'cr' });
    expect(s.sensitivity[0]!.ranking[0]!.rho).toBeCloseTo(1, 12);
    expect(s.operatingPoints).toEqual(['v0_100pct_reg', 'v1_100pct_reg']);
  });
});

describe('monteCarloStatistics: confirmed', () => {
  it('counts confirmed corners, their samples and the samples outside in simulation; agreement per metric', () => {
    const cs = corners(20, (d) => 400 * (1 + d), 410);
    const sims = [0, 1, 2, 5].map((i) => cs[i]!);
    sims.forEach((c, k) => {
      c.sim = { fs: 100e3, vout: 24 };
      c.ideal = { fs: 100e3 * (1 + 0.01 * k), vout: 24 };
      c.status = 'ok';
      c.checks = [{ ...c.checks![0]!, sim: { value: 420, within: k !== 1 } }];
    });
    const s = monteCarloStatistics(cs, facts);
    expect(s.confirmed).toMatchObject({ count: 4, samples: 3, outside: 1 });
    const fs = s.confirmed.agreement.find((a) => a.metric === 'fs')!;
    expect(fs).toMatchObject({ count: 4, worstId: sims[3]!.id });
    expect(fs.median).toBeCloseTo(0.015, 12);
    expect(fs.worst).toBeCloseTo(0.03, 12);
    expect(s.confirmed.agreement.find((a) => a.metric === 'vout')!.worst).toBe(0);
  });
});
