import { describe, expect, it } from 'vitest';
import { predictStudy } from '../../run/study.js';
import type { CornerResult } from '../../results/types.js';
import { renderCornerMap, tankGroups, zcsText, zvsText } from './cornerMap.js';
import { loadDemo } from './fixture.test-support.js';

const demo = await loadDemo();
const count = (s: string, needle: string) => s.split(needle).length - 1;

describe('ZVS and ZCS as text', () => {
  const base = demo.results.corners[0]!;
  const variant = (f: (c: CornerResult) => void) => { const c = structuredClone(base); f(c); return c; };

  it('reads the simulated state and notes an FHA disagreement', () => {
    expect(zvsText(base)).toBe('ZVS ok');
    expect(zvsText(variant((c) => { c.sim!.zvsState = 'partial'; }))).toBe('ZVS partial');
    expect(zvsText(variant((c) => {
      c.sim!.zvs = false;
      c.sim!.zvsState = 'hard';
      c.comparison.find((r) => r.metric === 'zvs')!.verdict = 'diverged';
    }))).toBe('ZVS lost (FHA: ok)');
  });

  it('falls back to FHA without a simulation', () => {
    expect(zvsText(variant((c) => { c.sim = null; }))).toBe('ZVS ok');
    expect(zcsText(variant((c) => { c.sim = null; c.fha.zcs = false; }))).toBe('ZCS lost');
    expect(zvsText(variant((c) => { c.sim = null; c.fha.zvs = null; }))).toBe('ZVS n/a');
  });
});

describe('renderCornerMap', () => {
  it('draws the demo as one Vin x load grid with verdict, ZVS and ZCS in every cell', () => {
    const html = renderCornerMap(demo.results, demo.design);
    expect(count(html, '<figure class="map">')).toBe(1);
    expect(count(html, '<td class="st-diverged">')).toBe(6);
    expect(count(html, '✗ diverged (')).toBe(6);
    // Recorded run: the rectifier commutates hard above resonance (Vin 410 V, fs > fr), docs/method.md#zcs.
    const hard = demo.results.corners.filter((c) => c.sim && !c.sim.zcs).length;
    expect(hard).toBeGreaterThan(0);
    expect(count(html, 'ZCS lost')).toBe(hard);
  });

  it('draws one grid per tank tolerance set, FHA-only cells marked as such', () => {
    const design = { ...demo.design, tolerances: { ...demo.design.tolerances, corners: 'extremes' as const } };
    const results = predictStudy(design);
    expect(tankGroups(results.corners)).toHaveLength(9); // nominal + 2^3 extremes of Lr, Cr, Lm
    const html = renderCornerMap(results, design);
    expect(count(html, '<figure class="map">')).toBe(9);
    expect(count(html, 'FHA: ZVS')).toBe(results.corners.length);
    expect(html).toContain('Lr 57 µH (−5 %), Cr 39.9 nF (−5 %), Lm 270 µH (−10 %)');
  });

  it('lists each fixed frequency of a cell with its own verdict', () => {
    const design = { ...demo.design, operating: { ...demo.design.operating, frequency: [90e3, 110e3] } };
    const html = renderCornerMap(predictStudy(design), design);
    expect(count(html, '<b>90 kHz</b>')).toBe(6);
    expect(count(html, '<b>110 kHz</b>')).toBe(6);
  });
});
