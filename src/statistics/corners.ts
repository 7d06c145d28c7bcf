/**
 * The shape of a corner result that the Monte Carlo statistics read. Structural, so that the
 * statistics depend only on what they use (and run over results read back from files, e.g. the
 * union of several shards): the sample number and deviations in `inputs`, the limit `checks` with
 * their FHA, ideal-model and simulation sides, and the ideal and simulated metrics.
 */

/** One model's side of a limit check: its value and whether that is within the bound (null: no value). */
export interface CheckSideLike {
  value: number | boolean | string | null;
  within: boolean | null;
}

/** A limit checked at one corner (results.json `checks[]`). */
export interface CheckLike {
  limit: string;
  kind: 'max' | 'min' | 'state';
  bound: number | string | boolean;
  fha: CheckSideLike;
  ideal: CheckSideLike | null;
  sim: CheckSideLike | null;
}

/** A corner of a Monte Carlo run as the statistics see it. */
export interface SampleCornerLike {
  id: string;
  inputs: { vin: number; load: number; fs: number | null; sample?: number; deviation?: Record<string, number> };
  status: string;
  checks?: readonly CheckLike[];
  /** Ideal-model and simulated metrics (read by name). */
  ideal?: object | null;
  sim: object | null;
}

/** Which model's side of a check to read. */
export type Side = 'fha' | 'ideal' | 'sim';

/**
 * How much of its bound a check's side uses: value / bound for an upper limit, bound / value for a
 * lower one, so above 1 is outside either way; a state 0 when met, Infinity when not; null without
 * a value.
 */
export function usageOf(c: CheckLike, side: Side): number | null {
  const s = c[side];
  if (!s || s.value === null || s.within === null) return null;
  if (c.kind === 'state') return s.within ? 0 : Infinity;
  if (typeof s.value !== 'number' || typeof c.bound !== 'number') return null;
  if (c.kind === 'max') return c.bound === 0 ? Infinity : s.value / c.bound;
  return s.value <= 0 ? Infinity : c.bound / s.value;
}

/** Operating-point key of a corner: the corner id without its sample part ("v390_100pct_reg"). */
export function operatingPoint(c: Pick<SampleCornerLike, 'id'>): string {
  return c.id.replace(/_s\d+(-\d+)?$/, '');
}

/** The corners that belong to a sample (explicit corners, which have none, are left out), grouped by sample number in ascending order. */
export function bySample<T extends SampleCornerLike>(corners: readonly T[]): Map<number, T[]> {
  const out = new Map<number, T[]>();
  for (const c of corners) {
    const k = c.inputs.sample;
    if (k === undefined) continue;
    const list = out.get(k);
    if (list) list.push(c); else out.set(k, [c]);
  }
  return new Map([...out.entries()].sort((a, b) => a[0] - b[0]));
}

/**
 * Whether every check of every corner of a sample is within on one side. null when the sample
 * cannot be judged on that side (a value is missing, e.g. the ideal model does not apply at one
 * operating point) and nothing is outside; false as soon as one check is outside.
 */
export function sampleMeets(corners: readonly SampleCornerLike[], side: 'fha' | 'ideal'): boolean | null {
  let unknown = false;
  for (const c of corners) {
    const checks = c.checks ?? [];
    if (checks.length === 0) unknown = true;
    for (const ch of checks) {
      const s = ch[side];
      if (s?.within === false) return false;
      if (!s || s.within === null) unknown = true;
    }
  }
  return unknown ? null : true;
}
