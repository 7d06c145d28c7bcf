import { describe, expect, it } from 'vitest';
import { fhaSeed } from './fhaState.js';
import { expandCorners } from '../corners/expand.js';
import { tankConstants } from '../fha/predict.js';
import { makeDesign } from '../../tests/support/design.js';

// Closed forms at fs = fr with ideal parts and no dead time (derived here). The exact periodic
// tank current is A sin(wr t - theta) with A cos(theta) = pi Io / (2n) and A sin(theta) = Im,pk =
// n Vo / (4 fs Lm) (Lm clamped to +-n Vo for the whole half period), so at the high-side turn-on
// i(0) = -Im,pk and v_Cr(0) = Vdc - Zr pi Io / (2n). The FHA phasors give at fn = 1 (Zs = 0,
// Zin = j Xm || Rac): i(0) = -V1 / Xm = -(8/pi^2) Im,pk (FHA's magnetizing current is the
// fundamental of the triangle, common practice) and v_Cr(0) = Vdc - Zr V1 / Rac, which is the exact
// value because V1 / Rac = pi Io / (2n) at unity gain (Rac = 8 n^2 RL / pi^2, Steigerwald 1988,
// from memory).
describe('FHA initial state at fs = fr against the exact closed forms', () => {
  for (const inverter of ['half-bridge', 'full-bridge'] as const) {
    it(`${inverter}: Cr voltage exact, tank current 8/pi^2 of the exact, nodes at their rails`, () => {
      const d = makeDesign({ topology: { inverter, rectifier: 'center-tapped' }, switches: { deadTime: 0, coss: 0, rdsOn: 0 } });
      const c = expandCorners(d)[0]!;
      const { fr, zr } = tankConstants(c);
      const vo = (inverter === 'half-bridge' ? 200 : 400) / 4; // unity gain, ideal diodes
      const io = vo / 4;
      const s = fhaSeed(d, c, fr, vo);
      const im = (4 * vo) / (4 * fr * 250e-6);
      const vdc = inverter === 'half-bridge' ? 200 : 0;
      expect(s.vo).toBe(vo);
      expect(s.vcr).toBeCloseTo(vdc - (zr * Math.PI * io) / (2 * 4), 9);
      expect(s.ir / -im).toBeCloseTo(8 / Math.PI ** 2, 9);
      expect(s.im).toBeCloseTo(s.ir, 9); // the rectifier is not conducting at the instant FHA picks
      expect([s.va, s.vb]).toEqual(inverter === 'half-bridge' ? [0, 0] : [0, 400]);
    });
  }

  it('dead time moves t = 0 back by half the dead time on the fundamental', () => {
    const base = makeDesign({ switches: { deadTime: 0, coss: 0, rdsOn: 0 } });
    const late = makeDesign({ switches: { deadTime: 400e-9, coss: 0, rdsOn: 0 } });
    const c = expandCorners(base)[0]!;
    const { fr } = tankConstants(c);
    const a = fhaSeed(base, c, fr, 50);
    const b = fhaSeed(late, c, fr, 50);
    // the state moves along the FHA sinusoids: i(0) = irPk sin(-w td / 2 - phi), where irPk and
    // phi come from the state without dead time (Cr voltage 90 degrees behind the current)
    const w = 2 * Math.PI * fr;
    const irPk = Math.hypot(a.ir, (a.vcr - 200) * w * 50e-9);
    expect(b.ir).toBeCloseTo(irPk * Math.sin(Math.asin(a.ir / irPk) - w * 200e-9), 9);
  });
});
