// The ideal column against simulation on the demo and the examples, both engines. The ideal
// model (tdmodel) is an independent computation of the same circuit: exact piecewise integration
// of the idealised converter with the output held at a DC voltage, measured by the same code.
// What the simulation adds (exponential diodes, diode capacitance, finite output capacitor and
// ESR) is second order at these corners. Worst figures measured when this test was written
// (bench/RESULTS.md case 8), ngspice-39 / embedded engine: Vout 0.39 % / 0.39 % at fixed-frequency
// corners, regulated fs 0.73 % / 0.73 %, tank RMS 1.41 % / 1.41 %.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine, createWasmEngine } from '../../src/engine/index.js';
import { runStudy } from '../../src/run/study.js';
import { loadDesignOrThrow } from '../../src/design/index.js';
import type { Design } from '../../src/design/types.js';
import type { CornerResult } from '../../src/results/types.js';

const native = createNgspiceEngine();
afterAll(() => native.close());

const file = (name: string) => new URL(`../../examples/${name}`, import.meta.url).pathname;
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

for (const engineName of ['ngspice', 'wasm'] as const) describe(`ideal column against simulation (${engineName})`, () => {
  const corners: CornerResult[] = [];
  let light: CornerResult;
  beforeAll(async () => {
    const engine = engineName === 'wasm' ? createWasmEngine() : native;
    for (const name of ['demo.yaml', 'charger-fb-1kw.yaml']) {
      const design = (await loadDesignOrThrow(file(name))).design;
      corners.push(...(await runStudy(design, { engine, jobs: 1 })).results.corners);
    }
    // Light-load recipe: the demo at 1 % load and 390 V, regulated (mode OPO, a genuine gain rise).
    const demo = (await loadDesignOrThrow(file('demo.yaml'))).design;
    const d: Design = { ...demo, operating: { ...demo.operating, vin: [390], load: [{ kind: 'percent', value: 0.01 }] } };
    light = (await runStudy(d, { engine, jobs: 1 })).results.corners[0]!;
    if (engine !== native) await engine.close();
  }, 300_000);

  it('every corner has an ideal column and a settled simulation (10 corners)', () => {
    expect(corners).toHaveLength(10);
    for (const c of corners) {
      expect(c.ideal, `${c.id}: ${c.idealReason}`).toBeTruthy();
      expect(c.sim?.settled).toBe(true);
    }
  });

  // Tank RMS gets 3 %: at charger v400_100pct_f130k_nom the simulated value is not a stable number.
  // Measured with system ngspice: a 1e-12..1e-11 relative change of fs moved its error against the
  // ideal model between -1.2 % and -2.3 % (the 6-cycle windows differ by about 0.5 % there).
  it('at every inductive corner: Vout within 0.5 % (fixed fs), solved fs within 2 % (regulated), tank RMS within 3 %', () => {
    const inductive = corners.filter((c) => c.sim!.region === 'inductive');
    expect(inductive.length).toBe(10);
    for (const c of inductive) {
      const s = c.sim!;
      const i = c.ideal!;
      if (c.inputs.fs === null) expect(rel(s.fs, i.fs), `${c.id} fs`).toBeLessThan(0.02);
      else expect(rel(s.vout, i.vout), `${c.id} vout`).toBeLessThan(0.005);
      expect(rel(s.tankCurrentRms, i.tankCurrentRms), `${c.id} tank rms`).toBeLessThan(0.03);
    }
  });

  it('every divergence has a cause; on these healthy designs none is unexplained', () => {
    const all = corners.flatMap((c) => c.divergences);
    expect(all.length).toBeGreaterThan(0);
    for (const d of all) expect(['approximation', 'circuit']).toContain(d.cause);
  });

  it('demo at 1 % load and 390 V: OPO, no ? flag, the gain rise classified as FHA\'s approximation', () => {
    expect(light.sim!.mode).toMatch(/O/);
    expect(light.divergences.filter((d) => d.unexpectedSign)).toHaveLength(0);
    for (const d of light.divergences) expect(d.reason).not.toMatch(/suspect/);
    const fs = light.divergences.find((d) => d.metric === 'fs');
    if (fs) expect(fs.cause).toBe('approximation');
  });
});
