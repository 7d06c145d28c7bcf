import { describe, expect, it } from 'vitest';
import { gapHint, measuredEfficiency, measuredErrors } from './compare.js';
import { measuredCorners, measuredLoad } from './corners.js';
import type { MeasuredPoint } from './types.js';
import { makeDesign } from '../../tests/support/design.js';

const point = (p: Partial<MeasuredPoint>): MeasuredPoint => ({ line: 2, vin: 390, load: { kind: 'ampere', value: 10 }, fs: 98_000, vout: 24, ...p });

describe('measured points against a model', () => {
  it('gives (measured - model) / model for the metrics the point holds', () => {
    const e = measuredErrors(point({ vout: 23.28, tankCurrentRms: 2.1 }), { vout: 24, tankCurrentRms: 2, crVoltagePeak: 300 });
    expect(e!.vout).toBeCloseTo(-0.03, 12);
    expect(e!.tankCurrentRms).toBeCloseTo(0.05, 12);
    expect(e).not.toHaveProperty('crVoltagePeak');
    expect(measuredErrors(point({}), null)).toBeNull();
  });

  it('computes efficiency as Pout / Pin by hand (24 V x 10 A = 240 W out, 390 V x 0.65 A = 253.5 W in)', () => {
    const p = point({ iin: 0.65 });
    // hand calculation: 240 / 253.5 = 0.946746...
    expect(measuredEfficiency(p, measuredLoad(p, makeDesign()))).toBeCloseTo(240 / 253.5, 12);
    expect(measuredEfficiency(point({ pin: 250, iin: 9 }), 2.4)).toBeCloseTo(0.96, 12); // pin wins over iin
    expect(measuredEfficiency(point({}), 2.4)).toBeUndefined();
  });

  it('converts a bench load at the measured output voltage', () => {
    const d = makeDesign({ operating: { ratedPower: 240 } });
    expect(measuredLoad(point({ vout: 23.5 }), d)).toBeCloseTo(2.35, 12); // 23.5 V / 10 A
    expect(measuredLoad(point({ vout: 24, load: { kind: 'watt', value: 120 } }), d)).toBeCloseTo(4.8, 12);
    expect(measuredLoad(point({ vout: 24, load: { kind: 'percent', value: 0.5 } }), d)).toBeCloseTo(4.8, 12);
    const [c] = measuredCorners(d, [point({ line: 7, vout: 23.5, fs: 98_500 })]);
    expect(c).toMatchObject({ id: 'm7_v390_2p35ohm_f98p5k', fs: 98_500, load: 2.35, loadLabel: '10 A', lr: d.tank.lr });
  });
});

describe('gapHint', () => {
  const tol = 0.02;
  it('is silent while every gap is within tolerance', () => {
    expect(gapHint([{ fs: 80e3, iout: 5, error: 0.003 }, { fs: 120e3, iout: 10, error: -0.0035 }, { fs: 100e3, iout: 7, error: 0.001 }], tol)).toBeNull();
  });
  it('names the resonant elements for a gap that follows fs', () => {
    const h = gapHint([80e3, 90e3, 100e3, 110e3].map((fs, i) => ({ fs, iout: [5, 10, 5, 10][i], error: (fs - 95e3) / 1e6 * 4 })), tol);
    expect(h?.pattern).toBe('frequency');
    expect(h?.message).toMatch(/Lm and Cr/);
  });
  it('names the drops and resistances for a gap that follows the load', () => {
    const h = gapHint([2, 4, 6, 8, 10].map((iout, i) => ({ fs: [90e3, 110e3, 95e3, 105e3, 100e3][i], iout, error: 0.01 - 0.006 * iout })), tol);
    expect(h?.pattern).toBe('load');
    expect(h?.message).toMatch(/rectifier forward drop/);
  });
  it('calls a uniform gap an offset', () => {
    const h = gapHint([{ fs: 80e3, iout: 5, error: 0.031 }, { fs: 120e3, iout: 10, error: 0.03 }, { fs: 100e3, iout: 2, error: 0.0305 }], tol);
    expect(h).toMatchObject({ pattern: 'offset' });
    expect(h!.strength).toBeCloseTo(0.0305, 12);
  });
});
