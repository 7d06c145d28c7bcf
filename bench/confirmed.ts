/**
 * Case 10: cycles per confirmed corner. The demo with `corners: random` (200 samples x 6 operating
 * points, simulation.confirm 20, seed 42) through runStudy on the system engine: every corner the
 * simulation confirms (the worst per limit and the random validation set) settles by simulateSteady
 * with the model start. Reports the cycles, runs and operating points per confirmed corner and the
 * steady-state evidence (charge balance, periodicity) they were proven with. Run alone:
 * `node --import tsx bench/confirmed.ts`; `npm run bench` includes it.
 */
import type { Design } from '../src/design/types.js';
import type { SimEngine } from '../src/engine/index.js';
import { runStudy } from '../src/run/study.js';
import { monteCarloDemo } from './screening.js';
import { log, mean, median } from './util.js';

export interface ConfirmedCase {
  samples: number;
  corners: number;
  confirmed: number;
  settled: number;
  failed: number;
  meanCycles: number;
  medianCycles: number;
  maxCycles: number;
  meanRuns: number;
  meanSimulations: number;
  worstBalance: number;
  worstPeriodicity: number;
  wallS: number;
  /** Cycles per confirmed corner, for the histogram line. */
  cycles: number[];
  /** Operating points (frequency search steps) per confirmed corner, in the same order. */
  simulations: number[];
}

export const CONFIRMED_SAMPLES = 200;

export async function measureConfirmed(demo: Design, engine: SimEngine): Promise<ConfirmedCase> {
  const design = monteCarloDemo(demo, CONFIRMED_SAMPLES);
  const t0 = performance.now();
  const out = await runStudy(design, { engine, jobs: 1 });
  const wallS = (performance.now() - t0) / 1000;
  const sims = out.results.corners.filter((c) => c.status !== 'screened' && c.sim);
  const cycles = sims.map((c) => c.sim!.cycles);
  const r: ConfirmedCase = {
    samples: CONFIRMED_SAMPLES, corners: out.results.corners.length, confirmed: sims.length,
    settled: sims.filter((c) => c.sim!.settled).length, failed: out.results.corners.filter((c) => c.status === 'failed').length,
    meanCycles: mean(cycles), medianCycles: median(cycles), maxCycles: Math.max(...cycles),
    meanRuns: mean(sims.map((c) => c.sim!.runs)), meanSimulations: mean(sims.map((c) => c.sim!.simulations)),
    worstBalance: Math.max(...sims.map((c) => Math.abs(c.sim!.chargeBalanceError ?? NaN))),
    worstPeriodicity: Math.max(...sims.map((c) => c.sim!.periodicityError ?? NaN)), wallS, cycles,
    simulations: sims.map((c) => c.sim!.simulations),
  };
  log(`confirmed corners: ${r.confirmed} of ${r.corners}, mean ${r.meanCycles.toFixed(1)} cycles (median ${r.medianCycles}, max ${r.maxCycles}), ` +
    `${r.settled} settled, worst balance ${(r.worstBalance * 100).toFixed(3)} %, ${wallS.toFixed(1)} s`);
  return r;
}

export function renderConfirmed(c: ConfirmedCase, target: number): string {
  const counts = new Map<number, number>();
  for (const x of c.cycles) counts.set(x, (counts.get(x) ?? 0) + 1);
  return [
    `## 10. Cycles per confirmed corner (demo, corners: random, ${c.samples} samples, confirm 20, seed 42, system engine)`, '',
    `runStudy planned ${c.corners} sample-corners and simulated the ${c.confirmed} it confirms (model start, default settings, one job). ` +
      `Mean **${c.meanCycles.toFixed(1)} cycles** per confirmed corner (target <= ${target}; median ${c.medianCycles}, max ${c.maxCycles}), ` +
      `${c.meanRuns.toFixed(2)} runs and ${c.meanSimulations.toFixed(2)} operating points; ${c.settled} of ${c.confirmed} proven settled, ${c.failed} failed. ` +
      `Worst evidence they were proven with: charge balance ${(c.worstBalance * 100).toFixed(3)} %, periodicity ${(c.worstPeriodicity * 100).toFixed(3)} % ` +
      `(tolerances 1 %). Wall time of the whole study ${c.wallS.toFixed(1)} s.`, '',
    `Cycles: ${[...counts.entries()].sort((a, b) => a[0] - b[0]).map(([k, n]) => `${k} x${n}`).join(', ')}. ${confirmedSplit(c)}`,
  ].join('\n');
}

/** Mean cycles of the confirmed corners by how many operating points their frequency search took. */
export function confirmedSplit(c: ConfirmedCase): string {
  const by = new Map<number, number[]>();
  c.simulations.forEach((s, i) => by.set(s, [...(by.get(s) ?? []), c.cycles[i]!]));
  return [...by.entries()].sort((a, b) => a[0] - b[0])
    .map(([s, cs]) => `${cs.length} corner(s) with ${s} operating point(s): mean ${mean(cs).toFixed(1)} cycles`).join('; ') + '.';
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const { loadDesignOrThrow } = await import('../src/design/index.js');
  const { createEngine } = await import('../src/engine/index.js');
  const demo = (await loadDesignOrThrow(new URL('../examples/demo.yaml', import.meta.url).pathname)).design;
  const engine = createEngine('ngspice');
  process.stdout.write(renderConfirmed(await measureConfirmed(demo, engine), 15) + '\n');
  await engine.close();
}
