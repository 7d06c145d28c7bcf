import { describe, expect, it } from 'vitest';
import { compareCorner } from './compare.js';
import { zoneOf } from './reasons.js';
import { predictCorner } from '../fha/predict.js';
import { expandCorners } from '../corners/expand.js';
import { makeDesign } from '../../tests/support/design.js';
import type { SimMetrics } from '../measure/types.js';
import { simLike } from './simMetrics.test-support.js';

const design = makeDesign();
const corner = expandCorners(design)[0]!;
const fha = predictCorner(design, corner); // worked example 6.3: fn = 0.894, below resonance

const sim = (over: Partial<SimMetrics>): SimMetrics => simLike(fha, { zvsMarginTime: 1e-7, ...over });

describe('compareCorner', () => {
  it('identical values: every numeric row ok with error 0, no divergence', () => {
    const c = compareCorner(design, fha, sim({}), false);
    expect(c.divergences).toHaveLength(0);
    for (const r of c.rows.filter((x) => typeof x.error === 'number')) expect(r.error).toBe(0);
  });

  it('relative error is (sim - fha)/|fha| and the group tolerance decides', () => {
    const c = compareCorner(design, fha, sim({ gain: fha.gain! * 1.05, tankCurrentRms: fha.tankCurrentRms! * 1.09 }), false);
    const gain = c.rows.find((r) => r.metric === 'gain')!;
    expect(gain.error).toBeCloseTo(0.05, 12);
    expect(gain.tolerance).toBe(0.03);
    expect(gain.verdict).toBe('diverged');
    expect(c.rows.find((r) => r.metric === 'tankCurrentRms')!.verdict).toBe('ok'); // 9 % < 10 %
  });

  it('below resonance a higher simulated gain is the expected FHA limitation; a lower one is flagged as a model suspicion (docs/method.md#fha-limits)', () => {
    expect(zoneOf(fha.fs!, fha.fr, fha.fp)).toBe('below');
    const up = compareCorner(design, fha, sim({ gain: fha.gain! * 1.08 }), false).divergences.find((d) => d.metric === 'gain')!;
    expect(up.unexpectedSign).toBeUndefined();
    expect(up.reason).toMatch(/under-predicts gain/);
    const down = compareCorner(design, fha, sim({ gain: fha.gain! * 0.9 }), false).divergences.find((d) => d.metric === 'gain')!;
    expect(down.unexpectedSign).toBe(true);
  });

  it('status disagreements are divergences with a reason', () => {
    const c = compareCorner(design, fha, sim({ zvs: false, zvsState: 'hard', zvsWorstVoltage: 0.9, region: 'capacitive' }), false);
    const metrics = c.divergences.map((d) => d.metric);
    expect(metrics).toContain('zvs');
    expect(metrics).toContain('region');
    expect(c.divergences.find((d) => d.metric === 'zvs')!.reason).toMatch(/loses ZVS/);
  });

  it('fixed frequency: fs is information only; regulated: vout is information only', () => {
    const fixed = compareCorner(design, fha, sim({ fs: fha.fs! * 1.2 }), false);
    expect(fixed.rows.find((r) => r.metric === 'fs')!.verdict).toBe('info');
    const reg = compareCorner(design, fha, sim({ vout: fha.vout! * 1.2 }), true);
    expect(reg.rows.find((r) => r.metric === 'vout')!.verdict).toBe('info');
  });

  it('an FHA value of 0 gives no relative error (never Infinity in a table)', () => {
    const zero = { ...fha, switchTurnOffCurrent: 0 };
    const row = compareCorner(design, zero, sim({ switchTurnOffCurrent: 0.5 }), false).rows.find((r) => r.metric === 'switchTurnOffCurrent')!;
    expect(row.error).toBeNull();
    expect(row.verdict).toBe('info');
  });
  it('a metric named in compare takes its own tolerance; off reports it without flagging (numbers and yes/no metrics)', () => {
    const d = makeDesign({ compare: { metrics: { magnetizingCurrentPeak: 0.3, tankCurrentRms: 'off', zvs: 'off' } } });
    const c = compareCorner(d, fha, sim({ magnetizingCurrentPeak: fha.magnetizingCurrentPeak! * 1.2, tankCurrentRms: fha.tankCurrentRms! * 2,
      tankCurrentPeak: fha.tankCurrentPeak! * 1.2, zvs: false }), false);
    const row = (m: string) => c.rows.find((r) => r.metric === m)!;
    expect(row('magnetizingCurrentPeak')).toMatchObject({ tolerance: 0.3, verdict: 'ok' }); // 20 % < 30 %
    expect(row('tankCurrentRms')).toMatchObject({ tolerance: null, verdict: 'info' });
    expect(row('tankCurrentRms').error).toBeCloseTo(1, 12); // still reported
    expect(row('tankCurrentPeak')).toMatchObject({ tolerance: 0.1, verdict: 'diverged' }); // the group still applies to the others
    expect(row('zvs')).toMatchObject({ fha: true, sim: false, verdict: 'info' });
    expect(c.divergences.map((x) => x.metric)).toEqual(['tankCurrentPeak']);
  });
});
