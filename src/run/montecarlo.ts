import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { CornerResult } from '../results/types.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import { envelope, predicted } from '../results/build.js';
import { idealCorner, withIdeal, SCREENING_POINTS } from '../ideal/index.js';
import { monteCarloStatistics, selectConfirm, type ConfirmPick } from '../statistics/index.js';
import { evaluateLimits } from '../limits/evaluate.js';
import { RANDOM_DEFAULTS } from '../corners/random.js';
import { runStudy, type StudyOptions, type StudyOutput, type StudyProgress } from './study.js';

/** Confirm budget when simulation.confirm is not set (as in design/fields.ts). */
export const DEFAULT_CONFIRM = 20;

/**
 * Screening of one corner: FHA and the ideal time-domain model (sampled at SCREENING_POINTS per
 * half period), the limits checked on both. Status `screened`: no simulation ran.
 */
export function screenCorner(design: Design, corner: Corner): CornerResult {
  const fha = predictCorner(design, corner);
  const ideal = idealCorner(design, corner, fha, { pointsPerHalf: SCREENING_POINTS });
  return { ...withIdeal(predicted(corner, fha, evaluateLimits(design, corner.vin, fha, null, ideal.ideal)), ideal), status: 'screened' };
}

/** The run facts the statistics echo, with the random-mode defaults filled in. */
export function monteCarloFacts(design: Design): { seed: number; distribution: 'uniform' | 'normal'; confirm: number } {
  return {
    seed: design.tolerances.seed ?? RANDOM_DEFAULTS.seed,
    distribution: design.tolerances.distribution ?? RANDOM_DEFAULTS.distribution,
    confirm: design.simulation.confirm ?? DEFAULT_CONFIRM,
  };
}

/**
 * A Monte Carlo run (tolerances.corners: random): every sample x operating point is screened by
 * FHA and the ideal model; the simulation confirms the corners `selectConfirm` picks within the
 * simulation.confirm budget (the worst per limit and a seeded validation set); the statistics are
 * computed over all corners. Deterministic for a seed: the picks depend only on the screened
 * results, and each corner's simulation only on the corner, so --jobs changes no byte.
 */
export async function runMonteCarlo(design: Design, opts: StudyOptions): Promise<StudyOutput & { picks: ConfirmPick[] }> {
  const corners = filterCorners(expandCorners(design), opts.only);
  const facts = monteCarloFacts(design);
  const screened: CornerResult[] = [];
  for (const [i, c] of corners.entries()) {
    if (opts.signal?.aborted) break;
    screened.push(screenCorner(design, c));
    opts.onProgress?.({ phase: 'screening', done: i + 1, failed: 0, total: corners.length, id: c.id, status: 'screened' });
  }
  const picks = opts.signal?.aborted ? [] : selectConfirm(screened, facts.confirm, facts.seed);
  const chosen = new Set(picks.map((p) => p.id));
  const sim = await runStudy(design, {
    ...opts,
    corners: corners.filter((c) => chosen.has(c.id)),
    onProgress: (p: StudyProgress) => opts.onProgress?.({ ...p, phase: 'confirming' }),
  });
  const confirmed = new Map(sim.results.corners.filter((r) => r.sim !== null || r.status === 'failed').map((r) => [r.id, r]));
  const results = screened.map((r) => confirmed.get(r.id) ?? r);
  const incomplete = screened.length < corners.length || sim.results.incomplete === true;
  // a corner never screened (interrupted) keeps its FHA prediction
  const all = [...results, ...corners.slice(screened.length).map((c) => predicted(c, predictCorner(design, c)))];
  const out = envelope(design, all, { engine: sim.results.engine, incomplete });
  return {
    results: { ...out, statistics: monteCarloStatistics(all, facts) },
    waveforms: sim.waveforms,
    run: sim.run,
    picks,
  };
}
