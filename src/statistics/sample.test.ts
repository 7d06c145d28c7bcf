import { describe, expect, it } from 'vitest';
import { drawSample, drawSamples, truncatedNormal } from './sample.js';
import { ksCritical05, ksStatistic } from './ks.js';
import { sampleRng } from './prng.js';

const onlyCr = { lr: 0, cr: 0.05, lm: 0, turnsRatio: 0 };

describe('drawSamples', () => {
  it('uniform Cr passes the Kolmogorov-Smirnov test against U(-5 %, 5 %) at the 0.05 level', () => {
    // Critical value: asymptotic 1.36 / sqrt(n) at alpha 0.05 (Massey 1951, JASA 46, Table 1)
    const n = 2000;
    const d = drawSamples(42, n, onlyCr, 'uniform').map((s) => s.deviation.cr);
    const D = ksStatistic(d, (x) => Math.min(1, Math.max(0, (x + 0.05) / 0.1)));
    expect(D).toBeLessThan(ksCritical05(n));
    // and the test has teeth: the same values against a band 10 % too narrow fail it
    expect(ksStatistic(d, (x) => Math.min(1, Math.max(0, (x + 0.045) / 0.09)))).toBeGreaterThan(ksCritical05(n));
  });

  it('leaves untoleranced parameters at exactly nominal', () => {
    for (const s of drawSamples(7, 50, onlyCr, 'normal')) {
      expect(s.deviation.lr).toBe(0);
      expect(s.deviation.lm).toBe(0);
      expect(s.deviation.turnsRatio).toBe(0);
    }
  });

  it('normal: 3 sigma = tolerance, never outside the tolerance, sigma close to tol/3', () => {
    const n = 20000;
    const d = drawSamples(1, n, onlyCr, 'normal').map((s) => s.deviation.cr);
    expect(Math.max(...d.map(Math.abs))).toBeLessThanOrEqual(0.05);
    const sd = Math.sqrt(d.reduce((a, b) => a + b * b, 0) / n);
    // sd of a normal truncated at +-3 sigma is 0.9865 sigma (closed form: 1 - 2*3*phi(3)/(2*Phi(3)-1), phi(3) = 0.004432)
    expect(sd / (0.05 / 3)).toBeCloseTo(Math.sqrt(1 - (6 * 0.004432) / 0.9973), 1);
    // about 68.3 % within one sigma (normal), within 3 standard errors
    const inside = d.filter((x) => Math.abs(x) <= 0.05 / 3).length / n;
    expect(Math.abs(inside - 0.6827 / 0.9973)).toBeLessThan(3 * Math.sqrt(0.25 / n));
  });

  it('sample k depends on (seed, k) only: drawing 10..19 alone gives the same as drawing 0..29', () => {
    const tol = { lr: 0.05, cr: 0.05, lm: 0.1, turnsRatio: 0.005 };
    const all = drawSamples(42, 30, tol, 'normal');
    for (let k = 10; k < 20; k++) expect(drawSample(42, k, tol, 'normal')).toEqual(all[k]);
    expect(drawSamples(43, 30, tol, 'normal')[5]).not.toEqual(all[5]);
  });

  it('adding a tolerance to another parameter does not change the Cr values', () => {
    const a = drawSamples(42, 20, onlyCr, 'uniform').map((s) => s.deviation.cr);
    const b = drawSamples(42, 20, { ...onlyCr, lm: 0.1 }, 'uniform').map((s) => s.deviation.cr);
    expect(b).toEqual(a);
  });
});

describe('truncatedNormal', () => {
  it('passes the KS test against the standard normal truncated at +-3 (alpha 0.05, Massey 1951)', () => {
    const rng = sampleRng(5, 0, 0);
    const n = 5000;
    const z = Array.from({ length: n }, () => truncatedNormal(rng, 3));
    // standard normal CDF by the Abramowitz and Stegun 26.2.17 approximation (|error| < 7.5e-8)
    const phi = (x: number): number => {
      const t = 1 / (1 + 0.2316419 * Math.abs(x));
      const poly = t * (0.319381530 + t * (-0.356563782 + t * (1.781477937 + t * (-1.821255978 + t * 1.330274429))));
      const upper = (Math.exp(-x * x / 2) / Math.sqrt(2 * Math.PI)) * poly;
      return x >= 0 ? 1 - upper : upper;
    };
    const lo = phi(-3);
    const span = phi(3) - lo;
    expect(ksStatistic(z, (x) => (phi(x) - lo) / span)).toBeLessThan(ksCritical05(n));
  });
});
