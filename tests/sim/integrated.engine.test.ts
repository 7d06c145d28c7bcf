// Integrated transformer (tank.integrated: true): the entered turnsRatio is the winding ratio Np/Ns;
// the models use the cantilever model's ideal ratio k Np/Ns (docs/design-file.md, `tank`; R. W.
// Erickson, D. Maksimovic, PESC 1998, from memory). Closed-form equivalence: an integrated design
// and the discrete design it equals (Lr, Lm, n = k Np/Ns) give the same Vout (system ngspice).
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine } from '../../src/engine/index.js';
import { expandCorners } from '../../src/corners/expand.js';
import { predictCorner } from '../../src/fha/predict.js';
import { simulateCorner } from '../../src/run/corner.js';
import { loadDemo } from '../support/demo.js';
import type { Design } from '../../src/design/types.js';

const native = createNgspiceEngine();
afterAll(async () => { await native.close(); });

let discrete: Design;
let integrated: Design;
const k = Math.sqrt(300e-6 / (60e-6 + 300e-6)); // demo Lm 300 uH, Lr 60 uH: k = 0.9129
beforeAll(async () => {
  const demo = await loadDemo();
  const op = { ...demo.operating, vin: [390], load: [{ kind: 'percent' as const, value: 1 }], frequency: [99e3] };
  discrete = { ...demo, operating: op, tank: { ...demo.tank, turnsRatio: 8, integrated: false } };
  integrated = { ...demo, operating: op, tank: { ...demo.tank, turnsRatio: 8 / k, integrated: true } };
});

describe('integrated transformer turns ratio', () => {
  it('the winding ratio and the effective ratio differ by exactly k; FHA is the discrete one', () => {
    const [d] = expandCorners(discrete);
    const [i] = expandCorners(integrated);
    expect(i!.windingRatio).toBeCloseTo(8 / k, 12);
    expect(i!.turnsRatio / i!.windingRatio!).toBeCloseTo(k, 14);
    expect(i!.turnsRatio).toBeCloseTo(d!.turnsRatio, 12);
    expect(predictCorner(integrated, i!).vout).toBeCloseTo(predictCorner(discrete, d!).vout!, 10);
  });

  it('simulated: the integrated design and its discrete equal give the same Vout within 0.1 %', async () => {
    const [d] = expandCorners(discrete);
    const [i] = expandCorners(integrated);
    const a = await simulateCorner(native, discrete, d!, predictCorner(discrete, d!));
    const b = await simulateCorner(native, integrated, i!, predictCorner(integrated, i!));
    expect(a.result.sim!.settled && b.result.sim!.settled).toBe(true);
    expect(Math.abs(b.result.sim!.vout / a.result.sim!.vout - 1)).toBeLessThan(1e-3);
    // and a winding ratio entered as if it were the effective one would be off by k: gain 9.5 % lower
    expect(1 / k - 1).toBeGreaterThan(0.09);
  }, 120_000);
});
