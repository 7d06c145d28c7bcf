import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { solveSteadyState } from './periodic.js';
import { solveHeldOutput } from './held.js';
import { balance, params, rel, resonance } from './cases.test-support.js';
import type { TdParams } from './types.js';

describe('solveSteadyState', () => {
  it('the bracketing fallback and the combined Newton give the same state', () => {
    for (const [fs, rl] of [[60e3, 3], [90e3, 4], [150e3, 12]] as const) {
      const p = params({ fs, coss: 300e-12, deadTime: 200e-9, vf: 0.5, rd: 0.01, rdsOn: 0.05 });
      const a = solveSteadyState(p, rl);
      const b = solveSteadyState(p, rl, { method: 'bracket' });
      expect(rel(a.vo, b.vo)).toBeLessThan(1e-8);
      expect(a.mode).toBe(b.mode);
      expect(b.evaluations).toBeGreaterThan(1);
    }
  });

  it('load equation holds: Io_rect = Vo / RL', () => {
    const r = solveSteadyState(params({ fs: 110e3, vf: 0.6 }), 5);
    expect(rel(r.ioRect, r.vo / 5)).toBeLessThan(1e-9);
  });

  it('no load is the limit RL -> infinity (closed-form limit of the load line)', () => {
    for (const fs of [60e3, 120e3, 250e3]) {
      const p = params({ fs, vf: 0.5 });
      const open = solveSteadyState(p, Infinity);
      const light = solveSteadyState(p, 1e9);
      expect(open.io).toBe(0);
      expect(Math.abs(open.ioRect)).toBeLessThan(1e-9);
      expect(rel(light.vo, open.vo)).toBeLessThan(1e-4);
      expect(light.vo).toBeLessThan(open.vo);
    }
  });

  it('held output at the solved Vo, started from the seed, returns Io = Vo / RL (seed is periodic)', () => {
    const p = params({ fs: 120e3, coss: 300e-12, deadTime: 250e-9 });
    const r = solveSteadyState(p, 6);
    const h = solveHeldOutput(p, r.vo, { guess: r.seed });
    expect(h.iterations).toBeLessThanOrEqual(1);
    expect(rel(h.ioRect, r.io)).toBeLessThan(1e-7);
  });

  it('rejects a non-positive load', () => {
    expect(() => solveSteadyState(params(), 0)).toThrow(RangeError);
  });
});

// Property test over random designs (not tuned to one): the solver converges, the load equation
// and the energy balance hold. Frequencies from 1.05 fp (above the no-load pole) to 4 fr.
describe('random designs (fast-check, fixed seed)', () => {
  it('converges with Io_rect = Vo/RL and energy balance to 1e-6', () => {
    const arb = fc.record({
      ln: fc.double({ min: 1.5, max: 20, noNaN: true }),
      x: fc.double({ min: 0, max: 1, noNaN: true }),
      q: fc.double({ min: 0.02, max: 3, noNaN: true }),
      fb: fc.boolean(), fbr: fc.boolean(),
      dead: fc.double({ min: 0, max: 0.05, noNaN: true }),
      coss: fc.double({ min: 0, max: 5e-9, noNaN: true }),
      vf: fc.double({ min: 0, max: 2, noNaN: true }),
      r: fc.double({ min: 0, max: 0.5, noNaN: true }),
    });
    fc.assert(fc.property(arb, (a) => {
      const base = params({ lm: a.ln * 50e-6 });
      const fr = resonance(base);
      const fnLow = 1.05 / Math.sqrt(1 + a.ln);
      const fs = fr * fnLow * Math.exp(a.x * Math.log(4 / fnLow));
      const p: TdParams = {
        ...base, fs, inverter: a.fb ? 'full-bridge' : 'half-bridge', rectifier: a.fbr ? 'full-bridge' : 'center-tapped',
        coss: a.coss, deadTime: a.dead / fs, vf: a.vf, rd: a.r / 4, rdsOn: a.r,
      };
      const rl = (Math.PI ** 2 * Math.sqrt(p.lr / p.cr)) / (8 * 16 * a.q);
      const s = solveSteadyState(p, rl);
      expect(rel(s.ioRect, s.vo / rl)).toBeLessThan(1e-6);
      expect(Math.abs(balance(s.power))).toBeLessThan(1e-6);
    }), { seed: 20240611, numRuns: 80, endOnFailure: true });
  });
});
