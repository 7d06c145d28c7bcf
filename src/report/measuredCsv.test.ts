import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { attachMeasured, measuredReport } from '../measured/index.js';
import type { Results } from '../results/types.js';
import { loadDemo } from './html/fixture.test-support.js';
import { renderResultsCsv } from './csv.js';
import { textCell } from './measuredCsv.js';

const demo = await loadDemo();
const rec = demo.results.corners.find((c) => c.id === 'v390_100pct_reg_nom')!;
// the recorded run predates the simulated input power: give it one (invented, 97 % conduction efficiency)
const c0 = { ...rec, sim: { ...rec.sim!, inputPower: rec.sim!.pout / 0.97 } };
// an invented bench point at the simulated fs, Vout 3 % under the simulation, input current given
const point = { line: 7, vin: c0.inputs.vin, load: { kind: 'ohm' as const, value: c0.inputs.load }, fs: c0.sim!.fs, vout: c0.sim!.vout * 0.97,
  iin: 0.64, tankCurrentRms: 1.9, note: '=HYPERLINK("x"), "quoted"' };
const corners = demo.results.corners.map((c) => (c.id === c0.id ? attachMeasured(c0, point, 0.02) : c));
const results: Results = { ...demo.results, corners, measured: measuredReport({ ...demo.results, corners }, 'b.csv', 0.02) };

// parsed back with the csv-parse reference library, numbers cast back to numbers
const rows: Record<string, string>[] = parse(renderResultsCsv(results), { columns: true });
const of = (id: string, metric: string) => rows.find((r) => r.corner === id && r.metric === metric)!;

describe('results.csv bench columns', () => {
  it('gives the measured value and the gap of each model on the metric rows, numbers as plain numbers', () => {
    const v = of(c0.id, 'vout');
    expect(Number(v.measured)).toBeCloseTo(c0.sim!.vout * 0.97, 12);
    expect(Number(v.gap_sim)).toBeCloseTo(-0.03, 12); // (0.97 Vsim - Vsim) / Vsim
    expect(Number(v.gap_fha)).toBeCloseTo((c0.sim!.vout * 0.97 - c0.fha.vout!) / c0.fha.vout!, 12);
    expect(Number(v.gap_ideal)).toBeCloseTo((c0.sim!.vout * 0.97 - c0.ideal!.vout) / c0.ideal!.vout, 12);
    expect(v.within).toBe('no');
    expect(v.measured_line).toBe('7');
    const t = of(c0.id, 'tankCurrentRms');
    expect(Number(t.gap_sim)).toBeCloseTo((1.9 - c0.sim!.tankCurrentRms) / c0.sim!.tankCurrentRms, 12);
    expect(v.measured).toMatch(/^[\d.]+$/);
  });

  it('adds input current, power and efficiency rows: Pout / Pin by hand', () => {
    expect(Number(of(c0.id, 'iin').measured)).toBe(0.64);
    const pin = 390 * 0.64; // Vin x Iin, W
    expect(Number(of(c0.id, 'pin').measured)).toBeCloseTo(pin, 12);
    const eff = of(c0.id, 'efficiency');
    // Pout = Vout^2 / R at the measured Vout
    expect(Number(eff.measured)).toBeCloseTo(((c0.sim!.vout * 0.97) ** 2 / c0.inputs.load) / pin, 12);
    expect(Number(eff.sim)).toBeCloseTo(0.97, 12);
    expect(Number(of(c0.id, 'pin').sim)).toBeCloseTo(c0.sim.pout / 0.97, 9);
  });

  it('escapes a note that would run as a formula and leaves other corners\' bench cells empty', () => {
    expect(of(c0.id, 'vout').note).toBe('\'=HYPERLINK("x"), "quoted"');
    expect(textCell('-3 dB')).toBe('\'-3 dB');
    expect(textCell('probe 1')).toBe('probe 1');
    const other = of('v340_25pct_reg_nom', 'vout');
    expect([other.measured, other.gap_sim, other.within, other.note]).toEqual(['', '', '', '']);
    expect(rows.filter((r) => r.metric === 'efficiency')).toHaveLength(1);
  });
});
