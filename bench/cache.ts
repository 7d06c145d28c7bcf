/**
 * Case 5: the demo run twice through runStudy with a file cache in a fresh temp folder. The second
 * run must simulate nothing (run.simulated 0, every corner from the cache) and give a byte-identical
 * results.json.
 */
import { mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { SimEngine } from '../src/engine/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { createFileCache } from '../src/run/cache.js';
import { startPoint } from '../src/plan/start.js';
import { predictCorner } from '../src/fha/predict.js';
import { runStudy } from '../src/run/study.js';
import { renderResultsJson } from '../src/report/json.js';
import type { BenchDesign } from './settling.js';
import { log, median } from './util.js';

export interface CaseCache {
  design: string;
  corners: number;
  jobs: number;
  firstMs: number;
  secondMs: number;
  secondSimulations: number;
  secondCacheHits: number;
  firstSimulations: number;
  /** Both runs' results.json byte-identical. */
  sameValues: boolean;
  /** Median time per corner of cache.key() and of the start point it needs (FHA + time-domain model), ms: the second run's main cost. */
  keyMedianMs: number;
  startMedianMs: number;
}

export async function measureCache(d: BenchDesign, engine: SimEngine, jobs: number): Promise<CaseCache> {
  const dir = await mkdtemp(join(tmpdir(), 'tankcheck-bench-cache-'));
  try {
    const cache = createFileCache(dir);
    let t0 = performance.now();
    const first = await runStudy(d.design, { engine, jobs, cache });
    const firstMs = performance.now() - t0;
    log(`cache ${d.key}: first run ${firstMs.toFixed(0)} ms, ${first.results.summary.simulations} simulations`);
    t0 = performance.now();
    const second = await runStudy(d.design, { engine, jobs, cache });
    const secondMs = performance.now() - t0;
    const sameValues = renderResultsJson(first.results) === renderResultsJson(second.results);
    const version = await engine.version();
    const startMs: number[] = [];
    const keyMs: number[] = [];
    for (const c of expandCorners(d.design)) {
      const k0 = performance.now();
      const start = startPoint(d.design, c, predictCorner(d.design, c));
      const k1 = performance.now();
      cache.key(d.design, c, version, start);
      startMs.push(k1 - k0);
      keyMs.push(performance.now() - k1);
    }
    const s = second.run;
    log(`cache ${d.key}: second run ${secondMs.toFixed(0)} ms, ${s.simulated} simulations, ${s.fromCache.length} cache hits`);
    return { design: d.key, corners: first.results.corners.length, jobs, firstMs, secondMs, secondSimulations: s.simulated,
      secondCacheHits: s.fromCache.length, firstSimulations: first.run.simulated, sameValues, keyMedianMs: median(keyMs), startMedianMs: median(startMs) };
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}
