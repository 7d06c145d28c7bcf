import { describe, expect, it } from 'vitest';
import { expandCorners } from './expand.js';
import { predictCorner } from '../fha/predict.js';
import { ksCritical05, ksStatistic } from '../statistics/index.js';
import { makeDesign } from '../../tests/support/design.js';

const random = (samples: number, over: Record<string, unknown> = {}) => makeDesign({
  operating: { vin: [370, 390], load: [{ kind: 'percent', value: 0.5 }, { kind: 'percent', value: 1 }], ratedPower: 240, frequency: 'regulate', corners: [] },
  tolerances: { lr: 0, cr: 0.05, lm: 0, corners: 'random', samples, seed: 42, distribution: 'uniform', ...over },
});

describe('expandCorners with corners: random', () => {
  it('makes one corner per sample and operating point, the sample number in the id', () => {
    const cs = expandCorners(random(20));
    expect(cs).toHaveLength(80);
    expect(cs[17]!.id).toBe('v370_50pct_reg_s0017');
    expect(cs[17]!.sample).toBe(17);
    expect(cs[79]!.id).toBe('v390_100pct_reg_s0019');
    expect(new Set(cs.map((c) => c.id)).size).toBe(80);
  });

  it('keeps every sample\'s id and values when the sample count grows', () => {
    const few = expandCorners(random(20)).filter((c) => c.id.startsWith('v390_100pct'));
    const more = new Map(expandCorners(random(35)).map((c) => [c.id, c]));
    for (const c of few) expect(more.get(c.id)).toEqual(c);
  });

  it('places one sample at every operating point with the same tank', () => {
    const cs = expandCorners(random(5));
    const s3 = cs.filter((c) => c.sample === 3);
    expect(s3).toHaveLength(4);
    for (const c of s3) expect(c.cr).toBe(s3[0]!.cr);
  });

  it('uniform Cr passes the Kolmogorov-Smirnov test at alpha 0.05 (critical value 1.36/sqrt(n), Massey 1951)', () => {
    const d = makeDesign({ tolerances: { lr: 0, cr: 0.05, lm: 0, corners: 'random', samples: 1000, seed: 9, distribution: 'uniform' } });
    const cr = expandCorners(d).map((c) => c.cr);
    expect(cr).toHaveLength(1000);
    const lo = d.tank.cr * 0.95;
    const hi = d.tank.cr * 1.05;
    expect(ksStatistic(cr, (x) => Math.min(1, Math.max(0, (x - lo) / (hi - lo))))).toBeLessThan(ksCritical05(1000));
  });

  it('the resonant frequencies follow fr = 1/(2 pi sqrt(Lr Cr)) exactly: fr sqrt(Cr) is the same for every sample', () => {
    const d = random(200);
    const nominal = 1 / (2 * Math.PI * Math.sqrt(d.tank.lr * d.tank.cr));
    for (const c of expandCorners(d)) {
      const fr = predictCorner(d, c).fr;
      expect(fr / (nominal * Math.sqrt(d.tank.cr / c.cr))).toBeCloseTo(1, 12);
    }
  });

  it('varies the turns ratio only when it has a tolerance, and keeps it in every corner\'s inputs', () => {
    expect(expandCorners(random(10)).every((c) => c.turnsRatio === 4)).toBe(true);
    const cs = expandCorners(random(50, { turnsRatio: 0.01 }));
    expect(Math.max(...cs.map((c) => Math.abs(c.turnsRatio / 4 - 1)))).toBeLessThanOrEqual(0.01);
    expect(new Set(cs.map((c) => c.turnsRatio)).size).toBe(50);
    // Cr's values do not move when another element gets a tolerance (one stream per element)
    expect(cs.map((c) => c.cr)).toEqual(expandCorners(random(50)).map((c) => c.cr));
  });
});
