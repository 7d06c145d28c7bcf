import type { FhaResult } from '../fha/types.js';
import type { SimMetrics } from '../measure/types.js';
import type { Corner } from '../corners/types.js';
import type { ComparisonRow, Divergence } from '../compare/types.js';
import type { MonteCarloStatistics } from '../statistics/summary.js';
import type { IdealMetrics } from '../ideal/metrics.js';
import type { LimitCheck } from '../limits/types.js';
import type { MeasuredReport, MeasuredSummary } from '../measured/types.js';

export type { ComparisonRow, Divergence } from '../compare/types.js';
import type { ShardInfo } from './merge.js';
export type { LimitCheck, CheckSide, LimitName } from '../limits/types.js';

export type CornerStatus = 'predicted' | 'unreachable' | 'ok' | 'diverged' | 'failed' | 'not-settled' | 'outside-limits'
  /** Monte Carlo: screened by FHA and the ideal model only; the simulation did not confirm this corner. */
  | 'screened';

/** Why a corner failed: the step that failed (`kind`), a one-line reason and optional detail. */
export interface CornerFailure {
  kind: string;
  message: string;
  detail?: string;
}

/** Simulation outcome of one corner: the measured metrics plus how they were obtained. */
export interface SimSummary extends SimMetrics {
  /** Switching cycles simulated for this corner, all runs together. */
  cycles: number;
  /** Simulator runs for this corner (settling continuations and frequency search included). */
  runs: number;
  /** Operating points simulated (1 for fixed frequency; search steps when regulating). */
  simulations: number;
  settled: boolean;
  /** Relative difference of the last two output-voltage windows. */
  settleError: number;
  /**
   * Output capacitor charge-balance error avg(i_Co) / Io, signed (positive: still
   * charging); steady state needs |value| <= simulation.chargeBalanceTolerance.
   */
  chargeBalanceError?: number;
  /** Tank periodicity error (tank current, Cr voltage; relative to their peaks). */
  periodicityError?: number;
  /**
   * Regulated corners reported `unreachable`: the highest output the frequency search simulated
   * (the simulated peak-gain point, to the search's resolution), its switching frequency and region.
   * The metrics above are measured there.
   */
  closest?: { vout: number; fs: number; region: 'inductive' | 'capacitive' };
}

export interface CornerResult {
  id: string;
  /** The corner's parameters (SI units; load in ohm, fs null when regulating). */
  inputs: Omit<Corner, 'id'>;
  fha: FhaResult;
  /**
   * The ideal time-domain model's metrics (same names and definitions as `sim`); null where the
   * model does not apply, with the reason in `idealReason`. Absent in results written before it
   * existed and on corners an interrupted run never started.
   */
  ideal?: IdealMetrics | null;
  /** Why `ideal` is null. */
  idealReason?: string;
  sim: SimSummary | null;
  comparison: ComparisonRow[];
  divergences: Divergence[];
  status: CornerStatus;
  failure?: CornerFailure;
  /**
   * The corner checked against the design's `limits` on FHA, the ideal model and the simulation
   * (`region` always: capacitive operation is always outside). Absent in results written before limits existed.
   */
  checks?: LimitCheck[];
  /** 'measured' for a corner made from a measured prototype point (`run --measured`). */
  source?: 'measured';
  /** The measured point's values and the errors of each model against it. */
  measured?: MeasuredSummary;
}

/** Downsampled waveforms of one corner's measurement window, kept for the report. */
export interface WaveformExcerpt {
  id: string;
  fs: number;
  t: number[];
  series: Record<string, number[]>;
  /** Gate turn-on edges of the high side (HB) / S1-S4 pair (FB), s. */
  edges: number[];
}

export interface ResultsSummary {
  corners: number;
  ok: number;
  diverged: number;
  failed: number;
  notSettled: number;
  predicted: number;
  unreachable: number;
  /** Monte Carlo corners screened by FHA and the ideal model only (status screened); absent when none. */
  screened?: number;
  /** Corners whose simulation is outside at least one limit (status outside-limits). */
  outsideLimits: number;
  /** Checks where FHA and simulation disagree on within/outside, over all corners. */
  flips: number;
  /**
   * Operating points simulated to obtain these results (cached corners count what their first run
   * simulated), so a cached and an uncached run give the same file. What this run took from the
   * cache is a fact of the run, not of the results: see `StudyOutput.run`.
   */
  simulations: number;
  /** Worst divergences, largest |error| / tolerance first. */
  worst: { id: string; metric: string; error: number | null; tolerance: number | null }[];
}

export interface Results {
  schema: 'tankcheck/results@1';
  tool: { name: 'tankcheck'; version: string };
  design: { name: string; file: string | null };
  engine: { name: string; version: string } | null;
  incomplete?: boolean;
  corners: CornerResult[];
  summary: ResultsSummary;
  baseline?: BaselineReport;
  /** Measured prototype points compared (`run --measured`). */
  measured?: MeasuredReport;
  /** Monte Carlo runs (tolerances.corners: random): yield, confirmation, sensitivity; computed from `corners` alone. */
  statistics?: MonteCarloStatistics;
  /** A shard's place in the plan (`run --shard K/N`); absent in a whole or merged study. */
  shard?: ShardInfo;
}

export interface BaselineReport {
  file: string;
  added: string[];
  removed: string[];
  statusChanges: { id: string; from: CornerStatus; to: CornerStatus }[];
  moved: { id: string; metric: string; before: number; after: number; change: number; tolerance: number }[];
  /** Limit checks within in the baseline and outside now (absent in reports written before limits existed). */
  checksOutside?: { id: string; limit: string; before: number | boolean | string | null; after: number | boolean | string | null; bound: number | boolean | string }[];
  regressed: boolean;
}
