/**
 * The start of the next run from the cycle-boundary states of the last one: their RRE limit (see
 * extrapolate.ts) in the four energy states of the converter, the output capacitor voltage, the
 * tank current, the magnetizing current and the Cr voltage. The bridge node voltages are taken
 * from the last state: at the boundary phase (the low-side turn-off instant) they sit on a rail.
 */
import type { DeckSeed } from '../netlist/types.js';
import { reducedRankExtrapolation } from './extrapolate.js';

/** Typical magnitude of each state, to make the components comparable (V, A, A, V). */
export interface StateScales {
  vo: number;
  ir: number;
  im: number;
  vcr: number;
}

const KEYS = ['vo', 'ir', 'im', 'vcr'] as const;

/**
 * Largest move of an extrapolated start away from the last state, per component relative to its
 * scale. Beyond it the sequence is not yet in the linear neighbourhood of the steady state (a start
 * from rest, a large frequency step) and the limit is not trusted.
 */
export const MAX_EXTRAPOLATION_STEP = 0.25;

/** Number of boundary states the extrapolation reads at most (the last ones): five differences. */
export const EXTRAPOLATION_STATES = 6;

/**
 * The extrapolated periodic state from boundary states (oldest first, at least three, all at the
 * same switching phase); null when the extrapolation fails or moves a component by more than
 * MAX_EXTRAPOLATION_STEP of its scale. Only the last EXTRAPOLATION_STATES states are read: the
 * earlier ones carry the fast modes of the start.
 */
export function extrapolateSeed(states: readonly DeckSeed[], scales: StateScales): DeckSeed | null {
  if (states.length < 3) return null;
  const used = states.slice(-EXTRAPOLATION_STATES);
  const scale = KEYS.map((k) => (Number.isFinite(scales[k]) && scales[k] > 0 ? scales[k] : 1));
  const xs = used.map((s) => KEYS.map((k, i) => s[k] / scale[i]!));
  const lim = reducedRankExtrapolation(xs);
  if (!lim) return null;
  const last = xs[xs.length - 1]!;
  if (lim.some((v, i) => !(Math.abs(v - last[i]!) <= MAX_EXTRAPOLATION_STEP))) return null;
  const end = used[used.length - 1]!;
  return { ...end, vo: lim[0]! * scale[0]!, ir: lim[1]! * scale[1]!, im: lim[2]! * scale[2]!, vcr: lim[3]! * scale[3]! };
}
