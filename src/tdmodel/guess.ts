import type { Circuit } from './model.js';

type C = [number, number];
const mul = (a: C, b: C): C => [a[0] * b[0] - a[1] * b[1], a[0] * b[1] + a[1] * b[0]];
const div = (a: C, b: C): C => {
  const d = b[0] * b[0] + b[1] * b[1];
  return [(a[0] * b[0] + a[1] * b[1]) / d, (a[1] * b[0] - a[0] * b[1]) / d];
};
const add = (a: C, b: C): C => [a[0] + b[0], a[1] + b[1]];

/**
 * Starting state for the shooting, normalized (i_r, i_m, v_cr - V_dc) at t = 0, from first-
 * harmonic phasors: the bridge fundamental (4/pi) Vin_eff sin(ws (t - td/2)) drives Zs + (j ws Lm
 * || Rac), with Rac chosen so that the FHA gain matches the held output (docs/method.md#gain);
 * unreachable gains fall back to no load, fn = 1 (gain independent of load) to Q = 0.3.
 */
export function phasorGuess(c: Circuit): number[] {
  const fn = Math.PI / c.half; // normalized ws
  const ln = c.lm;
  const vinEff = (c.vh - c.vl) / 2;
  const m = c.vc / vinEff;
  const a = 1 + (1 - 1 / (fn * fn)) / ln;
  const b = fn - 1 / fn;
  let q = 0.3;
  if (Math.abs(b) > 1e-9) {
    const q2 = (1 / (m * m) - a * a) / (b * b);
    q = q2 > 0 ? Math.sqrt(q2) : 0;
  }
  const v1 = (4 / Math.PI) * vinEff;
  const ph = -fn * c.td / 2;
  const vs: C = [v1 * Math.cos(ph), v1 * Math.sin(ph)];
  const zs: C = [c.rs, fn - 1 / fn];
  const xm: C = [0, fn * ln];
  // Zp = j X Rac / (Rac + j X) = j X / (1 + j X Q) with Rac = 1/Q (normalized).
  const zp = q > 0 ? div(xm, [1, fn * ln * q]) : xm;
  let zin = add(zs, zp);
  const mag = Math.hypot(zin[0], zin[1]);
  if (mag < 0.05) zin = [0.05, 0]; // near the no-load pole: keep the guess finite
  const i = div(vs, zin);
  const im = div(mul(i, zp), xm);
  const vcr = div(i, [0, fn]);
  // Phasors in the sine convention: value at t = 0 is the imaginary part.
  return [i[1], im[1], vcr[1]];
}
