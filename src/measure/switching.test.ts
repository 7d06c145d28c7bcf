import { describe, expect, it } from 'vitest';
import { classifyZvs, regionOf, summarizeZvs, turnOffCurrent, turnOnEdges } from './switching.js';
import { windowSpan } from './measure.js';
import { sineSet } from './models.test-support.js';

const fs = 100e3;
const td = 200e-9;
const ws = 2 * Math.PI * fs;
const win = { tStart: 2 / fs, cycles: 4 };

describe('classifyZvs', () => {
  it('splits at a and 1 - a (docs/method.md#zvs)', () => {
    expect([0, 0.05, 0.0501, 0.5, 0.9499, 0.95, 1.2].map((x) => classifyZvs(x, 0.05))).toEqual([
      'zvs', 'zvs', 'partial', 'partial', 'partial', 'hard', 'hard',
    ]);
  });
});

describe('ZVS from v_ds at the turn-on edges', () => {
  // The synthetic node swings linearly over swing * td after the outgoing gate falls; the incoming
  // edge comes td after that fall. Closed forms of that construction:
  //   swing <= 1: v_ds(edge) = 0, threshold a Vin reached at (1 - a) swing td -> margin td (1 - (1 - a) swing)
  //   swing > 1:  v_ds(edge) = Vin (1 - 1 / swing), margin reported as -td (documented sentinel).
  const run = (swing: number, inverter: 'half-bridge' | 'full-bridge' = 'half-bridge') => {
    const w = sineSet(fs, 3, -0.3, { deadTime: td, swing, inverter });
    const edges = turnOnEdges(w, windowSpan(w, win), 0.05);
    return { edges, sum: summarizeZvs(edges, 0.05) };
  };

  it('complete swing: ZVS on every edge with the exact margin', () => {
    const { edges, sum } = run(0.5);
    expect(edges).toHaveLength(2 * win.cycles);
    expect(sum.zvs).toBe(true);
    expect(sum.zvsState).toBe('zvs');
    expect(sum.zvsWorstVoltage).toBeCloseTo(0, 12);
    expect(sum.zvsMarginTime / td).toBeCloseTo(1 - 0.95 * 0.5, 9);
  });

  it('half swing: partial, worst voltage Vin/2, negative margin', () => {
    const { sum } = run(2);
    expect(sum.zvs).toBe(false);
    expect(sum.zvsState).toBe('partial');
    expect(sum.zvsWorstVoltage).toBeCloseTo(0.5, 9);
    expect(sum.zvsMarginTime).toBeCloseTo(-td, 15);
  });

  it('almost no swing: hard', () => {
    const { sum } = run(100);
    expect(sum.zvsState).toBe('hard');
    expect(sum.zvsWorstVoltage).toBeCloseTo(0.99, 9);
  });

  it('full bridge: four switches, every edge evaluated', () => {
    const { edges, sum } = run(0.5, 'full-bridge');
    expect(edges).toHaveLength(4 * win.cycles);
    expect(sum.zvs).toBe(true);
  });

  it('no edges is an error, not a silent pass', () => {
    expect(() => summarizeZvs([], 0.05)).toThrow(/no gate turn-on edge/);
  });
});

describe('region and turn-off current from the tank-current sign', () => {
  // Tank current A sin(ws tau + phase), tau from the bridge flip; high-side turn-on at tau = td/2.
  const A = 3;

  it('lagging current: inductive, body-diode current at turn-on = A sin(0.3 - ws td/2)', () => {
    const w = sineSet(fs, A, -0.3, { deadTime: td });
    const edges = turnOnEdges(w, windowSpan(w, win), 0.05);
    expect(regionOf(edges)).toBe('inductive');
    for (const e of edges) expect(e.diodeCurrent).toBeCloseTo(A * Math.sin(0.3 - (ws * td) / 2), 6);
  });

  it('leading current (wrong sign at turn-on): capacitive', () => {
    const w = sineSet(fs, A, 0.3, { deadTime: td, inverter: 'full-bridge' });
    expect(regionOf(turnOnEdges(w, windowSpan(w, win), 0.05))).toBe('capacitive');
  });

  it('one wrong edge is enough (worst case)', () => {
    const w = sineSet(fs, A, -0.3, { deadTime: td });
    const edges = turnOnEdges(w, windowSpan(w, win), 0.05);
    edges[3] = { ...edges[3], diodeCurrent: -1e-3 };
    expect(regionOf(edges)).toBe('capacitive');
  });

  it('turn-off current equals the FHA form Ir,pk sin(phi) for a sinusoidal tank current', () => {
    // docs/method.md#switches: I_off = Ir,pk sin(phi); exact when the current is a sinusoid lagging by
    // phi and the gate falls at the bridge flip (zero dead time).
    const w = sineSet(fs, A, -0.3, { deadTime: 0 });
    expect(turnOffCurrent(w, windowSpan(w, win))).toBeCloseTo(A * Math.sin(0.3), 6);
    // With dead time the gate falls td/2 before the flip: A sin(0.3 + ws td/2) (construction).
    const wd = sineSet(fs, A, -0.3, { deadTime: td });
    expect(turnOffCurrent(wd, windowSpan(wd, win))).toBeCloseTo(A * Math.sin(0.3 + (ws * td) / 2), 6);
  });

  it('turn-off current is negative when it flows the wrong way', () => {
    const w = sineSet(fs, A, 0.3, { deadTime: 0 });
    expect(turnOffCurrent(w, windowSpan(w, win))).toBeCloseTo(-A * Math.sin(0.3), 6);
  });
});
