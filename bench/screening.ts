/**
 * Case 9: Monte Carlo screening throughput. The demo design with `corners: random`, 1000 samples
 * x its 6 operating points = 6000 sample-corners, each through FHA, the ideal model (regulated
 * frequency solve, sampling, measurement) and the limit checks (plan/plan.ts screenCorner),
 * on one core (one process, no workers). Side by side on a subset of the same corners: the
 * regulated frequency solve by the direct Newton against the bracketing search, and the screening
 * sampling against the default. Run alone: `node --import tsx bench/screening.ts` (prints a
 * Markdown section); `npm run bench` includes it.
 */
import { fileURLToPath } from 'node:url';
import type { Design } from '../src/design/types.js';
import { loadDesignOrThrow } from '../src/design/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { idealCorner, modelParams, SCREENING_POINTS } from '../src/ideal/index.js';
import { solveFrequency } from '../src/tdmodel/index.js';
import { screenCorner } from '../src/plan/plan.js';
import { monteCarloStatistics } from '../src/statistics/index.js';
import { cpuSnapshot, foreignShare } from './cpu.js';
import { log, median } from './util.js';

export interface ScreeningCase {
  corners: number;
  seconds: number;
  /** CPU seconds this process used for the pass (user + system): less sensitive than wall time to a shared machine. */
  cpuSeconds: number;
  perCornerMs: number;
  /** Other processes' share of the machine during the timed pass (null: unknown). */
  foreign: number | null;
  nullIdeal: number;
  yieldFha: number;
  yieldIdeal: number;
  /** Median ms per corner on the subset: frequency search vs direct Newton; default vs screening sampling. */
  solve: { search: number; direct: number; evalsSearch: number; evalsDirect: number; worstFsDiff: number };
  sampling: { full: number; screening: number };
  subset: number;
}

const time = (f: () => void): number => {
  const t0 = performance.now();
  f();
  return performance.now() - t0;
};

/** The demo with 1000 random samples (5 % Lr, Cr; 10 % Lm; 0.5 % turns ratio; uniform). */
export function monteCarloDemo(design: Design, samples = 1000): Design {
  return { ...design, tolerances: { ...design.tolerances, turnsRatio: 0.005, corners: 'random', samples, seed: 42, distribution: 'uniform' } };
}

export function measureScreening(demo: Design, subset = 120): ScreeningCase {
  const design = monteCarloDemo(demo);
  const corners = expandCorners(design);
  log(`case 9: screening ${corners.length} sample-corners on one core`);
  for (const c of corners.slice(0, 30)) screenCorner(design, c); // warm-up
  const before = cpuSnapshot();
  const cpu0 = process.cpuUsage();
  const results: ReturnType<typeof screenCorner>[] = [];
  const ms = time(() => { for (const c of corners) results.push(screenCorner(design, c)); });
  const cpu = process.cpuUsage(cpu0);
  const foreign = foreignShare(before, cpuSnapshot());
  const stats = monteCarloStatistics(results, { seed: 42, distribution: 'uniform' });

  // side by side on every (corners.length / subset)-th corner, alternating the variants per corner
  const pick = corners.filter((_, i) => i % Math.floor(corners.length / subset) === 0).slice(0, subset);
  const search: number[] = []; const direct: number[] = []; const full: number[] = []; const coarse: number[] = [];
  let evalsSearch = 0; let evalsDirect = 0; let worstFsDiff = 0;
  for (const c of pick) {
    const fha = predictCorner(design, c);
    const f0 = fha.fs ?? fha.fsZeroPhase;
    const p = modelParams(design, c, f0);
    let a: ReturnType<typeof solveFrequency> | null = null;
    let b: ReturnType<typeof solveFrequency> | null = null;
    search.push(time(() => { a = solveFrequency(p, c.load, design.output.voltage, f0, { direct: false }); }));
    direct.push(time(() => { b = solveFrequency(p, c.load, design.output.voltage, f0); }));
    evalsSearch += a!.evaluations; evalsDirect += b!.evaluations;
    if (a!.fs !== null && b!.fs !== null) worstFsDiff = Math.max(worstFsDiff, Math.abs(b!.fs / a!.fs - 1));
    full.push(time(() => idealCorner(design, c, fha)));
    coarse.push(time(() => idealCorner(design, c, fha, { pointsPerHalf: SCREENING_POINTS })));
  }
  return {
    corners: corners.length, seconds: ms / 1000, cpuSeconds: (cpu.user + cpu.system) / 1e6, perCornerMs: ms / corners.length, foreign,
    nullIdeal: results.filter((r) => !r.ideal).length, yieldFha: stats.yield.fha.value, yieldIdeal: stats.yield.ideal.value,
    solve: { search: median(search), direct: median(direct), evalsSearch: evalsSearch / pick.length, evalsDirect: evalsDirect / pick.length, worstFsDiff },
    sampling: { full: median(full), screening: median(coarse) },
    subset: pick.length,
  };
}

/** The RESULTS.md section of case 9. */
export function renderScreening(s: ScreeningCase): string {
  const f = (x: number, d = 2) => x.toFixed(d);
  return [
    '## 9. Monte Carlo screening (demo, 1000 samples x 6 operating points, one core)', '',
    'Every sample-corner through FHA, the ideal model (regulated frequency solve, sampling at the screening resolution, measurement) and the limit checks: `screenCorner` in a loop, one process.', '',
    '| corners | wall s | CPU s (this process) | ms per corner (wall) | target | other processes\' CPU share | ideal model without a value | yield FHA | yield ideal |', '|---|---|---|---|---|---|---|---|---|',
    `| ${s.corners} | ${f(s.seconds, 1)} | ${f(s.cpuSeconds, 1)} | ${f(s.perCornerMs)} | <= 30 s | ${s.foreign === null ? '?' : `${(s.foreign * 100).toFixed(0)} %`} | ${s.nullIdeal} | ${(s.yieldFha * 100).toFixed(1)} % | ${(s.yieldIdeal * 100).toFixed(1)} % |`, '',
    `Side by side on ${s.subset} of the same corners (median ms per corner, measured alternately in one loop):`, '',
    '| step | before | after | after / before |', '|---|---|---|---|',
    `| regulated frequency solve: bracketing search -> direct Newton on (state, T/2) | ${f(s.solve.search)} (${f(s.solve.evalsSearch, 1)} steady states) | ${f(s.solve.direct)} (${f(s.solve.evalsDirect, 1)}) | ${f(s.solve.direct / s.solve.search)} |`,
    `| ideal column, sampling 400 -> ${SCREENING_POINTS} points per half period | ${f(s.sampling.full)} | ${f(s.sampling.screening)} | ${f(s.sampling.screening / s.sampling.full)} |`, '',
    `Largest relative fs difference between the two solves: ${s.solve.worstFsDiff.toExponential(1)}. The coarser sampling moves RMS values and peaks by at most 0.1 % (src/ideal/screening.test.ts).`, '',
  ].join('\n');
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const demo = (await loadDesignOrThrow(fileURLToPath(new URL('../examples/demo.yaml', import.meta.url)))).design;
  process.stdout.write(renderScreening(measureScreening(demo)));
}
