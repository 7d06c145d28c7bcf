import { describe, expect, it } from 'vitest';
import { equilibriumVoltage, secantResistance, shootState, type SlowPoint } from './shooting.js';
import { makeSpan, spanAverage } from '../measure/window.js';

// Closed-form RC case (first-order linear circuit, standard result): a Thevenin source Vth behind Rth
// feeds C in parallel with RL. The capacitor voltage is v(t) = V* + (v0 - V*) e^(-t/tau) with
// V* = Vth RL / (Rth + RL) and tau = C (Rth || RL); the capacitor current is (V* - v) / (Rth || RL).
const Vth = 25;
const Rth = 0.05;
const RL = 2.4;
const C = 10e-3;
const R = (Rth * RL) / (Rth + RL);
const Vstar = (Vth * RL) / (Rth + RL);
const tau = C * R;

/** Averages of v and i over [t0, t0 + tw], sampled on a fine grid as a simulator would. */
function windowPoint(v0: number, t0: number, tw: number): SlowPoint {
  const n = 4000;
  const t = Float64Array.from({ length: n + 1 }, (_, k) => t0 + (k * tw) / n);
  const v = t.map((x) => Vstar + (v0 - Vstar) * Math.exp(-x / tau));
  const i = v.map((x) => (Vstar - x) / R);
  const span = makeSpan(t, t0, t0 + tw);
  return { vco: spanAverage(span, v), icap: spanAverage(span, i) };
}

describe('shooting step on the output capacitor voltage', () => {
  const tw = 6 / 80e3; // one 6-cycle window at 80 kHz: tau is ~6 windows here
  const v0 = 24.8;

  it('one window and the exact resistance predict the equilibrium within 1e-9 relative', () => {
    const p = windowPoint(v0, 0, tw);
    expect(Math.abs(p.vco - Vstar) / Vstar).toBeGreaterThan(1e-3); // far from settled
    expect(Math.abs(equilibriumVoltage(p, R) / Vstar - 1)).toBeLessThan(1e-9);
  });

  it('two windows give the resistance by their secant, hence the equilibrium, within 1e-9', () => {
    const a = windowPoint(v0, 0, tw);
    const b = windowPoint(v0, 3 * tw, tw);
    const r = secantResistance(a, b)!;
    expect(Math.abs(r / R - 1)).toBeLessThan(1e-9);
    expect(Math.abs(equilibriumVoltage(b, r) / Vstar - 1)).toBeLessThan(1e-9);
  });

  it('a resistance 30 % low leaves 30 % of the error (Newton step with a wrong slope contracts by 1 - r/R)', () => {
    const p = windowPoint(v0, 0, tw);
    const left = (equilibriumVoltage(p, 0.7 * R) - Vstar) / (p.vco - Vstar);
    expect(left).toBeCloseTo(0.3, 9);
  });

  it('refuses a secant that is not a positive resistance', () => {
    expect(secantResistance({ vco: 24, icap: 0.1 }, { vco: 24.1, icap: 0.2 })).toBeNull();
    expect(secantResistance({ vco: 24, icap: 0.1 }, { vco: 24, icap: 0.1 })).toBeNull();
  });

  it('moves the tank state by the rectifier current change the equilibrium needs', () => {
    const state = { vo: 24.02, ir: -1.9, im: -1.9, vcr: 149, va: 0, vb: 0 };
    const p = { vco: 24.02, icap: -0.44 };
    const vEq = equilibriumVoltage(p, 0.05); // 23.998 V
    const s = shootState(state, p, vEq, 9.6, { ir: -0.01, im: -0.01, vcr: -10 });
    const di = (vEq - 24.02) / 9.6 + 0.44; // the rectifier must deliver 0.44 A more, less the lower load current
    expect(s.vo).toBe(vEq);
    expect(s.vcr).toBeCloseTo(149 - 10 * di, 12);
    expect(s.ir).toBeCloseTo(-1.9 - 0.01 * di, 12);
    expect(s.va).toBe(0);
  });
});
