import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { SimEngine } from '../engine/types.js';
import type { CornerResult, Results, WaveformExcerpt } from '../results/types.js';
import { compareCorner } from '../compare/compare.js';
import { evaluateLimits } from '../limits/evaluate.js';
import { envelope, failed as failedCorner, simulated } from '../results/build.js';
import { simulateCorner, type CornerOutcome } from './corner.js';
import type { StartPoint } from '../plan/start.js';
import { planStudy, type PlanItem, type StudyPlan } from '../plan/plan.js';
import { shardItems, type ShardSpec } from '../plan/shard.js';
import { mapPool } from '../engine/pool.js';
import { withIdeal } from '../ideal/index.js';
import { attachMeasured, measuredReport, type MeasuredPoint } from '../measured/index.js';
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
  /** The stored outcome of `cornerId` under `key`; undefined is a miss (also for an entry that fails its checks). */
  get(key: string, cornerId: string): Promise<CornerOutcome | undefined>;
  set(key: string, value: CornerOutcome): Promise<void>;
}

export interface StudyOptions {
  engine: SimEngine;
  /** Corners simulated at once. @default 1 */
  jobs?: number;
  /** Glob on corner ids. */
  only?: string;
  signal?: AbortSignal;
  cache?: CornerCache;
  onProgress?: (p: StudyProgress) => void;
  timeoutMs?: number;
  /** Measured prototype points: each becomes a fixed-frequency corner beside the design's own. */
  measured?: { file: string; points: readonly MeasuredPoint[] };
  /** Run only this shard of the plan (1-based index K of N); the results carry `shard`. */
  shard?: ShardSpec & { fingerprint: string };
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

/** FHA-only results (no engine): every corner predicted (Monte Carlo: screened, with statistics). */
export function predictStudy(design: Design, only?: string): Results {
  const plan = planStudy(design, { only });
  const corners = plan.items.map((it) => it.prediction);
  const results = envelope(design, corners, { engine: null });
  return plan.monteCarlo ? { ...results, statistics: monteCarloStatistics(corners, plan.monteCarlo.facts) } : results;
}

/** Run every corner of a design (see runPlan). */
export async function runStudy(design: Design, opts: StudyOptions): Promise<StudyOutput> {
  return runPlan(design, planStudy(design, { only: opts.only, measured: opts.measured }), opts);
}

/**
 * Run a plan (or one shard of it): FHA, decks, engine, measurement and the cross-check for every
 * item to simulate; screened Monte Carlo corners keep their screening. A corner that fails is
 * reported as failed and the others go on; when the signal aborts, finished corners are kept, the
 * rest keep their prediction and the results are marked incomplete.
 */
export async function runPlan(design: Design, plan: StudyPlan, opts: StudyOptions): Promise<StudyOutput> {
  const items = opts.shard ? shardItems(plan.items.map((it) => it.cost), opts.shard).map((i) => plan.items[i]!) : plan.items;
  const work = items.filter((it) => it.simulate);
  const engineVersion = await opts.engine.version();
  const outcomes = new Map<number, CornerOutcome>();
  let done = 0;
  let failed = 0;
  const cached = new Set<number>();
  if (plan.monteCarlo) {
    items.forEach((it, i) => opts.onProgress?.({ phase: 'screening', done: i + 1, failed: 0, total: items.length, id: it.corner.id, status: it.prediction.status }));
  }
  const phase = plan.monteCarlo ? { phase: 'confirming' as const } : {};
  await mapPool(work, opts.jobs ?? 1, async (item) => {
    if (opts.signal?.aborted) return;
    const out = await simulateItem(design, item, engineVersion, opts, () => cached.add(item.index));
    if (!out) return;
    outcomes.set(item.index, out);
    done++;
    if (out.result.status === 'failed') failed++;
    opts.onProgress?.({ ...phase, done, failed, total: work.length, id: item.corner.id, status: out.result.status });
  }, opts.signal).catch((e: unknown) => {
    if (!opts.signal?.aborted) throw e;
  });
  // a corner never started keeps its prediction (a screened one its screening)
  const results: CornerResult[] = items.map((it) => outcomes.get(it.index)?.result ?? it.prediction)
    .map((r) => (plan.measured?.points.has(r.id) ? attachMeasured(r, plan.measured.points.get(r.id)!, design.compare.measured) : r));
  const incomplete = work.some((it) => !outcomes.has(it.index));
  const results_ = assembleResults(design, plan, results, { engine: { name: opts.engine.name, version: engineVersion }, incomplete });
  if (opts.shard) {
    results_.shard = { index: opts.shard.index, count: opts.shard.count, total: plan.items.length, items: items.map((it) => it.index), fingerprint: opts.shard.fingerprint };
  }
  return {
    results: results_,
    waveforms: items.flatMap((it) => outcomes.get(it.index)?.waveform ?? []),
    run: {
      fromCache: items.filter((it) => cached.has(it.index)).map((it) => it.corner.id),
      simulated: items.reduce((s, it) => s + (outcomes.get(it.index)?.result.sim && !cached.has(it.index) ? outcomes.get(it.index)!.result.sim!.simulations : 0), 0),
    },
  };
}

/**
 * The results file around a study's corners: the envelope, then the measured-points report and the
 * Monte Carlo statistics, both computed from the corners alone (so `merge` gets the same bytes).
 */
export function assembleResults(design: { name: string; file?: string | null; compare: Design['compare'] }, plan: Pick<StudyPlan, 'monteCarlo' | 'measured'>,
  corners: CornerResult[], facts: Parameters<typeof envelope>[2]): Results {
  const env = envelope(design, corners, facts);
  if (plan.measured) env.measured = measuredReport(env, plan.measured.file, design.compare.measured);
  if (plan.monteCarlo) env.statistics = monteCarloStatistics(corners, plan.monteCarlo.facts);
  return env;
}

/** Simulate one plan item, or take it from the cache; undefined when interrupted. */
async function simulateItem(design: Design, item: PlanItem, engineVersion: string, opts: StudyOptions, onCached: () => void): Promise<CornerOutcome | undefined> {
  const { corner, fha, ideal, start } = item;
  const key = opts.cache?.key(design, corner, engineVersion, start!);
  const hit = key ? await opts.cache!.get(key, corner.id) : undefined;
  if (hit) {
    onCached();
    return refreshComparison(design, item, hit);
  }
  const out = await simulateCorner(opts.engine, design, corner, fha, { signal: opts.signal, timeoutMs: opts.timeoutMs, start: start!, ideal })
    .catch((e: unknown): CornerOutcome => ({ result: withIdeal(failedCorner(corner, fha, { kind: 'measurement', message: e instanceof Error ? e.message : String(e) }, undefined,
      evaluateLimits(design, corner.vin, fha, null, ideal.ideal)), ideal) }));
  if (opts.signal?.aborted && out.result.status === 'failed') return undefined; // interrupted, not a simulator failure
  if (key && out.result.failure?.kind !== 'timeout') await opts.cache!.set(key, out);
  return out;
}

/** A cached simulation is compared again with the current tolerances and limits (they may have changed). */
function refreshComparison(design: Design, item: PlanItem, out: CornerOutcome): CornerOutcome {
  const { corner, fha, ideal } = item;
  const r = withIdeal(out.result, ideal);
  if (!r.sim || r.status === 'failed') return { ...out, result: { ...r, fha, checks: evaluateLimits(design, corner.vin, fha, r.sim, ideal.ideal) } };
  const cmp = compareCorner(design, fha, r.sim, corner.fs === null, ideal.ideal);
  const checks = evaluateLimits(design, corner.vin, fha, r.sim, ideal.ideal);
  return { ...out, result: withIdeal({ ...r, ...simulated(corner, fha, { sim: r.sim, comparison: cmp.rows, divergences: cmp.divergences, checks }) }, ideal) };
}
