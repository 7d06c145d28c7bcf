import { describe, expect, it } from 'vitest';
import { expandCorners, idNumber, toleranceSets } from './expand.js';
import { makeDesign } from '../../tests/support/design.js';

// The ids are the corners' stable names: baselines, caches, --only patterns and JUnit cases key on
// them, so a change here breaks users' files. These tests pin them.

describe('idNumber: compact, file-name-safe numbers (6 significant digits)', () => {
  it.each([
    [390, '390'], [0.5, '0p5'], [97.5, '97p5'], [1 / 3, '0p333333'], [123456789, '123457000'], [1e21, '1e21'],
    [1e-7, '1em7'], [-12.5, 'm12p5'], [100.0000001, '100'], [0, '0'],
  ])('%s -> %s', (x, id) => expect(idNumber(x)).toBe(id));

  it('yields only [a-z0-9.-] characters and no dot', () => {
    for (const x of [1e21, 2.5e-12, -0.001, 65535.49, Math.PI]) expect(idNumber(x)).toMatch(/^[a-z0-9-]+$/);
  });
});

describe('corner ids', () => {
  it('grid order vin x load x frequency, with the load and frequency written as given', () => {
    const d = makeDesign({ output: { voltage: 24 }, operating: { vin: [340, 410], ratedPower: 240, corners: [],
      load: [{ kind: 'percent', value: 0.25 }, { kind: 'ohm', value: 2.4 }, { kind: 'watt', value: 120 }, { kind: 'ampere', value: 5 }],
      frequency: [95e3, 102.5e3] } });
    expect(expandCorners(d).map((c) => c.id)).toEqual([
      'v340_25pct_f95k_nom', 'v340_25pct_f102p5k_nom', 'v340_2p4ohm_f95k_nom', 'v340_2p4ohm_f102p5k_nom',
      'v340_120w_f95k_nom', 'v340_120w_f102p5k_nom', 'v340_5a_f95k_nom', 'v340_5a_f102p5k_nom',
      'v410_25pct_f95k_nom', 'v410_25pct_f102p5k_nom', 'v410_2p4ohm_f95k_nom', 'v410_2p4ohm_f102p5k_nom',
      'v410_120w_f95k_nom', 'v410_120w_f102p5k_nom', 'v410_5a_f95k_nom', 'v410_5a_f102p5k_nom',
    ]);
  });

  it('converts every load kind to ohm at output.voltage (R = V^2 / P, V / I)', () => {
    const d = makeDesign({ output: { voltage: 24 }, operating: { vin: [400], ratedPower: 240, corners: [], frequency: 'regulate',
      load: [{ kind: 'percent', value: 0.25 }, { kind: 'ohm', value: 2.4 }, { kind: 'watt', value: 120 }, { kind: 'ampere', value: 5 }] } });
    const cs = expandCorners(d);
    // 25 % of 240 W = 60 W -> 576 / 60 = 9.6 ohm; 120 W -> 4.8 ohm; 5 A -> 4.8 ohm
    expect(cs.map((c) => c.load)).toEqual([9.6, 2.4, 4.8, 4.8].map((r) => expect.closeTo(r, 12)));
    expect(cs.map((c) => c.loadLabel)).toEqual(['25%', '2.4 ohm', '120 W', '5 A']);
    expect(cs.map((c) => c.pout)).toEqual([60, 240, 120, 120].map((p) => expect.closeTo(p, 9)));
    expect(cs.map((c) => c.iout)).toEqual([2.5, 10, 5, 5].map((i) => expect.closeTo(i, 12)));
    expect(cs.every((c) => c.fs === null && c.id.includes('_reg_'))).toBe(true);
  });

  it('tolerance suffixes: nominal first, then every low/high combination in lr, cr, lm order', () => {
    const d = makeDesign({ tolerances: { lr: 0.1, cr: 0.05, lm: 0.2, corners: 'extremes' } });
    const cs = expandCorners(d);
    expect(cs.map((c) => c.id.replace(/^v400_4ohm_f90k_/, ''))).toEqual([
      'nom', 'lrL-crL-lmL', 'lrL-crL-lmH', 'lrL-crH-lmL', 'lrL-crH-lmH', 'lrH-crL-lmL', 'lrH-crL-lmH', 'lrH-crH-lmL', 'lrH-crH-lmH',
    ]);
    expect(cs[1]).toMatchObject({ lr: expect.closeTo(45e-6, 15), cr: expect.closeTo(47.5e-9, 18), lm: expect.closeTo(200e-6, 15) });
    expect(cs[8]).toMatchObject({ lr: expect.closeTo(55e-6, 15), cr: expect.closeTo(52.5e-9, 18), lm: expect.closeTo(300e-6, 15) });
  });

  it('an element with zero tolerance stays nominal and its sets are not repeated', () => {
    const d = makeDesign({ tolerances: { lr: 0.1, cr: 0, lm: 0, corners: 'extremes' } });
    expect(toleranceSets(d)).toEqual([{ lr: 0, cr: 0, lm: 0 }, { lr: -1, cr: 0, lm: 0 }, { lr: 1, cr: 0, lm: 0 }]);
    expect(expandCorners(d).map((c) => c.id)).toEqual(['v400_4ohm_f90k_nom', 'v400_4ohm_f90k_lrL-crN-lmN', 'v400_4ohm_f90k_lrH-crN-lmN']);
  });

  it('explicit corners come after the grid with the prefix x<n>_ (1-based), absent tank values nominal', () => {
    const d = makeDesign({ operating: { corners: [
      { vin: 400, load: { kind: 'ohm', value: 4 }, frequency: 90e3 },
      { vin: 372.5, load: { kind: 'percent', value: 0.1 }, frequency: null, lm: 200e-6 },
    ] } });
    const cs = expandCorners(d);
    expect(cs.map((c) => c.id)).toEqual(['v400_4ohm_f90k_nom', 'x1_v400_4ohm_f90k_nom', 'x2_v372p5_10pct_reg_nom']);
    expect(cs[2]).toMatchObject({ lm: 200e-6, lr: 50e-6, cr: 50e-9, fs: null });
  });

  it('a repeated id gets -2, -3 ... in order of appearance', () => {
    const d = makeDesign({ operating: { vin: [400, 400, 400] } });
    expect(expandCorners(d).map((c) => c.id)).toEqual(['v400_4ohm_f90k_nom', 'v400_4ohm_f90k_nom-2', 'v400_4ohm_f90k_nom-3']);
  });

  it('is deterministic and every id is file-name safe', () => {
    const d = makeDesign({ operating: { vin: [85.25, 264], load: [{ kind: 'percent', value: 0.333 }] }, tolerances: { lr: 0.1, cr: 0.1, lm: 0.1, corners: 'extremes' } });
    const a = expandCorners(d).map((c) => c.id);
    expect(expandCorners(d).map((c) => c.id)).toEqual(a);
    expect(new Set(a).size).toBe(a.length);
    for (const id of a) expect(id).toMatch(/^[a-z0-9_.-]+$/i);
    expect(a[0]).toBe('v85p25_33p3pct_f90k_nom');
  });
});

describe('corner ids with corners: random', () => {
  it('are the operating point plus _s and the sample number, at least 4 digits, samples innermost', () => {
    const d = makeDesign({ operating: { vin: [390], load: [{ kind: 'percent', value: 1 }], ratedPower: 240, frequency: 'regulate', corners: [] },
      tolerances: { lr: 0.05, cr: 0.05, lm: 0.1, corners: 'random', samples: 3, seed: 42, distribution: 'uniform' } });
    expect(expandCorners(d).map((c) => c.id)).toEqual(['v390_100pct_reg_s0000', 'v390_100pct_reg_s0001', 'v390_100pct_reg_s0002']);
    const many = expandCorners({ ...d, tolerances: { ...d.tolerances, samples: 10001 } });
    expect(many[10000]!.id).toBe('v390_100pct_reg_s10000');
    // the same seed gives the same values for the same sample number whatever the count
    expect(many[2]).toEqual(expandCorners(d)[2]);
  });
});
