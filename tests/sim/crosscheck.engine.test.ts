// FHA against simulation on the demo (issue: measurements and the cross-check). Slow-tagged.
// Expected signs come from docs/method.md#fha-limits: below resonance (away from fp) the real
// gain exceeds FHA, above resonance it falls below; at resonance the ideal gain is 1 for any load.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine, createWasmEngine } from '../../src/engine/index.js';
import { runStudy } from '../../src/run/study.js';
import { tankConstants } from '../../src/fha/predict.js';
import { loadDemo } from '../support/demo.js';
import type { Design } from '../../src/design/types.js';
import type { Results } from '../../src/results/types.js';

const native = createNgspiceEngine();
afterAll(() => native.close());

let demo: Design;
let fr: number;
beforeAll(async () => {
  demo = await loadDemo();
  fr = tankConstants(demo.tank).fr;
});

for (const engineName of ['ngspice', 'wasm'] as const) describe(`cross-check on fixed-frequency corners of the demo (${engineName})`, () => {
  let fixed: Results;
  beforeAll(async () => {
    // Fixed frequencies around resonance at 390 V, full load; the last one is far below the
    // zero-phase boundary (FHA fn_zp = 0.48 at this Q), which forces the capacitive region.
    const design: Design = { ...demo, operating: { ...demo.operating, vin: [390], load: [{ kind: 'percent', value: 1 }],
      frequency: [0.75 * fr, 0.85 * fr, fr, 1.25 * fr, 1.5 * fr, 0.42 * fr] } };
    const engine = engineName === 'wasm' ? createWasmEngine() : native;
    fixed = (await runStudy(design, { engine })).results;
    if (engine !== native) await engine.close();
  }, 240_000);
  const at = (fn: number) => fixed.corners.find((c) => Math.abs(c.inputs.fs! / fr - fn) < 1e-6)!;

  it('every corner simulated and settled', () => {
    expect(fixed.corners).toHaveLength(6);
    for (const c of fixed.corners) expect(c.sim?.settled).toBe(true);
  });
  it('at resonance the simulated gain is within 4 % of FHA', () => {
    const c = at(1);
    expect(Math.abs(c.sim!.gain - c.fha.gain!) / c.fha.gain!).toBeLessThan(0.04);
  });
  it('below resonance the simulated gain exceeds FHA; above resonance it falls below', () => {
    for (const fn of [0.75, 0.85]) expect(at(fn).sim!.gain).toBeGreaterThan(at(fn).fha.gain!);
    for (const fn of [1.25, 1.5]) expect(at(fn).sim!.gain).toBeLessThan(at(fn).fha.gain!);
  });
  it('rectifier ZCS holds below resonance and is lost above (docs/method.md#zcs)', () => {
    for (const fn of [0.75, 0.85]) expect(at(fn).sim!.zcs).toBe(true);
    for (const fn of [1.25, 1.5]) expect(at(fn).sim!.zcs).toBe(false);
    expect(at(0.85).sim!.mode).toMatch(/^P+O/);
    // above resonance the rectifier never idles (NP, or P when the N part is shorter than the label's
    // 2 % resolution)
    expect(at(1.5).sim!.mode).not.toMatch(/O/);
  });
  it('a corner forced into the capacitive region loses ZVS, and the divergence is reported', () => {
    const c = at(0.42);
    expect(c.fha.region).toBe('capacitive');
    expect(c.sim!.region).toBe('capacitive');
    expect(c.sim!.zvs).toBe(false);
    expect(at(1).sim!.zvs).toBe(true);
  });
  it('divergences carry reasons; no gain error contradicts FHA theory on a correct model', () => {
    const all = fixed.corners.flatMap((c) => c.divergences);
    for (const d of all) expect(d.reason.length).toBeGreaterThan(10);
    expect(fixed.corners.flatMap((c) => c.divergences.filter((d) => d.metric === 'gain' && d.unexpectedSign))).toHaveLength(0);
  });
});

describe('the regulated demo on both engines', () => {
  it('meets output.voltage within 0.5 % on every corner and both engines give the same verdicts', async () => {
    const a = (await runStudy(demo, { engine: native })).results;
    const wasm = createWasmEngine();
    const b = (await runStudy(demo, { engine: wasm })).results.corners;
    await wasm.close();
    for (const [i, c] of a.corners.entries()) {
      expect(Math.abs(c.sim!.vout - 24) / 24).toBeLessThanOrEqual(0.005);
      expect(b[i]!.status).toBe(c.status);
      expect(b[i]!.sim!.zvs).toBe(c.sim!.zvs);
      expect(b[i]!.sim!.zcs).toBe(c.sim!.zcs);
      expect(Math.abs(b[i]!.sim!.fs - c.sim!.fs) / c.sim!.fs).toBeLessThan(0.005);
    }
    // below resonance (340 V) the simulated frequency is above FHA's: more gain needs a higher fs
    const low = a.corners.find((c) => c.id === 'v340_100pct_reg_nom')!;
    expect(low.sim!.fs).toBeGreaterThan(low.fha.fs!);
    const high = a.corners.find((c) => c.id === 'v410_100pct_reg_nom')!;
    expect(high.sim!.fs).toBeLessThan(high.fha.fs!);
  }, 240_000);
});
