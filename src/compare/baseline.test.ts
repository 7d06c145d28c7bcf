import { describe, expect, it } from 'vitest';
import { compareBaseline, renderBaseline } from './baseline.js';
import { predictStudy } from '../run/study.js';
import { makeDesign } from '../../tests/support/design.js';
import type { Results } from '../results/types.js';

function withSim(r: Results, scale = 1): Results {
  const copy = structuredClone(r);
  for (const c of copy.corners) {
    c.status = 'ok';
    c.sim = { ...(c.fha as never as Record<string, number>), fs: c.fha.fs!, gain: c.fha.gain! * scale, tankCurrentRms: c.fha.tankCurrentRms!,
      zvs: true, zcs: true, region: 'inductive', mode: 'PO', cycles: 24, runs: 1, simulations: 1, settled: true, settleError: 0 } as never;
  }
  return copy;
}

describe('compareBaseline', () => {
  const base = withSim(predictStudy(makeDesign({ operating: { vin: [380, 400], load: [{ kind: 'ohm', value: 4 }], ratedPower: 676, frequency: [90e3], corners: [] } })));
  it('no change: not regressed', () => {
    const r = compareBaseline(base, base, 'b.json');
    expect(r.regressed).toBe(false);
    expect(r.moved).toHaveLength(0);
  });
  it('a metric moved beyond tolerance, a removed corner and a status change are regressions; an added corner is reported', () => {
    const now = withSim(base, 1.02);
    now.corners[0]!.status = 'diverged';
    const removed = now.corners.pop()!;
    now.corners.push({ ...structuredClone(removed), id: 'new_corner' });
    const r = compareBaseline(now, base, 'b.json', 0.01);
    expect(r.regressed).toBe(true);
    expect(r.moved.map((m) => m.metric)).toContain('gain');
    expect(r.moved[0]!.change).toBeCloseTo(0.02, 9);
    expect(r.removed).toEqual([removed.id]);
    expect(r.added).toEqual(['new_corner']);
    expect(r.statusChanges[0]).toEqual({ id: base.corners[0]!.id, from: 'ok', to: 'diverged' });
  });
  it('a move inside tolerance is not a regression', () => {
    expect(compareBaseline(withSim(base, 1.005), base, 'b.json', 0.01).regressed).toBe(false);
  });
  it('a limit check that went from within to outside is reported and is a regression', () => {
    const now = withSim(base);
    const before = withSim(base);
    for (const r of [now, before]) r.corners[0]!.checks = [{ limit: 'crVoltage', bound: 360, kind: 'max', fha: { value: 350, within: true }, ideal: null, sim: { value: 355, within: true }, flip: false }];
    now.corners[0]!.checks![0]!.sim = { value: 365, within: false };
    const r = compareBaseline(now, before, 'b.json');
    expect(r.checksOutside).toEqual([{ id: base.corners[0]!.id, limit: 'crVoltage', before: 355, after: 365, bound: 360 }]);
    expect(r.regressed).toBe(true);
    expect(renderBaseline(r)).toMatch(/crVoltage: within -> outside \(355 -> 365, bound 360\)/);
    expect(compareBaseline(before, before, 'b.json').checksOutside).toEqual([]);
  });
});
