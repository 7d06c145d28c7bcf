import { describe, expect, it } from 'vitest';
import { inputPhase } from '../../fha/gain.js';
import { tankConstants } from '../../fha/predict.js';
import { predictStudy } from '../../run/study.js';
import { loadDemo } from './fixture.test-support.js';
import { gainCurve, gainFigureData, zeroPhaseLocus } from './gainData.js';

const demo = await loadDemo();

describe('gain curves', () => {
  it('pass through M = 1 at fs = fr for every load (docs/method.md#gain-limits: Zs = 0 at fn = 1)', () => {
    const { fr } = tankConstants(demo.design.tank);
    for (const load of [0.5, 2.4, 9.6, 100]) expect(gainCurve(demo.design, load, demo.design.tank, [fr])[0]).toBeCloseTo(1, 12);
  });

  it('pass through each regulated corner\'s FHA operating point (same Q as predictCorner, docs/method.md#solving)', () => {
    for (const c of demo.results.corners) {
      const [g] = gainCurve(demo.design, c.inputs.load, c.inputs, [c.fha.fs!]);
      expect(Math.abs(g! / c.fha.gain! - 1)).toBeLessThan(1e-9);
    }
  });

  it('have one panel per Vin and one curve per load in each, light load first', () => {
    const d = gainFigureData(demo.results, demo.design);
    expect(d.panels.map((p) => p.vin)).toEqual([340, 390, 410]);
    expect(d.loads.map((l) => l.label)).toEqual(['25%', '100%']);
    expect(d.panels.map((p) => p.curves.length)).toEqual([2, 2, 2]);
    expect(d.panels.every((p) => p.points.length === 2 && p.points.every((q) => q.fha && q.sim))).toBe(true);
    // The recorded simulated gain of v390_100pct_reg_nom (demo-results.json), drawn at its measured fs.
    const p = d.panels[1]!.points.find((q) => q.id === 'v390_100pct_reg_nom')!;
    const c = demo.results.corners.find((x) => x.id === p.id)!;
    expect(p.sim).toEqual({ fs: c.sim!.fs, gain: c.sim!.gain });
    // The ideal model's point: its solved frequency and the gain that meets the set point.
    const fresh = gainFigureData(predictStudy(demo.design), demo.design).panels[1]!.points.find((q) => q.id === p.id)!;
    expect(fresh.ideal!.gain).toBeCloseTo(c.fha.gainTarget, 6);
    expect(fresh.ideal!.fs).toBeGreaterThan(0.9 * c.fha.fs!);
  });

  it('spread into a band over the tank tolerance sets that brackets every tolerance corner', () => {
    const design = { ...demo.design, tolerances: { ...demo.design.tolerances, corners: 'extremes' as const } };
    const results = predictStudy(design);
    const d = gainFigureData(results, design);
    expect(d.panels.flatMap((p) => p.curves).every((c) => c.band)).toBe(true);
    for (const panel of d.panels) for (const pt of panel.points) {
      const band = panel.curves.find((c) => c.load === pt.load)!.band!;
      const i = d.grid.findIndex((f) => f >= pt.fha!.fs);
      const t = (pt.fha!.fs - d.grid[i - 1]!) / (d.grid[i]! - d.grid[i - 1]!);
      const lerp = (ys: number[]) => ys[i - 1]! + t * (ys[i]! - ys[i - 1]!);
      // Linear interpolation between grid points of a smooth curve: 1e-3 covers the chord error.
      expect(pt.fha!.gain).toBeGreaterThanOrEqual(lerp(band.lo) - 1e-3);
      expect(pt.fha!.gain).toBeLessThanOrEqual(lerp(band.hi) + 1e-3);
    }
  });

  it('without a design keep the points and fr, and draw no curve or boundary', () => {
    const d = gainFigureData(demo.results);
    expect(d.hasDesign).toBe(false);
    expect(d.panels.flatMap((p) => p.curves)).toEqual([]);
    expect(d.boundary).toBeNull();
    expect(d.fr).toBeCloseTo(demo.results.corners[0]!.fha.fr, 6);
    expect(d.panels.flatMap((p) => p.points)).toHaveLength(6);
  });
});

describe('zero-phase locus', () => {
  const { fr, fp, ln } = tankConstants(demo.design.tank);
  const locus = zeroPhaseLocus(fr, ln);

  it('has zero input phase at every point (definition, checked on the impedance, docs/method.md#zero-phase)', () => {
    locus.fs.forEach((fs, i) => {
      const q = 1e-3 * 3e4 ** (i / (locus.fs.length - 1));
      expect(Math.abs(inputPhase(fs / fr, q, ln))).toBeLessThan(1e-9);
    });
  });

  it('runs from fp at light load to (fr, M = 1) at heavy load (limits Q -> 0 and Q -> infinity, docs/method.md#zero-phase)', () => {
    expect(locus.fs[0]! / fp).toBeCloseTo(1, 3);
    expect(locus.fs.at(-1)! / fr).toBeCloseTo(1, 3);
    expect(locus.gain.at(-1)!).toBeCloseTo(1, 3);
    for (let i = 1; i < locus.fs.length; i++) expect(locus.fs[i]!).toBeGreaterThan(locus.fs[i - 1]!);
  });
});
