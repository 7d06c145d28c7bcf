import { describe, expect, it } from 'vitest';
import { compareCorner } from './compare.js';
import { explainFrequency, explainGain, LOSS_ALLOWANCE, zoneOf } from './reasons.js';
import { predictCorner } from '../fha/predict.js';
import { expandCorners } from '../corners/expand.js';
import { makeDesign } from '../../tests/support/design.js';
import type { SimMetrics } from '../measure/types.js';
import type { FhaResult } from '../fha/types.js';

// Zones and the expected sign of FHA's gain error: below resonance (away from fp) the real gain is
// higher than FHA, above it lower, near fr FHA should hold, near the no-load pole it can err either
// way (Fang, Hu, Shen, Batarseh, IEEE TPEL 27(4) 2012; Lazar & Martinelli, APEC 2001; from memory;
// docs/method.md#fha-limits). The 5 % band and the 1.2 fp limit are this project's choices.
describe('zoneOf: boundaries', () => {
  const fr = 100e3;
  const fp = 40e3;
  it('near is the closed band 0.95 fr .. 1.05 fr', () => {
    expect(zoneOf(0.95 * fr, fr, fp)).toBe('near');
    expect(zoneOf(fr, fr, fp)).toBe('near');
    expect(zoneOf(1.05 * fr, fr, fp)).toBe('near');
    expect(zoneOf(1.05 * fr * (1 + 1e-12), fr, fp)).toBe('above');
    expect(zoneOf(0.95 * fr * (1 - 1e-12), fr, fp)).toBe('below');
  });
  it('near-fp below 1.2 fp (exclusive), below from 1.2 fp up', () => {
    expect(zoneOf(1.2 * fp, fr, fp)).toBe('below');
    expect(zoneOf(1.2 * fp * (1 - 1e-12), fr, fp)).toBe('near-fp');
    expect(zoneOf(0.5 * fp, fr, fp)).toBe('near-fp');
  });
});

describe('explainGain and explainFrequency: which sign is suspicious', () => {
  it('below: a gain more than the loss allowance under FHA is suspicious; regulated fs the same', () => {
    expect(explainGain('below', -LOSS_ALLOWANCE, 'PO').unexpectedSign).toBe(false);
    expect(explainGain('below', -LOSS_ALLOWANCE - 1e-9, 'PO').unexpectedSign).toBe(true);
    expect(explainFrequency('below', -LOSS_ALLOWANCE - 1e-9, 'PO').unexpectedSign).toBe(true);
    expect(explainFrequency('below', 0.04, 'PO')).toMatchObject({ unexpectedSign: false, reason: expect.stringMatching(/higher frequency/) });
  });
  it('above: a gain more than a quarter of the allowance over FHA is suspicious; regulated fs only past the allowance', () => {
    expect(explainGain('above', LOSS_ALLOWANCE / 4, 'NP').unexpectedSign).toBe(false);
    expect(explainGain('above', LOSS_ALLOWANCE / 4 + 1e-9, 'NP').unexpectedSign).toBe(true);
    expect(explainFrequency('above', LOSS_ALLOWANCE, 'NP').unexpectedSign).toBe(false);
    expect(explainFrequency('above', LOSS_ALLOWANCE + 1e-9, 'NP').unexpectedSign).toBe(true);
    expect(explainFrequency('above', -0.05, 'NP').reason).toMatch(/lower frequency/);
  });
  it('near: any divergence points at the model; near-fp: never a sign verdict; frequency reasons follow the gain ones', () => {
    for (const err of [-0.1, 0.1]) {
      expect(explainGain('near', err, 'P').unexpectedSign).toBe(true);
      expect(explainGain('near-fp', err, 'PON').unexpectedSign).toBe(false);
      expect(explainFrequency('near', err, 'P')).toEqual(explainGain('near', err, 'P'));
      expect(explainFrequency('near-fp', err, 'PON')).toEqual(explainGain('near-fp', err, 'PON'));
    }
  });
});

describe('compareCorner: zones and the tolerance boundary', () => {
  // tolerance 0.25 and gains 1 / 1.25 make the relative error exactly 0.25 in binary floating point
  const design = makeDesign({ compare: { gain: 0.25 } });
  const corner = expandCorners(design)[0]!;
  const base = predictCorner(design, corner);
  const fha: FhaResult = { ...base, gain: 1 };
  const sim = (over: Partial<SimMetrics>) => ({ ...({} as SimMetrics), ...Object.fromEntries(Object.entries(base).filter(([, v]) => typeof v === 'number')),
    zvs: true, zvsState: 'zvs', zvsWorstVoltage: 0, zvsMarginTime: 1e-7, zcs: true, zcsRatio: 0, region: 'inductive', mode: 'P', diodeReverseCurrent: 0, voutRipple: 0, ...over } as SimMetrics);
  const gainRow = (s: SimMetrics) => compareCorner(design, fha, s, false).rows.find((r) => r.metric === 'gain')!;

  it('an error exactly at the tolerance is ok; the next representable value over it diverges', () => {
    expect(gainRow(sim({ gain: 1.25 }))).toMatchObject({ error: 0.25, verdict: 'ok' });
    expect(gainRow(sim({ gain: 1.25 + 2 ** -50 })).verdict).toBe('diverged');
    expect(gainRow(sim({ gain: 0.75 }))).toMatchObject({ error: -0.25, verdict: 'ok' });
  });
  it('the zone comes from the simulated frequency: above, near and near-fp', () => {
    expect(compareCorner(design, fha, sim({ fs: 1.3 * base.fr }), false).zone).toBe('above');
    expect(compareCorner(design, fha, sim({ fs: base.fr }), false).zone).toBe('near');
    expect(compareCorner(design, fha, sim({ fs: 1.1 * base.fp }), false).zone).toBe('near-fp');
    const above = gainRow(sim({ fs: 1.3 * base.fr, gain: 1.3 }));
    expect(above).toMatchObject({ verdict: 'diverged', unexpectedSign: true });
    expect(above.reason).toMatch(/above resonance/);
    const nearFp = gainRow(sim({ fs: 1.1 * base.fp, gain: 1.3 }));
    expect(nearFp.unexpectedSign).toBeUndefined();
    expect(nearFp.reason).toMatch(/no-load pole/);
  });
});
