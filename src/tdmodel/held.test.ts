import { describe, expect, it } from 'vitest';
import { solveHeldOutput } from './held.js';
import { solveSteadyState } from './periodic.js';
import { modeLabel } from './result.js';
import { loadForQ, params, rel, resonance } from './cases.test-support.js';

// Ideal converter at fs = fr (docs/method.md#gain-limits, #tank-currents; derived from the circuit laws): during the whole half period
// Lr-Cr sees a constant forcing voltage, the tank current is one half sine at fr, the gain is 1,
// Ir,rms = sqrt((pi Io / (2 sqrt 2 n))^2 + Im,pk^2 / 2) with Im,pk = n Vo / (4 fs Lm) and the
// turn-off current equals Im,pk (docs/method.md#switches; derived).
describe('ideal converter at fs = fr (docs/method.md#gain-limits, #tank-currents, #switches)', () => {
  for (const inverter of ['half-bridge', 'full-bridge'] as const) {
    for (const rl of [1, 2, 4, 10]) {
      it(`${inverter}, RL = ${rl} ohm: gain 1, mode P, exact Ir,rms, Ir,pk and I_off`, () => {
        const p = params({ inverter });
        const r = solveSteadyState({ ...p, fs: resonance(p) }, rl);
        const vinEff = inverter === 'half-bridge' ? p.vin / 2 : p.vin;
        const im = (p.n * r.vo) / (4 * resonance(p) * p.lm);
        const ioe = (Math.PI * r.io) / (2 * p.n);
        expect(Math.abs((p.n * r.vo) / vinEff - 1)).toBeLessThan(1e-9);
        expect(r.mode).toBe('P');
        expect(rel(r.tankCurrentRms, Math.sqrt(ioe ** 2 / 2 + im ** 2 / 2))).toBeLessThan(1e-9);
        expect(rel(r.tankCurrentPeak, Math.hypot(ioe, im))).toBeLessThan(1e-9);
        expect(rel(r.turnOffCurrent, im)).toBeLessThan(1e-9);
      });
    }
  }

  // Limit of the statement above (derived here): with i_sec(0) = 0 the secondary current
  // starts rising only if its slope w pi Io / (2n) - n Vo / Lm is >= 0, i.e. RL <= pi^2 fr Lm / n^2
  // (Q >= pi / (4 Ln)). Lighter loads leave an O interval at each end (mode OPO, gain above 1).
  it('continuous conduction at fr ends at RL = pi^2 fr Lm / n^2 (here 15.52 ohm)', () => {
    const p = params();
    const fs = resonance(p);
    const limit = (Math.PI ** 2 * fs * p.lm) / p.n ** 2;
    const below = solveSteadyState({ ...p, fs }, 0.98 * limit);
    const above = solveSteadyState({ ...p, fs }, 1.05 * limit);
    const far = solveSteadyState({ ...p, fs }, 2.5 * limit);
    expect(below.mode).toBe('P');
    expect(Math.abs(below.gain - 1)).toBeLessThan(1e-9);
    expect(above.mode).toBe('OPO');
    expect(above.gain).toBeGreaterThan(1 + 1e-7);
    expect(far.gain).toBeGreaterThan(1.001);
  });

  it('held output at fr below the load-independent value has no periodic state (current unbounded)', () => {
    const p = params();
    expect(() => solveHeldOutput({ ...p, fs: resonance(p) }, 45)).toThrow(/no periodic steady state/);
  });
});

describe('held output', () => {
  it('Io_rect falls as the held output rises (source of the load solve), shared/checks/worked-example.json tank', () => {
    const io = [52.5, 53, 53.5].map((vo) => solveHeldOutput(params(), vo).ioRect);
    expect(io[0]).toBeGreaterThan(io[1]);
    expect(io[1]).toBeGreaterThan(io[2]);
  });

  it('a warm start reproduces the cold solution to 1e-9', () => {
    const cold = solveHeldOutput(params({ fs: 120e3 }), 45);
    const warm = solveHeldOutput(params({ fs: 120e3 }), 45, { guess: { ir: cold.seed.ir * 1.1, im: cold.seed.im * 0.9, vcr: cold.seed.vcr + 5 } });
    expect(rel(warm.ioRect, cold.ioRect)).toBeLessThan(1e-9);
    expect(Math.abs(warm.seed.ir - cold.seed.ir)).toBeLessThan(1e-9);
  });

  it('rejects invalid parameters, listing every problem', () => {
    expect(() => solveHeldOutput(params({ lr: 0, n: -1, deadTime: 1e-5 }), 10)).toThrow(/lr must be > 0.*n must be > 0.*deadTime/);
  });
});

describe('modeLabel', () => {
  it('drops short intervals and merges equal neighbours (docs/method.md#zvs labelling)', () => {
    const seg = (mode: 'P' | 'N' | 'O', start: number, end: number) => ({ mode, start, end });
    const s = [seg('P', 0, 4e-6), seg('O', 4e-6, 4.01e-6), seg('P', 4.01e-6, 5e-6), seg('O', 5e-6, 5.5e-6)];
    expect(modeLabel(s, 1e-7)).toBe('PO');
    expect(modeLabel(s, 0)).toBe('POPO');
    expect(modeLabel([], 0)).toBe('O');
  });
});
