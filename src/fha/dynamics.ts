import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { predictCorner } from './predict.js';

// FHA's view of how a corner's output moves with the switching frequency (the first step of a
// regulated search when the ideal model has no slope): a central difference of the FHA prediction.

/** FHA slope dVo/dfs at a frequency, V/Hz (negative on the inductive branch). */
export function fhaSlope(design: Design, corner: Corner, fs: number): number {
  const h = fs * 0.005;
  const v = (f: number) => predictCorner(design, { ...corner, fs: f }).vout ?? 0;
  return (v(fs + h) - v(fs - h)) / (2 * h);
}
