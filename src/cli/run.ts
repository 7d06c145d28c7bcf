import { join } from 'node:path';
import type { Design } from '../design/types.js';
import { createEngine, defaultJobs, maxJobs, EngineUnavailableError, type EngineName } from '../engine/index.js';
import { runPlan } from '../run/study.js';
import { planStudy } from '../plan/plan.js';
import { parseShard, shardItems } from '../plan/shard.js';
import { renderPlan } from './dryrun.js';
import { studyFingerprint } from './fingerprint.js';
import { createFileCache } from '../run/cache.js';
import { writeFilesAtomic } from '../run/files.js';
import { renderResultsJson, renderWaveformsJson } from '../report/json.js';
import { renderResultsCsv } from '../report/csv.js';
import { renderJunit } from '../report/junit.js';
import { renderRunTable, renderSummary } from '../report/table.js';
import { renderStatistics } from '../report/statistics.js';
import { renderSamplesCsv } from '../report/samplesCsv.js';
import { compareBaseline, renderBaseline } from '../compare/baseline.js';
import { renderHtmlReport } from '../report/html/index.js';
import { createProgress } from './progress.js';
import { loadMeasured } from './measured.js';
import { renderMeasuredTable } from '../report/measured.js';
import { measuredCorners } from '../measured/index.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { EXIT, exitCodeFor, signalExit, UsageError } from './exit.js';
import { runFailures, type FailOn } from '../results/gate.js';
import { loadResultsFile } from '../run/resultsFile.js';
import { orRefuse } from './report.js';
import { cacheProblem, checkOutputFile, checkOutputFolder } from './outputs.js';
import { requireMatches, useColor } from './common.js';

export interface RunFlags {
  engine: EngineName;
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
  /** 'divergence': also fail on any divergence beyond tolerance (default: only unexplained ones). */
  failOn?: string;
  measured?: string;
  quiet?: boolean;
  /** `K/N` (1-based), or the count N with shardIndexEnv. */
  shard?: string;
  /** Environment variable holding the 0-based shard index (JOB_COMPLETION_INDEX). */
  shardIndexEnv?: string;
  /** Print the plan and stop. */
  dryRun?: boolean;
  /** Run a plan above HUGE_PLAN simulated corners. */
  yes?: boolean;
}

/** Simulated corners above which `run` asks for --yes (about half an hour of one core on ngspice). */
export const HUGE_PLAN = 2000;

/** `tankcheck run`: returns the exit code; writes results even when interrupted. */
export async function runCommand(design: Design, o: RunFlags): Promise<number> {
  if (o.failOn !== undefined && o.failOn !== 'divergence') throw new UsageError(`--fail-on takes "divergence", got ${JSON.stringify(o.failOn)}`);
  const failOn: FailOn = o.failOn === 'divergence' ? 'divergence' : 'default';
  const baselineTol = Number(o.baselineTolerance);
  if (!(baselineTol >= 0 && baselineTol < 1)) throw new UsageError('--baseline-tolerance must be a fraction in [0, 1)');
  // --jobs is a wish: each wasm worker needs ~0.5 GB, so never start more than free memory holds
  const limit = maxJobs(o.engine);
  if (o.jobs !== undefined && o.jobs > limit) {
    process.stderr.write(`warning: --jobs ${o.jobs} is more than this machine can hold for the ${o.engine} engine (free memory or cores); using ${limit}\n`);
  }
  const jobs = Math.min(o.jobs ?? defaultJobs(o.engine), limit);
  const measured = o.measured ? await loadMeasured(o.measured) : undefined;
  const extra = measuredCorners(design, measured?.points ?? []);
  // the design's corners and the measured points, as the study will run them
  const corners = [...requireMatches(design, o.only, extra), ...filterCorners(extra, o.only)];
  const shard = o.shard !== undefined || o.shardIndexEnv !== undefined
    ? parseShard(o.shard, o.shardIndexEnv !== undefined ? { name: o.shardIndexEnv, value: process.env[o.shardIndexEnv] } : undefined) : undefined;
  if (typeof shard === 'string') throw new UsageError(shard);
  // Planning runs FHA and the ideal model on every corner (tens of ms each): a grid far beyond
  // HUGE_PLAN is refused on its count before that, unless --yes or a dry run asks for the plan.
  // A Monte Carlo design simulates only its confirm set, so its grid size alone says nothing.
  const perShard = shard ? Math.ceil(corners.length / shard.count) : corners.length;
  if (design.tolerances.corners !== 'random' && perShard > HUGE_PLAN && !o.yes && !o.dryRun) {
    throw new UsageError(`${corners.length} corners planned${shard ? ` (about ${perShard} in this shard)` : ''}, more than ${HUGE_PLAN}: split it with --shard K/N, or pass --yes to run it all here`);
  }
  if (!o.quiet) process.stderr.write(`planning ${corners.length} corners\n`);
  const plan = planStudy(design, { only: o.only, measured });
  if (o.dryRun) {
    process.stdout.write(renderPlan(plan, shard));
    return EXIT.ok;
  }
  const mine = shard ? shardItems(plan.items.map((it) => it.cost), shard).map((i) => plan.items[i]!) : plan.items;
  const toSimulate = mine.filter((it) => it.simulate).length;
  if (!o.quiet) process.stderr.write(`plan: ${plan.items.length} corners${shard ? `, shard ${shard.index}/${shard.count} runs ${mine.length}` : ''}; ${toSimulate} to simulate\n`);
  if (toSimulate > HUGE_PLAN && !o.yes) {
    throw new UsageError(`${toSimulate} corners to simulate is more than ${HUGE_PLAN}: check the plan with --dry-run, split it with --shard K/N, or pass --yes to run it all here`);
  }
  // everything that can be refused is refused before the first simulation
  const baseline = o.baseline ? orRefuse(await loadResultsFile(o.baseline), `--baseline ${o.baseline}`) : undefined;
  if (baseline && baseline.design.name !== design.name) {
    process.stderr.write(`note: baseline is from design "${baseline.design.name}", this run is design "${design.name}"\n`);
  }
  await checkOutputFolder(o.out, '--out');
  if (o.html) await checkOutputFile(o.html, '--html');
  let cache = o.cache;
  if (cache) {
    const p = await cacheProblem(o.cacheDir);
    if (p?.fatal) throw new UsageError(p.reason);
    if (p) process.stderr.write(`warning: ${p.reason}\n`);
    cache = !p;
  }
  const engine = createEngine(o.engine, { path: o.ngspicePath, workers: jobs, keepDir: o.keepDecks });
  const controller = new AbortController();
  let stoppedBy: NodeJS.Signals | undefined;
  // First SIGINT/SIGTERM/SIGHUP: stop starting corners, cancel the running ones (engines honour the
  // signal, a starting engine included), keep the finished ones and write the results marked
  // incomplete. A second one stops at once; the native engine's exit hook kills any simulator process
  // still running. SIGHUP (terminal closed) counts because system ngspice runs in its own process
  // group, out of the terminal's reach. The exit code is 128 + the first signal's number.
  const onSignal = (sig: NodeJS.Signals) => {
    if (!stoppedBy) {
      stoppedBy = sig;
      process.stderr.write(`\ntankcheck: ${sig}: stopping; finished corners are kept and written (send it again to stop at once)\n`);
      controller.abort(new Error(`interrupted by ${sig}`));
      return;
    }
    process.stderr.write(`tankcheck: ${sig} again: stopping at once, nothing more is written\n`);
    process.exit(signalExit(stoppedBy));
  };
  const SIGNALS = ['SIGINT', 'SIGTERM', 'SIGHUP'] as const;
  for (const sig of SIGNALS) process.on(sig, onSignal);
  try {
    // the embedded engine takes seconds to load: say what is happening before the first corner
    if (!o.quiet) process.stderr.write(`starting the ${o.engine} engine\n`);
    try {
      // a signal during the engine's start-up ends the wait at once; close() below stops the starting worker
      const aborted = new Promise<false>((resolve) => controller.signal.addEventListener('abort', () => resolve(false), { once: true }));
      if (!(await Promise.race([engine.version().then(() => true as const), aborted]))) throw controller.signal.reason;
    } catch (e) {
      if (stoppedBy) {
        process.stderr.write(`tankcheck: interrupted while the ${o.engine} engine was starting; nothing was simulated or written\n`);
        return signalExit(stoppedBy);
      }
      if (e instanceof EngineUnavailableError) {
        process.stderr.write(`tankcheck: engine ${o.engine} unavailable: ${e.message}\n`);
        return EXIT.engineUnavailable;
      }
      throw e;
    }
    // started before the first corner, so a log shows at once how much work is coming
    const progress = createProgress(process.stderr, mine.length, { quiet: o.quiet });
    progress.start(plan.monteCarlo
      ? `screening ${mine.length} corners with FHA and the ideal model, then simulating ${toSimulate} of them`
      : undefined);
    const fingerprint = shard ? studyFingerprint(design, { name: engine.name, version: await engine.version() }, { only: o.only, measured: measured?.points }) : '';
    const { results, waveforms, run } = await runPlan(design, plan, {
      engine, jobs, only: o.only, signal: controller.signal, shard: shard ? { ...shard, fingerprint } : undefined,
      cache: cache ? createFileCache(o.cacheDir, { onWarning: (m) => process.stderr.write(`warning: ${m}\n`) }) : undefined,
      timeoutMs: o.timeout ? o.timeout * 1000 : undefined,
      onProgress: (p) => progress.update(p), measured,
    });
    progress.end();
    if (baseline) results.baseline = compareBaseline(results, baseline, o.baseline!, baselineTol);
    const files = [
      { path: join(o.out, 'results.json'), text: renderResultsJson(results) },
      { path: join(o.out, 'results.csv'), text: renderResultsCsv(results) },
      { path: join(o.out, 'junit.xml'), text: renderJunit(results, { failOn }) },
      { path: join(o.out, 'waveforms.json'), text: renderWaveformsJson(waveforms) },
      // what this run took from the cache: kept out of results.json, which stays byte-identical
      { path: join(o.out, 'run-log.json'), text: `${JSON.stringify({ schema: 'tankcheck/run-log@1', cacheDir: cache ? o.cacheDir : null, ...run }, null, 2)}\n` },
    ];
    // Monte Carlo: one row per sample and operating point
    if (results.statistics) files.push({ path: join(o.out, 'samples.csv'), text: renderSamplesCsv(results) });
    if (o.html) files.push({ path: o.html, text: renderHtmlReport({ results, waveforms, design }) });
    await writeFilesAtomic(files);
    if (!o.quiet) {
      // a Monte Carlo run lists the simulated corners; the screened ones are in the statistics and the files
      const shown = results.statistics ? { ...results, corners: results.corners.filter((c) => c.status !== 'screened') } : results;
      process.stdout.write(renderRunTable(shown, { color: useColor(process.stdout) }));
      process.stdout.write(`\n${renderSummary(results)}`);
      process.stdout.write(renderMeasuredTable(results));
      if (results.statistics) process.stdout.write(`\n${renderStatistics(results.statistics)}`);
      if (results.baseline) process.stdout.write(renderBaseline(results.baseline));
      process.stdout.write(`wrote ${files.map((f) => f.path).join(', ')}\n`);
    }
    if (cache && !o.quiet) process.stderr.write(`cache: ${run.fromCache.length} of ${results.corners.length} corners from ${o.cacheDir}; ${run.simulated} operating points simulated now\n`);
    if (results.incomplete) {
      const finished = results.corners.filter((c) => c.status !== 'predicted').length;
      const rerun = cache ? ' (a rerun takes the finished ones from the cache)' : '';
      process.stderr.write(`tankcheck: interrupted: ${finished} of ${results.corners.length} corners finished; the results are marked incomplete${rerun}\n`);
    }
    const code = exitCodeFor(results, failOn, stoppedBy);
    const why = runFailures(results, failOn);
    if (code === EXIT.diverged && why.length && !o.quiet) {
      const shown = why.slice(0, 10).map((w) => `  ${w}`).join('\n');
      process.stdout.write(`exit ${code}:\n${shown}${why.length > 10 ? `\n  ... and ${why.length - 10} more` : ''}\n`);
    }
    return code;
  } finally {
    for (const sig of SIGNALS) process.off(sig, onSignal);
    await engine.close();
  }
}
