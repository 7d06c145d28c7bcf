import { describe, expect, it } from 'vitest';
import { classifyCause, CIRCUIT_FACTOR } from './cause.js';
import { compareCorner } from './compare.js';
import { predictCorner } from '../fha/predict.js';
import { expandCorners } from '../corners/expand.js';
import { makeDesign } from '../../tests/support/design.js';
import type { SimMetrics } from '../measure/types.js';
import { simLike } from './simMetrics.test-support.js';

const design = makeDesign(); // 6.3 tank at 90 kHz: below resonance, FHA under-predicts the gain
const corner = expandCorners(design)[0]!;
const fha = predictCorner(design, corner);

const metrics = (over: Partial<SimMetrics>): SimMetrics => simLike(fha, { zvsMarginTime: 2e-7, ...over });

describe('classifyCause on synthetic rows', () => {
  it('approximation: simulation within the tolerance of the ideal model (10 %: 1.08 vs 1.00)', () => {
    const v = classifyCause('magnetizingCurrentPeak', 1.08, 1.0, 0.1);
    expect(v.cause).toBe('approximation');
    expect(v.note).toMatch(/triangle/);
  });
  it('circuit: beyond the tolerance but within CIRCUIT_FACTOR times it (1.15 vs 1.00 at 10 %)', () => {
    expect(CIRCUIT_FACTOR).toBe(2);
    const v = classifyCause('diodeCurrentPeak', 1.15, 1.0, 0.1);
    expect(v.cause).toBe('circuit');
    expect(v.note).toMatch(/junction capacitance/);
  });
  it('unexplained: beyond CIRCUIT_FACTOR tolerances (1.25 vs 1.00 at 10 %), and with no ideal value', () => {
    expect(classifyCause('tankCurrentRms', 1.25, 1.0, 0.1).cause).toBe('unexplained');
    expect(classifyCause('tankCurrentRms', 1.25, null, 0.1).cause).toBe('unexplained');
  });
  it('diode reverse voltage: ringing up to twice the ideal value is circuit, beyond it or below the ideal value unexplained', () => {
    expect(classifyCause('diodeReverseVoltage', 90, 50, 0.1).cause).toBe('circuit');
    expect(classifyCause('diodeReverseVoltage', 101, 50, 0.1).cause).toBe('unexplained');
    expect(classifyCause('diodeReverseVoltage', 40, 50, 0.1).cause).toBe('unexplained');
  });
  it('status metrics: agreement is approximation; a flip is circuit only when marginal', () => {
    const sim = metrics({ zcs: false, zcsRatio: 0.12 });
    expect(classifyCause('zcs', false, false, null).cause).toBe('approximation');
    expect(classifyCause('zcs', false, true, null, { sim, ideal: metrics({ zcsRatio: 0.04 }), deadTime: 250e-9 }).cause).toBe('circuit');
    expect(classifyCause('zcs', false, true, null, { sim: metrics({ zcs: false, zcsRatio: 0.6 }), ideal: metrics({ zcsRatio: 0 }), deadTime: 250e-9 }).cause).toBe('unexplained');
    expect(classifyCause('zvs', false, true, null, { sim: metrics({ zvs: false, zvsState: 'hard' }), ideal: metrics({ zvsMarginTime: 2e-7 }), deadTime: 250e-9 }).cause).toBe('unexplained');
    expect(classifyCause('zvs', false, true, null, { sim: metrics({ zvs: false, zvsState: 'hard' }), ideal: metrics({ zvsMarginTime: 3e-8 }), deadTime: 250e-9 }).cause).toBe('circuit');
  });
});

describe('compareCorner with the ideal column', () => {
  it('every divergence carries its cause and the ideal value; rows carry the ideal value', () => {
    const sim = metrics({ gain: fha.gain! * 1.06, vout: fha.vout! * 1.06, magnetizingCurrentPeak: fha.magnetizingCurrentPeak! * 1.2, diodeCurrentPeak: fha.diodeCurrentPeak! * 1.5 });
    const ideal = metrics({ gain: fha.gain! * 1.05, vout: fha.vout! * 1.05, magnetizingCurrentPeak: fha.magnetizingCurrentPeak! * 1.05, diodeCurrentPeak: fha.diodeCurrentPeak! * 1.1 });
    const c = compareCorner(design, fha, sim, false, ideal);
    const by = (m: string) => c.divergences.find((d) => d.metric === m)!;
    expect(by('gain').cause).toBe('approximation');
    expect(by('gain').ideal).toBeCloseTo(fha.gain! * 1.05, 12);
    expect(by('magnetizingCurrentPeak').cause).toBe('circuit'); // 1.2 / 1.05 = +14 %: beyond 10 %, within 20 %
    expect(by('diodeCurrentPeak').cause).toBe('unexplained'); // 1.5 / 1.1 = +36 %
    for (const r of c.rows) expect(r).toHaveProperty('ideal');
    expect(c.rows.find((r) => r.metric === 'mode')!.ideal).toBe('PO');
  });

  it('the ? flag follows the ideal model: a gain fall below resonance that the ideal model also shows is not flagged, a rise it does not show is', () => {
    // FHA's sign rule would flag any fall below resonance; here the ideal model predicts it.
    const down = compareCorner(design, fha, metrics({ gain: fha.gain! * 0.95 }), false, metrics({ gain: fha.gain! * 0.96 }));
    expect(down.divergences.find((d) => d.metric === 'gain')!.unexpectedSign).toBeUndefined();
    const off = compareCorner(design, fha, metrics({ gain: fha.gain! * 1.2 }), false, metrics({ gain: fha.gain! * 1.01 }));
    const g = off.divergences.find((d) => d.metric === 'gain')!;
    expect(g.cause).toBe('unexplained');
    expect(g.unexpectedSign).toBe(true);
  });

  it('without an ideal value a gain rise in a mode with a rectifier-off interval is never flagged', () => {
    const d = makeDesign({ operating: { frequency: [130e3] } }); // above resonance
    const c = expandCorners(d)[0]!;
    const f = predictCorner(d, c);
    const sim = { ...metrics({}), fs: 130e3, gain: f.gain! * 1.1, vout: f.vout! * 1.1, mode: 'OPO' };
    const r = compareCorner(d, f, sim, false, null).divergences.find((x) => x.metric === 'gain')!;
    expect(r.cause).toBe('unexplained');
    expect(r.unexpectedSign).toBeUndefined();
    const np = compareCorner(d, f, { ...sim, mode: 'NP' }, false, null).divergences.find((x) => x.metric === 'gain')!;
    expect(np.unexpectedSign).toBe(true);
  });
});

describe('a genuine light-load OPO gain rise is not called suspect', () => {
  it('a gain rise above resonance that the ideal model shows carries no ? and no "suspect" wording', () => {
    const d = makeDesign({ operating: { frequency: [130e3] } }); // above resonance: FHA's sign rule expects a lower gain
    const c = expandCorners(d)[0]!;
    const f = predictCorner(d, c);
    const sim = { ...metrics({}), fs: 130e3, gain: f.gain! * 1.07, vout: f.vout! * 1.07, mode: 'OPO' };
    const ideal = { ...sim, gain: f.gain! * 1.068, vout: f.vout! * 1.068 };
    const r = compareCorner(d, f, sim, false, ideal).divergences.find((x) => x.metric === 'gain')!;
    expect(r.cause).toBe('approximation');
    expect(r.unexpectedSign).toBeUndefined();
    expect(r.reason).not.toMatch(/suspect/);
  });
});
