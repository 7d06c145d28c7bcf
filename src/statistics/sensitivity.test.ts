import { describe, expect, it } from 'vitest';
import { rankSensitivity } from './sensitivity.js';
import { drawSamples } from './sample.js';

describe('rankSensitivity', () => {
  it('ranks Cr first for fr = 1/(2 pi sqrt(Lr Cr)) when Cr spreads 10 % and Lr 1 %, with the sign of the closed form', () => {
    const s = drawSamples(3, 400, { lr: 0.01, cr: 0.1, lm: 0.1, turnsRatio: 0 }, 'uniform');
    const fr = s.map((x) => 1 / (2 * Math.PI * Math.sqrt(60e-6 * (1 + x.deviation.lr) * 42e-9 * (1 + x.deviation.cr))));
    const ranking = rankSensitivity({
      lr: s.map((x) => x.deviation.lr), cr: s.map((x) => x.deviation.cr), lm: s.map((x) => x.deviation.lm), turnsRatio: s.map((x) => x.deviation.turnsRatio),
    }, fr);
    expect(ranking.map((r) => r.parameter)).toEqual(['cr', 'lr', 'lm']); // turnsRatio constant: left out
    expect(ranking[0]!.rho).toBeLessThan(-0.98); // fr falls with Cr
    expect(Math.abs(ranking[2]!.rho)).toBeLessThan(0.15); // lm does not enter fr: only chance correlation (~1/sqrt(400))
  });

  it('skips samples without a value', () => {
    const r = rankSensitivity({ a: [1, 2, 3, 4, 5] }, [1, null, 3, 4, 5]);
    expect(r[0]!.rho).toBeCloseTo(1, 12);
  });
});
