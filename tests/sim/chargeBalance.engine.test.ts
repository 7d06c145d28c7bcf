// Steady state proven by charge balance on a large output capacitor (system ngspice).
// The demo with a 10 mF output capacitor at 340 V, 25 % load and a fixed 80.51 kHz: behind that
// capacitor a 0.1 % output-voltage agreement hid an 18 % charge imbalance (diode average 1.03 A
// where Io/2 is 1.25 A). The default settings must now give the long-settled currents.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine } from '../../src/engine/index.js';
import { expandCorners } from '../../src/corners/expand.js';
import { predictCorner } from '../../src/fha/predict.js';
import { buildDeck } from '../../src/netlist/deck.js';
import { toWaveforms } from '../../src/netlist/waveforms.js';
import { measure } from '../../src/measure/index.js';
import { stateBalance } from '../../src/measure/balance.js';
import { simulateCorner } from '../../src/run/corner.js';
import { startPoint } from '../../src/plan/start.js';
import { loadDemo } from '../support/demo.js';
import type { Design } from '../../src/design/types.js';
import type { Corner } from '../../src/corners/types.js';

const native = createNgspiceEngine();
afterAll(async () => { await native.close(); });

let design: Design;
let corner: Corner;
beforeAll(async () => {
  const demo = await loadDemo();
  design = { ...demo, output: { ...demo.output, capacitance: 10e-3 },
    operating: { ...demo.operating, vin: [340], load: [{ kind: 'percent', value: 0.25 }], frequency: [80.51e3] } };
  [corner] = expandCorners(design) as [Corner];
});
const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('10 mF output capacitor, default settings', () => {
  it('diode average, tank RMS and diode RMS within 1 % of a long-settled run', async () => {
    const fha = predictCorner(design, corner);
    const out = await simulateCorner(native, design, corner, fha);
    const sim = out.result.sim!;
    expect(sim.settled).toBe(true);
    expect(Math.abs(sim.chargeBalanceError!)).toBeLessThanOrEqual(design.simulation.chargeBalanceTolerance);
    expect(sim.periodicityError!).toBeLessThanOrEqual(design.simulation.periodicityTolerance);
    // The shooting step keeps it short: Co (ESR + Rth || RL) is about 47 cycles here, and waiting it
    // out to 1 % balance took 200+ cycles.
    expect(sim.cycles).toBeLessThanOrEqual(90);

    // Reference: one plain 480-cycle run from the same start (about 10 time constants), last 6 cycles.
    const start = startPoint(design, corner, fha);
    const deck = buildDeck({ design, corner, fs: start.fs, seed: start.seed, cycles: 480, saveCycles: 12 });
    const long = await native.run({ id: 'long', deck: deck.text, timeoutMs: 120_000 });
    expect(long.ok).toBe(true);
    const w = toWaveforms(design, corner, start.fs, long.vectors);
    const T = 1 / start.fs;
    // the reference itself is settled: balanced within 0.1 %
    expect(Math.abs(stateBalance(w, deck.tstop - 12 * T, deck.tstop, corner.load).chargeBalance)).toBeLessThan(1e-3);
    const ref = measure(w, { tStart: deck.tstop - 6 * T, cycles: 6 }, { zvsThreshold: design.simulation.zvsThreshold });
    expect(rel(sim.diodeCurrentAvg, ref.diodeCurrentAvg)).toBeLessThan(0.01);
    expect(rel(sim.tankCurrentRms, ref.tankCurrentRms)).toBeLessThan(0.01);
    expect(rel(sim.diodeCurrentRms, ref.diodeCurrentRms)).toBeLessThan(0.01);
    // and the reference is what Io demands of each diode (Io / 2; charge balance of the capacitor)
    expect(rel(ref.diodeCurrentAvg, ref.iout / 2)).toBeLessThan(2e-3);
  }, 120_000);
});
