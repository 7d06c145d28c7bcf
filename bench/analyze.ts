/** Figures derived from the measurements: Vout errors against the references, means per method, target verdicts. */
import type { SeedMethod } from '../src/plan/start.js';
import { APPROACH_CYCLES } from '../src/run/steady.js';
import { refKey, type Reference } from './reference.js';
import { METHODS, type SettleRow } from './settling.js';
import { maxAbs, mean, median } from './util.js';

/** Vout error allowed against the settled reference (fraction). */
export const VOUT_TARGET = 0.002;
export const CYCLES_TARGET = 30;
export const CYCLES_STRETCH = 15;
export const SIMS_TARGET = 3;
export const ENGINE_RATIO_TARGET = 2;
export const FHA_RATE_TARGET = 100_000;
export const MEMORY_TARGET_MB = 600;
/** Cycles of the first run of every operating point (simulateSteady's approach run). */
export const FIRST_RUN_CYCLES = APPROACH_CYCLES;
/**
 * The same case before the extrapolated restarts (simulateSteady with 3 x 6-cycle first runs,
 * 12-cycle continuations and shooting only): bench run of 2026-12-02 10:09 UTC at commit 682f757,
 * system ngspice-39, the same designs, corners and references. Kept to show before and after.
 */
export const BEFORE = { meanCycles: 30.6, range: '18-72', maxVoutError: 0.00013, cap470: 30.9, cap10m: 41.1, worstBalance: 0.00745 } as const;

export interface ScoredRow extends SettleRow {
  ref?: Reference;
  /** (vout - ref.vout) / ref.vout, when both exist. */
  error: number | null;
}

export function scoreRows(rows: readonly SettleRow[], refs: Map<string, Reference>): ScoredRow[] {
  return rows.map((r) => {
    const ref = r.fs === null ? undefined : refs.get(refKey(r.design, r.corner.id, r.fs));
    const ok = ref && r.vout !== null && Number.isFinite(ref.vout);
    return { ...r, ...(ref ? { ref } : {}), error: ok ? (r.vout! - ref.vout) / ref.vout : null };
  });
}

/** A row's error is meaningful: it exists and its reference is settled or banded. */
export function verified(r: ScoredRow): boolean {
  return r.error !== null && (r.ref?.state === 'settled' || r.ref?.state === 'banded');
}

export interface MethodSummary {
  method: SeedMethod;
  /** 'all' or a design key. */
  scope: string;
  corners: number;
  meanCycles: number;
  meanRuns: number;
  meanSimulations: number;
  maxAbsError: number;
  /** Every corner has an error and a usable reference, and |error| + reference band <= VOUT_TARGET. */
  allWithin: boolean;
  /** Corners whose error could not be computed or whose reference is not usable ('unsettled' or 'failed'). */
  unverified: number;
  totalWallMs: number;
  medianWallMs: number;
  meanStartMs: number;
  meanEngineMs: number;
  failed: number;
}

export function summarizeMethod(rows: readonly ScoredRow[], method: SeedMethod, scope: string): MethodSummary {
  const rs = rows.filter((r) => r.method === method && (scope === 'all' || r.design === scope));
  const errs = rs.flatMap((r) => (r.error === null ? [] : [r.error]));
  const unverified = rs.filter((r) => !verified(r)).length;
  return {
    method, scope, corners: rs.length,
    meanCycles: mean(rs.map((r) => r.cycles)), meanRuns: mean(rs.map((r) => r.runs)), meanSimulations: mean(rs.map((r) => r.simulations)),
    maxAbsError: maxAbs(errs), allWithin: unverified === 0 && rs.every((r) => r.error === null || Math.abs(r.error) + (r.ref?.band ?? 0) <= VOUT_TARGET), unverified,
    totalWallMs: rs.reduce((s, r) => s + r.wallMs, 0), medianWallMs: median(rs.map((r) => r.wallMs)),
    meanStartMs: mean(rs.map((r) => r.startMs)), meanEngineMs: mean(rs.map((r) => r.engineMs)),
    failed: rs.filter((r) => r.status === 'failed' || r.status === 'not-settled').length,
  };
}

export function methodSummaries(rows: readonly ScoredRow[], designs: readonly string[]): MethodSummary[] {
  return METHODS.flatMap((m) => ['all', ...designs].map((s) => summarizeMethod(rows, m, s)));
}

/** Why a 'model' corner took more than one first run, from its counters. */
export function extraCyclesReason(r: SettleRow): string {
  if (r.cycles <= FIRST_RUN_CYCLES) return '';
  const parts: string[] = [];
  if (r.simulations > 1) parts.push(`${r.simulations} operating points (frequency search steps)`);
  const checks = r.runs - r.simulations;
  if (checks > 0) parts.push(`${checks} check run(s) after a first run that did not prove the steady state`);
  return parts.join(', ');
}
