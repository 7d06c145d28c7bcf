import { describe, expect, it } from 'vitest';
import { HalfPeriod } from './halfperiod.js';
import { normalize } from './model.js';
import { newStats } from './stats.js';
import { solveSteadyState } from './periodic.js';
import { balance, params, resonance } from './cases.test-support.js';

// Regression cases found while building the solver (states at t = 0 that broke event handling).
describe('half-period integration edge cases', () => {
  it('secondary current that dips below zero between samples during a fast node swing', () => {
    const c = normalize(params({ inverter: 'full-bridge', lm: 100e-6, fs: 0.8 * resonance(params()), coss: 300e-12, deadTime: 250e-9, vf: 0.7, rd: 0.01, rdsOn: 0.05 }), 100);
    const hp = new HalfPeriod(c);
    hp.setClamp(1.448820108247464);
    const st = newStats();
    hp.run([-1.1635312939454274, -1.1635314387876383, -1.3416912182530125], st);
    // i_sec(0) = 1.448e-7 falls at 1.83 per unit time: P lasts about 7.9e-8 (normalized).
    expect(st.segments[0].mode).toBe('P');
    expect(st.segments[0].end).toBeGreaterThan(7e-8);
    expect(st.segments[0].end).toBeLessThan(9e-8);
  });

  it('Lm voltage touching the clamp with zero slope: short P, no endless P/O switching', () => {
    const c = normalize(params({ lm: 100e-6, fs: 1.03 * resonance(params()) }), 100);
    const hp = new HalfPeriod(c);
    hp.setClamp(0.4860491158397);
    const st = newStats();
    hp.run([-0.3004299969161337, -0.30041576902932227, -0.011681352062747164], st);
    expect(st.segments.map((s) => s.mode).join('')).toMatch(/^N?OPO/);
    const p = st.segments.find((s) => s.mode === 'P')!;
    expect(p.end - p.start).toBeCloseTo(0.22798578593398763, 6);
  });

  it('no node capacitance, current reaching zero in the dead time with neither rail able to take it: node floats', () => {
    const base = params({ lm: 12 * 50e-6, inverter: 'full-bridge', rectifier: 'full-bridge' });
    const fs = (1.15 / Math.sqrt(13)) * resonance(base);
    const c = normalize({ ...base, fs, deadTime: 0.02 / fs }, 160);
    const st = newStats();
    new HalfPeriod(c).run([0.10489391143460754, -0.2548219163062494, -2.0800985552697733], st);
    expect(st.irAtGate).toBe(0); // held at zero until the gate edge
    expect(st.vAtGate).toBeGreaterThan(-1);
    expect(st.vAtGate).toBeLessThan(1);
    expect(st.railAtGate).toBe(false);
  });
});
