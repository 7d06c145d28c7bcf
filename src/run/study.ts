import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine } from '../engine/types.js';
import type { CornerResult, Results, WaveformExcerpt } from '../results/types.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import { compareCorner } from '../compare/compare.js';
import { evaluateLimits } from '../limits/evaluate.js';
import { envelope, failed as failedCorner, predicted, simulated } from '../results/build.js';
import { simulateCorner, type CornerOutcome } from './corner.js';
import { startPoint, type StartPoint } from '../plan/start.js';
import { mapPool } from '../engine/pool.js';
import { idealCorner, withIdeal, type IdealOutcome } from '../ideal/index.js';
import { attachMeasured, measuredCorners, measuredReport, type MeasuredPoint } from '../measured/index.js';
import { runMonteCarlo, monteCarloFacts } from './montecarlo.js';
import { monteCarloStatistics } from '../statistics/index.js';

export interface StudyProgress {
  /** Monte Carlo runs: screening every corner, then confirming the picked ones by simulation. */
  phase?: 'screening' | 'confirming';
  done: number;
  failed: number;
  total: number;
  id: string;
  status: CornerResult['status'];
}

/** Corner-level result cache (content-addressed by the caller's key). */
export interface CornerCache {
  key(design: Design, corner: Corner, engineVersion: string, start: StartPoint): string;
  get(key: string): Promise<CornerOutcome | undefined>;
  set(key: string, value: CornerOutcome): Promise<void>;
}

export interface StudyOptions {
  engine: SimEngine;
  /** Corners simulated at once. @default 1 */
  jobs?: number;
  /** Glob on corner ids. */
  only?: string;
  /** Simulate exactly these corners instead of the design's (a Monte Carlo run's confirm set). */
  corners?: Corner[];
  signal?: AbortSignal;
  cache?: CornerCache;
  onProgress?: (p: StudyProgress) => void;
  timeoutMs?: number;
  /** Measured prototype points: each becomes a fixed-frequency corner beside the design's own. */
  measured?: { file: string; points: readonly MeasuredPoint[] };
}

/** Facts of one run that are not part of the (deterministic) results: what came from the cache. */
export interface RunFacts {
  /** Corners taken from the cache, in corner order. */
  fromCache: string[];
  /** Operating points simulated by this run (cached corners excluded). */
  simulated: number;
}

export interface StudyOutput {
  results: Results;
  waveforms: WaveformExcerpt[];
  run: RunFacts;
}

/** FHA-only results (no engine): every corner predicted. */
export function predictStudy(design: Design, only?: string): Results {
  const corners = filterCorners(expandCorners(design), only).map((c) => predictedWithChecks(design, c));
  const results = envelope(design, corners, { engine: null });
  return design.tolerances.corners === 'random' ? { ...results, statistics: monteCarloStatistics(corners, monteCarloFacts(design)) } : results;
}

/**
 * Run every corner of a design: FHA, decks, engine, measurement and the cross-check. A corner
 * that fails is reported as failed and the others go on; when the signal aborts, finished corners
 * are kept, the rest stay FHA-only and the results are marked incomplete.
 */
export async function runStudy(design: Design, opts: StudyOptions): Promise<StudyOutput> {
  if (design.tolerances.corners === 'random' && !opts.corners) return runMonteCarlo(design, opts);
  // a given corner list (a Monte Carlo confirm set) is run as it is, without measured points
  const bench = opts.corners ? [] : measuredCorners(design, opts.measured?.points ?? []);
  const points = new Map(bench.map((c, i) => [c.id, opts.measured!.points[i]]));
  const corners = opts.corners ?? filterCorners([...expandCorners(design), ...bench], opts.only);
  const engineVersion = await opts.engine.version();
  const outcomes: (CornerOutcome | undefined)[] = new Array(corners.length);
  let done = 0;
  let failed = 0;
  const cached = new Set<number>();
  await mapPool(corners, opts.jobs ?? 1, async (corner, i) => {
    if (opts.signal?.aborted) return;
    const fha = predictCorner(design, corner);
    const ideal = idealCorner(design, corner, fha);
    const start = startPoint(design, corner, fha, 'model', ideal);
    const key = opts.cache?.key(design, corner, engineVersion, start);
    let out = key ? await opts.cache!.get(key) : undefined;
    if (out) {
      cached.add(i);
      out = refreshComparison(design, corner, fha, ideal, out);
    } else {
      out = await simulateCorner(opts.engine, design, corner, fha, { signal: opts.signal, timeoutMs: opts.timeoutMs, start, ideal })
        .catch((e: unknown): CornerOutcome => ({ result: withIdeal(failedCorner(corner, fha, { kind: 'measurement', message: e instanceof Error ? e.message : String(e) }, undefined,
          evaluateLimits(design, corner.vin, fha, null, ideal.ideal)), ideal) }));
      if (opts.signal?.aborted && out.result.status === 'failed') return; // interrupted, not a simulator failure
      if (key && out.result.failure?.kind !== 'timeout') await opts.cache!.set(key, out);
    }
    outcomes[i] = out;
    done++;
    if (out.result.status === 'failed') failed++;
    opts.onProgress?.({ done, failed, total: corners.length, id: corner.id, status: out.result.status });
  }, opts.signal).catch((e: unknown) => {
    if (!opts.signal?.aborted) throw e;
  });
  // a corner never started keeps its FHA prediction
  const results: CornerResult[] = corners.map((c, i) => outcomes[i]?.result ?? predictedWithChecks(design, c))
    .map((r) => (points.has(r.id) ? attachMeasured(r, points.get(r.id)!, design.compare.measured) : r));
  // not outcomes.some(): the array is sparse, and some() skips the holes of corners never started
  const incomplete = corners.some((_, i) => outcomes[i] === undefined);
  const env = envelope(design, results, { engine: { name: opts.engine.name, version: engineVersion }, incomplete });
  if (opts.measured) env.measured = measuredReport(env, opts.measured.file, design.compare.measured);
  return {
    results: env,
    waveforms: outcomes.flatMap((o) => (o?.waveform ? [o.waveform] : [])),
    run: {
      fromCache: corners.filter((_, i) => cached.has(i)).map((c) => c.id),
      simulated: results.reduce((s, c, i) => s + (c.sim && !cached.has(i) ? c.sim.simulations : 0), 0),
    },
  };
}

/** A cached simulation is compared again with the current tolerances (compare: may have changed). */
function refreshComparison(design: Design, corner: Corner, fha: CornerResult['fha'], ideal: IdealOutcome, out: CornerOutcome): CornerOutcome {
  const r = withIdeal(out.result, ideal);
  if (!r.sim || r.status === 'failed') return { ...out, result: { ...r, fha, checks: evaluateLimits(design, corner.vin, fha, r.sim, ideal.ideal) } };
  const cmp = compareCorner(design, fha, r.sim, corner.fs === null, ideal.ideal);
  const checks = evaluateLimits(design, corner.vin, fha, r.sim, ideal.ideal);
  return { ...out, result: withIdeal({ ...r, ...simulated(corner, fha, { sim: r.sim, comparison: cmp.rows, divergences: cmp.divergences, checks }) }, ideal) };
}

/** A corner with its FHA prediction, the ideal model and the FHA and ideal sides of its limit checks. */
function predictedWithChecks(design: Design, c: Corner): CornerResult {
  const fha = predictCorner(design, c);
  const ideal = idealCorner(design, c, fha);
  return withIdeal(predicted(c, fha, evaluateLimits(design, c.vin, fha, null, ideal.ideal)), ideal);
}
