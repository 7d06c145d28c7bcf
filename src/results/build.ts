import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { ComparisonRow, Divergence } from '../compare/types.js';
import type { CornerFailure, CornerResult, CornerStatus, Results, SimSummary } from './types.js';
import { summarize } from './summary.js';
import { outsideInSimulation } from '../limits/evaluate.js';
import type { LimitCheck } from '../limits/types.js';
import { TOOL_VERSION } from '../version.js';

/**
 * The one place a corner result or a results file is put together. Each outcome has its builder
 * (`predicted`, `simulated`, `failed`) and every status comes from `statusOf`, so a new field or
 * status is added once instead of in every step that reports a corner.
 */

/** The corner's parameters as written into results: the corner without its id (SI units). */
export function cornerInputs(c: Corner): CornerResult['inputs'] {
  const { id: _id, ...inputs } = c;
  return inputs;
}

/**
 * A corner with its FHA prediction only (no simulation ran, or it was never started):
 * 'unreachable' when FHA finds no switching frequency that meets the output, else 'predicted'.
 */
export function predicted(corner: Corner, fha: FhaResult, checks?: LimitCheck[]): CornerResult {
  return { id: corner.id, inputs: cornerInputs(corner), fha, sim: null, comparison: [], divergences: [],
    status: fha.fs === null ? 'unreachable' : 'predicted', ...(checks ? { checks } : {}) };
}

/** What a finished simulation of a corner measured, and how it compared with FHA. */
export interface Measured {
  sim: SimSummary;
  comparison: ComparisonRow[];
  divergences: Divergence[];
  /** The corner checked against the design's limits (limits/evaluateLimits). */
  checks?: LimitCheck[];
}

/** Facts besides the comparison that decide a simulated corner's status. */
export interface StatusFacts {
  /** The corner failed (simulator, measurement or regulation). @default false */
  failed?: boolean;
  /** The simulation reached a proven steady state. */
  settled: boolean;
  /** At least one check against the design's limits is outside. @default false */
  outsideLimits?: boolean;
  /** At least one metric diverges from FHA beyond its tolerance. */
  diverged: boolean;
}

/**
 * The status of a simulated corner. Precedence, most serious first:
 * failed > not-settled > outside-limits > diverged > ok
 * (an unsettled run's numbers are not trusted enough to judge limits or FHA with).
 */
export function statusOf(f: StatusFacts): CornerStatus {
  if (f.failed) return 'failed';
  if (!f.settled) return 'not-settled';
  if (f.outsideLimits) return 'outside-limits';
  if (f.diverged) return 'diverged';
  return 'ok';
}

/** A simulated corner; its status follows `statusOf` (pass `outsideLimits` when limits were checked). */
export function simulated(corner: Corner, fha: FhaResult, m: Measured, facts: { outsideLimits?: boolean } = {}): CornerResult {
  const outsideLimits = facts.outsideLimits ?? outsideInSimulation(m.checks);
  const status = statusOf({ settled: m.sim.settled, diverged: m.divergences.length > 0, outsideLimits });
  return { id: corner.id, inputs: cornerInputs(corner), fha, sim: m.sim, comparison: m.comparison, divergences: m.divergences, status,
    ...(m.checks ? { checks: m.checks } : {}) };
}

/**
 * A failed corner: keeps its reason and, when the simulation did finish but failed a later step
 * (e.g. regulation missed its target), what it measured.
 */
export function failed(corner: Corner, fha: FhaResult, failure: CornerFailure, measured?: Measured, checks?: LimitCheck[]): CornerResult {
  const f: CornerFailure = { kind: failure.kind, message: failure.message, ...(failure.detail ? { detail: failure.detail } : {}) };
  const c = checks ?? measured?.checks;
  return { id: corner.id, inputs: cornerInputs(corner), fha, sim: measured?.sim ?? null, comparison: measured?.comparison ?? [],
    divergences: measured?.divergences ?? [], status: 'failed', failure: f, ...(c ? { checks: c } : {}) };
}

/** What the results envelope records besides the corners. */
export interface EnvelopeFacts {
  /** Engine name and version; null for FHA-only results. */
  engine: { name: string; version: string } | null;
  /** The study was interrupted: some corners were never simulated. @default false */
  incomplete?: boolean;
}

/** A results file (`tankcheck/results@1`) around the corners, with its summary. */
export function envelope(design: { name: string; file?: string | null }, corners: CornerResult[], facts: EnvelopeFacts): Results {
  return {
    // an interrupted study says so first, before anyone reads a table built from it
    schema: 'tankcheck/results@1', ...(facts.incomplete ? { incomplete: true } : {}), tool: { name: 'tankcheck', version: TOOL_VERSION },
    design: { name: design.name, file: design.file ?? null },
    engine: facts.engine,
    corners, summary: summarize(corners),
  };
}
