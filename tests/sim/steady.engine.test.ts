// Steady-state verification against real ngspice: a seeded, verified steady state against a long
// run from rest (common practice: a periodic steady state does not depend on the start). Slow-tagged (*.engine.test.ts).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine, createWasmEngine } from '../../src/engine/index.js';
import { expandCorners } from '../../src/corners/expand.js';
import { predictCorner } from '../../src/fha/predict.js';
import { fhaSeed } from '../../src/netlist/fhaState.js';
import { buildDeck } from '../../src/netlist/deck.js';
import { toWaveforms } from '../../src/netlist/waveforms.js';
import { simulateSteady } from '../../src/run/steady.js';
import { makeSpan, spanAverage, spanRms } from '../../src/measure/index.js';
import { loadDemo } from '../support/demo.js';
import type { Design } from '../../src/design/types.js';
import type { Corner } from '../../src/corners/types.js';

const native = createNgspiceEngine();
const wasm = createWasmEngine();
afterAll(async () => { await native.close(); await wasm.close(); });

let design: Design;
let corner: Corner;
let fs: number;
beforeAll(async () => {
  design = await loadDemo();
  // nominal corner of the demo at 390 V and full load, at the FHA regulated frequency
  corner = expandCorners(design).find((c) => c.id === 'v390_100pct_reg_nom')!;
  fs = predictCorner(design, corner).fs!;
});
const opts = { tolerance: 1e-3, maxCycles: 2000 };
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('steady state on the demo nominal corner', () => {
  it('the seeded, verified steady state agrees with a long run from zero state within 0.2 % on Vout', async () => {
    const seeded = await simulateSteady(native, design, corner, fs, fhaSeed(design, corner, fs, 24), opts);
    expect(seeded.settled).toBe(true);
    // Zero state, 600 cycles (a zero start settled in about 225 cycles when measured during development), average of the last 20.
    const zero = { vo: 0, ir: 0, im: 0, vcr: 0, va: 0, vb: 0 };
    const deck = buildDeck({ design, corner, fs, seed: zero, cycles: 600, saveCycles: 20 });
    const long = await native.run({ id: 'long', deck: deck.text, timeoutMs: 120_000 });
    expect(long.ok).toBe(true);
    const w = toWaveforms(design, corner, fs, long.vectors);
    const vLong = spanAverage(makeSpan(w.t, deck.tstart, deck.tstop), w.vout);
    expect(rel(seeded.metrics!.vout, vLong)).toBeLessThan(0.002);
    // and the seed is the point: far fewer cycles than the zero start
    expect(seeded.cycles).toBeLessThanOrEqual(60);
  });

  it('halving the time step moves Vout by < 0.2 % and the tank RMS current by < 1 %', async () => {
    const seed = fhaSeed(design, corner, fs, 24);
    const a = await simulateSteady(native, design, corner, fs, seed, { ...opts, profile: { method: 'trap', reltol: 1e-4, stepsPerPeriod: 350 } });
    const b = await simulateSteady(native, design, corner, fs, seed, { ...opts, profile: { method: 'trap', reltol: 1e-4, stepsPerPeriod: 700 } });
    expect(rel(a.metrics!.vout, b.metrics!.vout)).toBeLessThan(0.002);
    expect(rel(a.metrics!.tankCurrentRms, b.metrics!.tankCurrentRms)).toBeLessThan(0.01);
  });

  it('the wasm and system engines agree on average Vout within 0.1 % and tank RMS within 1 %', async () => {
    const seed = fhaSeed(design, corner, fs, 24);
    const n = await simulateSteady(native, design, corner, fs, seed, opts);
    const w = await simulateSteady(wasm, design, corner, fs, seed, opts);
    expect(n.ok && w.ok).toBe(true);
    expect(rel(w.metrics!.vout, n.metrics!.vout)).toBeLessThan(0.001);
    expect(rel(w.metrics!.tankCurrentRms, n.metrics!.tankCurrentRms)).toBeLessThan(0.01);
  });

  it('the tank RMS current at fs = fr matches the exact ideal result of docs/method.md#tank-currents within 2 %', async () => {
    // docs/method.md#tank-currents (derived): at fs = fr, Ir,rms = sqrt((pi Io / (2 sqrt2 n))^2 + Im,pk^2 / 2), Im,pk = n V_rect / (4 fs Lm).
    const fr = predictCorner(design, corner).fr;
    const r = await simulateSteady(native, design, corner, fr, fhaSeed(design, corner, fr, 24), opts);
    const m = r.metrics!;
    const n = corner.turnsRatio;
    const vrect = m.vout + design.rectifier.forwardVoltage;
    const exact = Math.hypot((Math.PI * m.iout) / (2 * Math.SQRT2 * n), (n * vrect) / (4 * fr * corner.lm) / Math.SQRT2);
    expect(rel(m.tankCurrentRms, exact)).toBeLessThan(0.02);
    // the gain at resonance is 1 less the losses FHA leaves out (docs/method.md#fha-limits)
    expect(m.gain).toBeGreaterThan(0.98);
    expect(m.gain).toBeLessThan(1.005);
    void spanRms;
  });

  it('an integrated Lr (transformer leakage) simulates like the discrete Lr it replaces', async () => {
    // Coupled inductors with all leakage on the primary are equivalent to Lleak = (1 - k^2) Lp,
    // Lm = k^2 Lp and an ideal ratio k sqrt(Lp/Ls) (transformer T-model, common practice): with
    // Lp = Lr + Lm, k^2 = Lm / (Lr + Lm) and Ls = Lm / n^2 the deck is the discrete tank.
    const seed = fhaSeed(design, corner, fs, 24);
    const integrated = { ...design, tank: { ...design.tank, integrated: true } };
    const a = await simulateSteady(native, design, corner, fs, seed, opts);
    const b = await simulateSteady(native, integrated, corner, fs, seed, opts);
    expect(rel(b.metrics!.vout, a.metrics!.vout)).toBeLessThan(0.002);
    expect(rel(b.metrics!.tankCurrentRms, a.metrics!.tankCurrentRms)).toBeLessThan(0.01);
    expect(rel(b.metrics!.magnetizingCurrentPeak, a.metrics!.magnetizingCurrentPeak)).toBeLessThan(0.01);
  });
});

