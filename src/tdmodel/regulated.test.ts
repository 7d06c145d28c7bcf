import { describe, expect, it } from 'vitest';
import { solveFrequency } from './frequency.js';
import { solveRegulatedDirect } from './regulated.js';
import { solveSteadyState } from './periodic.js';
import { params, rel, resonance } from './cases.test-support.js';

// The direct Newton on (state, T/2) must find the same root as the bracketing search, which
// is an independent path (Brent on the steady-state output); and the steady state solved at the
// returned frequency with the load must give the target output.
const cases = [
  { name: 'HB, CT, dead time and Coss', p: params({ coss: 300e-12, deadTime: 250e-9 }) },
  { name: 'FB, FB rectifier, diode drop and resistances', p: params({ inverter: 'full-bridge', rectifier: 'full-bridge', vf: 0.7, rd: 0.02, rdsOn: 0.1, coss: 200e-12, deadTime: 200e-9 }) },
];

describe('solveRegulatedDirect', () => {
  for (const { name, p } of cases) {
    const fr = resonance(p);
    for (const [rl, vo] of [[4, 52], [4, 40], [10, 56], [40, 52], [200, 50]] as const) {
      it(`${name}, RL ${rl} ohm, Vo ${vo} V: the same fs as the search (1e-8), and Vo at that fs (1e-7)`, () => {
        const search = solveFrequency(p, rl, vo, fr, { direct: false });
        const direct = solveRegulatedDirect(p, rl, vo, fr, { fsMin: 0.2 * fr, fsMax: 20 * fr });
        if (search.fs === null) {
          expect(direct === null || direct.state.turnOffCurrent > 0).toBe(true);
          return;
        }
        expect(direct).not.toBeNull();
        expect(rel(direct!.fs, search.fs)).toBeLessThan(1e-8);
        expect(rel(solveSteadyState({ ...p, fs: direct!.fs }, rl).vo, vo)).toBeLessThan(1e-7);
        // solveFrequency takes the direct result and agrees with its own search
        const fast = solveFrequency(p, rl, vo, fr);
        expect(rel(fast.fs!, search.fs)).toBeLessThan(1e-8);
        expect(fast.evaluations).toBeLessThan(search.evaluations);
      });
    }
  }

  it('returns null for a load it cannot reach instead of a wrong frequency', () => {
    const p = cases[0]!.p;
    expect(solveRegulatedDirect(p, 4, 500, resonance(p), { fsMin: 0.2 * resonance(p), fsMax: 20 * resonance(p) })).toBeNull();
  });
});
