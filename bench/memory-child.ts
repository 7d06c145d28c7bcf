/**
 * One memory measurement in a fresh process (so that no earlier run's heap or freed wasm memory is
 * in the baseline): `node --import tsx bench/memory-child.ts <workers> <design file>`. Prints one
 * JSON MemoryRow on stdout.
 */
import { loadDesignOrThrow } from '../src/design/index.js';
import { createEngine } from '../src/engine/index.js';
import { runStudy } from '../src/run/study.js';
import { MB, sampleRss } from './util.js';
import type { MemoryRow } from './memory.js';

async function main(): Promise<void> {
  const workers = Number(process.argv[2]);
  const file = process.argv[3]!;
  const { design } = await loadDesignOrThrow(file);
  const pre = process.memoryUsage().rss;
  const sampler = sampleRss(50);
  const engine = createEngine('wasm', { workers });
  const t0 = performance.now();
  try {
    const out = await runStudy(design, { engine, jobs: workers });
    const wallMs = performance.now() - t0;
    const peak = sampler.stop();
    const row: MemoryRow = { workers, preMB: pre / MB, peakMB: peak / MB, perWorkerMB: (peak - pre) / MB / workers, wallMs,
      corners: out.results.corners.length, failed: out.results.summary.failed };
    process.stdout.write(`${JSON.stringify(row)}\n`);
  } finally {
    sampler.stop();
    await engine.close();
  }
}

main().catch((e: unknown) => {
  process.stderr.write(`memory child failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exitCode = 1;
});
