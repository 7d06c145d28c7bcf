import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { Design } from '../design/types.js';
import type { Results } from '../report/types.js';
import { createEngine, defaultJobs, EngineUnavailableError } from '../engine/index.js';
import { runStudy } from '../run/study.js';
import { createFileCache } from '../run/cache.js';
import { writeFilesAtomic } from '../run/files.js';
import { renderResultsJson, renderWaveformsJson } from '../report/json.js';
import { renderResultsCsv } from '../report/csv.js';
import { renderJunit } from '../report/junit.js';
import { renderRunTable, renderSummary } from '../report/table.js';
import { compareBaseline, renderBaseline } from '../compare/baseline.js';
import { renderHtmlReport } from '../report/html/index.js';
import { createProgress } from './progress.js';
import { EXIT, exitCodeFor, UsageError } from './exit.js';

export interface RunFlags {
  engine: string;
  ngspicePath?: string;
  jobs?: number;
  out: string;
  only?: string;
  baseline?: string;
  baselineTolerance: string;
  html?: string;
  cache: boolean;
  cacheDir: string;
  keepDecks?: boolean;
  timeout?: number;
}

async function readBaseline(file: string): Promise<Results> {
  let data: unknown;
  try {
    data = JSON.parse(await readFile(file, 'utf8'));
  } catch (e) {
    throw new UsageError(`--baseline ${file}: cannot read a results file (${e instanceof Error ? e.message : e})`);
  }
  if ((data as Results)?.schema !== 'tankcheck/results@1' || !Array.isArray((data as Results).corners)) {
    throw new UsageError(`--baseline ${file}: not a tankcheck results file (schema tankcheck/results@1 expected)`);
  }
  return data as Results;
}

/** `tankcheck run`: returns the exit code; writes results even when interrupted. */
export async function runCommand(design: Design, o: RunFlags): Promise<number> {
  if (o.engine !== 'wasm' && o.engine !== 'ngspice') throw new UsageError(`--engine must be wasm or ngspice, got ${JSON.stringify(o.engine)}`);
  const baselineTol = Number(o.baselineTolerance);
  if (!(baselineTol >= 0 && baselineTol < 1)) throw new UsageError('--baseline-tolerance must be a fraction in [0, 1)');
  const baseline = o.baseline ? await readBaseline(o.baseline) : undefined;
  const jobs = o.jobs ?? defaultJobs(o.engine);
  const engine = createEngine(o.engine, { path: o.ngspicePath, workers: jobs, keepDir: o.keepDecks });
  const controller = new AbortController();
  const onSignal = () => controller.abort(new Error('interrupted'));
  process.once('SIGINT', onSignal);
  process.once('SIGTERM', onSignal);
  try {
    try {
      await engine.version();
    } catch (e) {
      if (e instanceof EngineUnavailableError) {
        process.stderr.write(`tankcheck: engine ${o.engine} unavailable: ${e.message}\n`);
        return EXIT.engineUnavailable;
      }
      throw e;
    }
    let progress: ReturnType<typeof createProgress> | undefined;
    const { results, waveforms } = await runStudy(design, {
      engine, jobs, only: o.only, signal: controller.signal,
      cache: o.cache ? createFileCache(o.cacheDir) : undefined,
      timeoutMs: o.timeout ? o.timeout * 1000 : undefined,
      onProgress: (p) => {
        if (!progress) { progress = createProgress(process.stderr, p.total); progress.start(); }
        progress.update(p);
      },
    });
    progress?.end();
    if (baseline) results.baseline = compareBaseline(results, baseline, o.baseline!, baselineTol);
    const files = [
      { path: join(o.out, 'results.json'), text: renderResultsJson(results) },
      { path: join(o.out, 'results.csv'), text: renderResultsCsv(results) },
      { path: join(o.out, 'junit.xml'), text: renderJunit(results) },
      { path: join(o.out, 'waveforms.json'), text: renderWaveformsJson(waveforms) },
    ];
    if (o.html) files.push({ path: o.html, text: renderHtmlReport({ results, waveforms, design }) });
    await writeFilesAtomic(files);
    process.stdout.write(renderRunTable(results, { color: Boolean(process.stdout.isTTY) && !process.env['NO_COLOR'] }));
    process.stdout.write(`\n${renderSummary(results)}`);
    if (results.baseline) process.stdout.write(renderBaseline(results.baseline));
    process.stdout.write(`wrote ${files.map((f) => f.path).join(', ')}\n`);
    return exitCodeFor(results);
  } finally {
    process.off('SIGINT', onSignal);
    process.off('SIGTERM', onSignal);
    await engine.close();
  }
}
