import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { CornerResult } from '../results/types.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { RANDOM_DEFAULTS } from '../corners/random.js';
import { predictCorner } from '../fha/predict.js';
import { idealCorner, withIdeal, SCREENING_POINTS, type IdealOutcome } from '../ideal/index.js';
import { evaluateLimits } from '../limits/evaluate.js';
import { predicted } from '../results/build.js';
import { measuredCorners, type MeasuredPoint } from '../measured/index.js';
import { selectConfirm, type ConfirmPick, type RunFacts } from '../statistics/index.js';
import { startPoint, type StartPoint } from './start.js';

/** Confirm budget when simulation.confirm is not set (as in design/fields.ts). */
export const DEFAULT_CONFIRM = 20;

/** Estimated cost of a simulated fixed-frequency corner; the unit of `PlanItem.cost`. */
export const COST_FIXED = 1;
/** A regulated corner searches for its frequency: about two settled operating points (bench/RESULTS.md). */
export const COST_REGULATED = 2;
/** A corner screened by FHA and the ideal model only (a few milliseconds). */
export const COST_SCREENED = 0.01;

/** One work item of a study, in plan order. */
export interface PlanItem {
  /** Position in the plan, 0-based. */
  index: number;
  corner: Corner;
  /** 'measured' for a corner made from a measured prototype point (`run --measured`). */
  source: 'design' | 'measured';
  fha: FhaResult;
  ideal: IdealOutcome;
  /** What the corner reports without a simulation: FHA, the ideal model and their limit checks. */
  prediction: CornerResult;
  /** False for a Monte Carlo corner outside the confirm set: screened, never simulated. */
  simulate: boolean;
  /** Where its simulation starts; null for a screened corner. */
  start: StartPoint | null;
  /** Estimated cost in fixed-frequency corners (COST_*). */
  cost: number;
}

/** The ordered work of a study: what `run`, `decks`, shards and `merge` all agree on. */
export interface StudyPlan {
  items: PlanItem[];
  /** Monte Carlo runs: the statistics' run facts and the corners picked for confirmation. */
  monteCarlo: { facts: RunFacts & { confirm: number }; picks: ConfirmPick[] } | null;
  /** Measured prototype points, by corner id. */
  measured: { file: string; points: Map<string, MeasuredPoint> } | null;
}

export interface PlanOptions {
  /** Glob on corner ids (see corners/match). */
  only?: string;
  /** Measured prototype points: each becomes a fixed-frequency corner after the design's own. */
  measured?: { file: string; points: readonly MeasuredPoint[] };
}

/** The run facts of a Monte Carlo design, with the random-mode defaults filled in. */
export function monteCarloFacts(design: Design): RunFacts & { confirm: number } {
  return {
    seed: design.tolerances.seed ?? RANDOM_DEFAULTS.seed,
    distribution: design.tolerances.distribution ?? RANDOM_DEFAULTS.distribution,
    confirm: design.simulation.confirm ?? DEFAULT_CONFIRM,
  };
}

/** A corner's prediction: FHA, the ideal model and the FHA and ideal sides of its limit checks. */
export function predictWithChecks(design: Design, corner: Corner, fha: FhaResult, ideal: IdealOutcome): CornerResult {
  return withIdeal(predicted(corner, fha, evaluateLimits(design, corner.vin, fha, null, ideal.ideal)), ideal);
}

/**
 * Screening of one Monte Carlo corner: FHA and the ideal time-domain model (sampled at
 * SCREENING_POINTS per half period, within 0.1 % of the default), the limits checked on both.
 * Status `screened`: no simulation ran.
 */
export function screenCorner(design: Design, corner: Corner): CornerResult {
  const fha = predictCorner(design, corner);
  const ideal = idealCorner(design, corner, fha, { pointsPerHalf: SCREENING_POINTS });
  return { ...predictWithChecks(design, corner, fha, ideal), status: 'screened' };
}

/**
 * Plan a study (pure): every corner in order (the design's grid, its explicit corners, then the
 * measured points), each with FHA, the ideal model, its start point and an estimated cost. A Monte
 * Carlo design screens every sample here and marks the confirm set (simulation.confirm: the worst
 * margins per limit and a seeded validation set) for simulation; the rest are `screened`.
 * Deterministic: the same design and options give the same plan on any machine.
 */
export function planStudy(design: Design, opts: PlanOptions = {}): StudyPlan {
  const bench = measuredCorners(design, opts.measured?.points ?? []);
  const own = expandCorners(design);
  const chosen = filterCorners([...own, ...bench], opts.only);
  const benchIds = new Set(bench.map((c) => c.id));
  // Monte Carlo samples are screened at the cheaper sampling; the confirm set is measured again below
  const screening = (c: Corner) => design.tolerances.corners === 'random' && c.sample !== undefined;
  const items = chosen.map((corner, index): PlanItem => {
    const fha = predictCorner(design, corner);
    const ideal = idealCorner(design, corner, fha, screening(corner) ? { pointsPerHalf: SCREENING_POINTS } : {});
    const prediction = predictWithChecks(design, corner, fha, ideal);
    return { index, corner, source: benchIds.has(corner.id) ? 'measured' : 'design', fha, ideal,
      prediction: screening(corner) ? { ...prediction, status: 'screened' } : prediction, simulate: true, start: null, cost: 0 };
  });
  let monteCarlo: StudyPlan['monteCarlo'] = null;
  if (design.tolerances.corners === 'random') {
    const facts = monteCarloFacts(design);
    const sampled = items.filter((it) => screening(it.corner));
    const picks = selectConfirm(sampled.map((it) => it.prediction), facts.confirm, facts.seed);
    const picked = new Set(picks.map((p) => p.id));
    for (const it of sampled) {
      it.simulate = picked.has(it.corner.id);
      if (it.simulate) it.ideal = idealCorner(design, it.corner, it.fha);
    }
    monteCarlo = { facts, picks };
  }
  for (const it of items) {
    if (!it.simulate) {
      it.cost = COST_SCREENED;
      continue;
    }
    it.start = startPoint(design, it.corner, it.fha, 'model', it.ideal);
    it.cost = it.corner.fs === null ? COST_REGULATED : COST_FIXED;
  }
  const points = new Map(bench.map((c, i) => [c.id, opts.measured!.points[i]!]));
  return { items, monteCarlo, measured: opts.measured ? { file: opts.measured.file, points } : null };
}
