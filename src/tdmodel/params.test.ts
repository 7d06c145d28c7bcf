import { describe, expect, it } from 'vitest';
import { tdParamsFromCorner } from './params.js';
import { makeDesign } from '../../tests/support/design.js';

describe('tdParamsFromCorner', () => {
  it('maps the design and corner fields one to one (SI units, no conversion)', () => {
    const d = makeDesign({ topology: { inverter: 'full-bridge', rectifier: 'full-bridge' }, rectifier: { forwardVoltage: 0.7, resistance: 0.02 } });
    const p = tdParamsFromCorner(d, { vin: 380, lr: 51e-6, cr: 49e-9, lm: 260e-6, turnsRatio: 4.2 }, 95e3);
    expect(p).toEqual({
      inverter: 'full-bridge', rectifier: 'full-bridge', vin: 380, fs: 95e3, lr: 51e-6, cr: 49e-9, lm: 260e-6, n: 4.2,
      coss: 300e-12, deadTime: 250e-9, vf: 0.7, rd: 0.02, rdsOn: 0.05,
    });
  });
});
