import { describe, expect, it } from 'vitest';
import { evalState, expand, newPoly, project, scalarIntegral, scalarRoot, scalarSquareIntegral } from './taylor.js';
import { firstCrossing } from './crossing.js';

// Closed-form solutions of linear ODEs (textbook results, e.g. any ODE text): x'' = -x gives
// cos/sin; x' = -x + 1 gives 1 - e^-t.
describe('Taylor stepping of x\' = A x + b', () => {
  const a = new Float64Array(16);
  a[1] = 1; // x0' = x1
  a[4] = -1; // x1' = -x0
  a[10] = -1; // x2' = -x2 + 1
  const b = new Float64Array([0, 0, 1, 0]);
  const p = newPoly();
  expand(a, b, [1, 0, 0, 0], 1, p);
  const out = new Float64Array(4);

  it('oscillator and first-order lag to 1e-15 over one step of 1 rad', () => {
    for (const t of [0.1, 0.5, 1]) {
      evalState(p, t, out);
      expect(out[0]).toBeCloseTo(Math.cos(t), 15);
      expect(out[1]).toBeCloseTo(-Math.sin(t), 15);
      expect(out[2]).toBeCloseTo(1 - Math.exp(-t), 15);
    }
  });

  it('integrals of a projection: exact linear, Gauss-Legendre square', () => {
    const g = new Float64Array(80);
    project(p, [1, 0, 0, 0], 0, g);
    expect(scalarIntegral(g, p.order, 1)).toBeCloseTo(Math.sin(1), 15);
    expect(scalarSquareIntegral(g, p.order, 1)).toBeCloseTo(0.5 + Math.sin(2) / 4, 14);
  });

  it('root of a projection: cos t - 0.5 at pi/3', () => {
    const g = new Float64Array(80);
    project(p, [1, 0, 0, 0], -0.5, g);
    expect(scalarRoot(g, p.order, 0, 1.1)).toBeCloseTo(Math.PI / 3, 14);
  });
});

describe('guard crossing inside a step', () => {
  it('finds a dip between the samples (starts just above 0, falls, comes back)', () => {
    // g = 1e-7 - 1.8 t + 97 t^2 dips below zero between t = 5.6e-8 and 0.0186, all inside the
    // first quarter of a 0.077 step: seen from the interior minimum, not from the samples.
    const g = new Float64Array([1e-7, -1.8, 97]);
    const r = firstCrossing(g, 2, 0.077)!;
    expect(r).toBeCloseTo((1.8 - Math.sqrt(1.8 ** 2 - 4 * 97 * 1e-7)) / (2 * 97), 15);
  });
  it('starts on the boundary with zero slope and positive curvature: the crossing after the maximum', () => {
    // g = 0.00925 t^2 - 0.0405 t^3: zero at t = 0 and at t = 0.2284.
    const g = new Float64Array([0, 0, 0.00925, -0.0405]);
    expect(firstCrossing(g, 3, 1)).toBeCloseTo(0.00925 / 0.0405, 12);
  });
  it('no crossing for a positive guard', () => {
    expect(firstCrossing(new Float64Array([1, 0.5, -0.2]), 2, 1)).toBeNull();
  });
});
