import { describe, expect, it } from 'vitest';
import { solveFrequency } from './frequency.js';
import { solveSteadyState } from './periodic.js';
import { fhaGain, fnForGain, zeroPhaseFn } from '../fha/gain.js';
import { params, rel, resonance } from './cases.test-support.js';
import type { TdParams } from './types.js';

const p = params({ coss: 300e-12, deadTime: 250e-9 });
const zr = Math.sqrt(p.lr / p.cr);

/** FHA frequency for an output, ideal diodes (docs/method.md#solving). */
function fhaFs(q: TdParams, rl: number, vo: number): number {
  const qq = (Math.PI ** 2 * zr) / (8 * q.n ** 2 * rl);
  const ln = q.lm / q.lr;
  return fnForGain((q.n * vo) / (q.vin / 2), qq, ln, zeroPhaseFn(qq, ln), 50)! * resonance(q);
}

describe('solveFrequency', () => {
  for (const [rl, vo] of [[4, 52], [4, 40], [10, 56], [40, 52]] as const) {
    it(`RL ${rl} ohm, Vo ${vo} V: the steady state at the returned fs gives Vo (1e-6), inductive`, () => {
      const r = solveFrequency(p, rl, vo, fhaFs(p, rl, vo));
      expect(r.fs).not.toBeNull();
      if (r.fs === null) return;
      const check = solveSteadyState({ ...p, fs: r.fs }, rl);
      expect(rel(check.vo, vo)).toBeLessThan(1e-6);
      expect(r.state.turnOffCurrent).toBeGreaterThan(0);
    });
  }

  // docs/method.md#fha-limits take-aways: below fr the real gain is higher than FHA, above fr lower,
  // so the time-domain frequency for a gain above 1 lies above the FHA one and vice versa.
  it('gain above 1: time-domain fs above FHA fs; gain below 1: below (docs/method.md#fha-limits)', () => {
    const ideal = params();
    const up = solveFrequency(ideal, 4, 56, fhaFs(ideal, 4, 56));
    const down = solveFrequency(ideal, 4, 42, fhaFs(ideal, 4, 42));
    expect(up.fs!).toBeGreaterThan(fhaFs(ideal, 4, 56));
    expect(up.fs!).toBeLessThan(resonance(ideal));
    expect(down.fs!).toBeLessThan(fhaFs(ideal, 4, 42));
    expect(down.fs!).toBeGreaterThan(resonance(ideal));
  });

  it('at M = 1 with ideal parts the answer is fr for any load (docs/method.md#gain-limits, #tank-currents)', () => {
    const ideal = params();
    for (const rl of [2, 5]) {
      const r = solveFrequency(ideal, rl, 50, 95e3);
      expect(rel(r.fs!, resonance(ideal))).toBeLessThan(1e-6);
    }
  });

  it('the same answer from a guess far below (below fp it starts at fp) and far above', () => {
    const a = solveFrequency(p, 4, 52, 20e3);
    const b = solveFrequency(p, 4, 52, 400e3);
    const c = solveFrequency(p, 4, 52, 95e3);
    expect(rel(a.fs!, c.fs!)).toBeLessThan(1e-7);
    expect(rel(b.fs!, c.fs!)).toBeLessThan(1e-7);
  });

  it('a target above the highest inductive output is unreachable, with the reason', () => {
    const r = solveFrequency(p, 4, 70, 90e3);
    expect(r.fs).toBeNull();
    if (r.fs === null) expect(r.reason).toMatch(/above the highest output on the inductive branch/);
  });

  it('light load: a target below the output at fsMax is unreachable (docs/method.md#gain-limits, Ln/(Ln+1))', () => {
    // FHA no-load floor Ln/(Ln+1) = 0.833 -> 41.7 V; ask for 30 V at 400 ohm.
    expect(fhaGain(50, 0, 5)).toBeGreaterThan(0.83);
    const r = solveFrequency(p, 400, 30, 150e3);
    expect(r.fs).toBeNull();
    if (r.fs === null) expect(r.reason).toMatch(/below the output at the highest frequency/);
  });
});
