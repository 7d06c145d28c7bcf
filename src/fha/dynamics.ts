import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { predictCorner } from './predict.js';

// FHA's view of how a corner's output moves: its slope against the switching frequency (the first
// step of a regulated search) and the time constant of the slow output mode (how long an output
// error takes to settle). Both are central differences of the FHA prediction.

/** FHA slope dVo/dfs at a frequency, V/Hz (negative on the inductive branch). */
export function fhaSlope(design: Design, corner: Corner, fs: number): number {
  const h = fs * 0.005;
  const v = (f: number) => predictCorner(design, { ...corner, fs: f }).vout ?? 0;
  return (v(fs + h) - v(fs - h)) / (2 * h);
}

/**
 * Time constant of the slow output mode, s: Co (RL || Rth), where Rth = -dVo/dIo is the
 * converter's output resistance at this frequency from FHA (twice that, as FHA may err), capped
 * at RL Co. It turns a measured output slope into the error that is left to settle.
 */
export function outputTimeConstant(design: Design, corner: Corner, fs: number): number {
  const rl = corner.load;
  const vo = (r: number) => predictCorner(design, { ...corner, fs, load: r }).vout ?? 0;
  const v1 = vo(rl);
  const v2 = vo(rl * 1.01);
  const rth = Math.max(0, (2 * -(v2 - v1)) / (v2 / (rl * 1.01) - v1 / rl));
  const par = Number.isFinite(rth) ? (rth * rl) / (rth + rl || 1) : rl;
  return design.output.capacitance * Math.min(Math.max(par, 0), rl);
}
