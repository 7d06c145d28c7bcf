/**
 * Case 8: the ideal column. Its cost per corner (the time-domain solve, then sampling and
 * measuring), set against FHA and the simulation measured in the same run, and its agreement with
 * the simulation (median and worst relative difference of Vout, the regulated fs and the tank RMS)
 * on both engines. Runs inside `npm run bench`, or alone: `node --import tsx bench/ideal.ts`
 * prints the section.
 */
import { fileURLToPath } from 'node:url';
import { performance } from 'node:perf_hooks';
import { loadDesignOrThrow } from '../src/design/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { idealCorner, measureState } from '../src/ideal/index.js';
import { modelDrop } from '../src/netlist/waveforms.js';
import { createEngine } from '../src/engine/index.js';
import { runStudy } from '../src/run/study.js';
import type { Design } from '../src/design/types.js';
import type { CornerResult } from '../src/results/types.js';
import { log, median } from './util.js';

export interface IdealCost { design: string; corners: number; idealMs: number; measureMs: number; fhaMs: number; simMs: Record<string, number> }
export interface Agreement { engine: string; metric: string; corners: number; median: number; worst: number; worstId: string }
export interface IdealCase { costs: IdealCost[]; agreement: Agreement[]; skipped: string[] }

const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

/** Median wall time of fn over `repeat` calls, ms. */
function timed(fn: () => void, repeat: number): number {
  const t: number[] = [];
  for (let i = 0; i < repeat; i++) { const t0 = performance.now(); fn(); t.push(performance.now() - t0); }
  return median(t);
}

export async function measureIdealCase(designs: { key: string; design: Design }[], engines: readonly ('ngspice' | 'wasm')[] = ['ngspice', 'wasm']): Promise<IdealCase> {
  const costs: IdealCost[] = [];
  const byEngine = new Map<string, CornerResult[]>();
  for (const { key, design } of designs) {
    const corners = expandCorners(design);
    const fhas = corners.map((c) => predictCorner(design, c));
    corners.forEach((c, i) => idealCorner(design, c, fhas[i]!)); // warm-up (JIT)
    let idealMs = 0;
    let measureMs = 0;
    let fhaMs = 0;
    corners.forEach((c, i) => {
      idealMs += timed(() => idealCorner(design, c, fhas[i]!), 3);
      fhaMs += timed(() => predictCorner(design, c), 50);
      const o = idealCorner(design, c, fhas[i]!);
      if (o.ideal) measureMs += timed(() => measureState(o.params, o.state, c.load, modelDrop(design), design.simulation.zvsThreshold), 3);
    });
    const simMs: Record<string, number> = {};
    for (const name of engines) {
      const engine = createEngine(name);
      const t0 = performance.now();
      const r = await runStudy(design, { engine, jobs: 1 });
      simMs[name] = (performance.now() - t0) / corners.length;
      await engine.close();
      byEngine.set(name, [...(byEngine.get(name) ?? []), ...r.results.corners]);
      log(`  ${key} ${name}: ${corners.length} corners, ${(simMs[name] / 1e3).toFixed(2)} s per corner`);
    }
    costs.push({ design: key, corners: corners.length, idealMs: idealMs / corners.length, measureMs: measureMs / corners.length, fhaMs: fhaMs / corners.length, simMs });
  }
  const agreement: Agreement[] = [];
  const skipped: string[] = [];
  for (const [engine, cs] of byEngine) {
    const usable = cs.filter((c) => {
      const ok = c.ideal && c.sim && c.sim.settled && c.sim.region === 'inductive';
      if (!ok) skipped.push(`${engine} ${c.id}: ${c.ideal ? 'not an inductive settled simulation' : c.idealReason ?? 'no ideal column'}`);
      return ok;
    });
    const add = (metric: string, rows: CornerResult[], get: (c: CornerResult) => number, ref: (c: CornerResult) => number) => {
      if (!rows.length) return;
      const e = rows.map((c) => ({ id: c.id, e: rel(get(c), ref(c)) }));
      const w = e.reduce((a, b) => (b.e > a.e ? b : a));
      agreement.push({ engine, metric, corners: rows.length, median: median(e.map((x) => x.e)), worst: w.e, worstId: w.id });
    };
    const fixed = usable.filter((c) => c.inputs.fs !== null);
    const regulated = usable.filter((c) => c.inputs.fs === null);
    add('Vout, fixed-frequency corners', fixed, (c) => c.sim!.vout, (c) => c.ideal!.vout);
    add('Vout, regulated corners (ideal = target)', regulated, (c) => c.sim!.vout, (c) => c.ideal!.vout);
    add('fs, regulated corners', regulated, (c) => c.sim!.fs, (c) => c.ideal!.fs);
    add('tank current RMS, all corners', usable, (c) => c.sim!.tankCurrentRms, (c) => c.ideal!.tankCurrentRms);
  }
  return { costs, agreement, skipped };
}

const pct = (x: number) => `${(x * 100).toFixed(2)} %`;

/** Markdown lines of the section body. */
export function idealLines(c: IdealCase): string[] {
  const engines = Object.keys(c.costs[0]?.simMs ?? {});
  return [
    'Cost per corner (median of 3 calls per corner after a warm-up; FHA of 50): the ideal column is the solve (periodic state, and the frequency search at regulated corners) plus sampling and measuring. The simulation time is runStudy per corner (one job, no cache) and includes the ideal column, which also gives the simulation its start.', '',
    `| design | corners | ideal ms/corner | of which sampling + measure ms | FHA ms/corner | ${engines.map((e) => `simulation ${e} s/corner | ideal / simulation`).join(' | ')} |`,
    `|---|---|---|---|---|${engines.map(() => '---|---|').join('')}`,
    ...c.costs.map((k) => `| ${k.design} | ${k.corners} | ${k.idealMs.toFixed(1)} | ${k.measureMs.toFixed(1)} | ${k.fhaMs.toFixed(4)} | ${engines.map((e) => `${(k.simMs[e]! / 1e3).toFixed(2)} | ${(k.idealMs / k.simMs[e]!).toFixed(3)}`).join(' | ')} |`),
    '',
    'Agreement with the simulation, |sim - ideal| / |ideal| per corner (settled, inductive corners):', '',
    '| engine | metric | corners | median | worst | worst corner |', '|---|---|---|---|---|---|',
    ...c.agreement.map((a) => `| ${a.engine} | ${a.metric} | ${a.corners} | ${pct(a.median)} | ${pct(a.worst)} | ${a.worstId} |`),
    ...(c.skipped.length ? ['', `Left out: ${c.skipped.join('; ')}.`] : []),
    '',
    'At regulated corners the simulation starts at the ideal model\'s frequency and keeps it when the simulated output is within 0.4 % of the target, so there the fs figure mostly shows how often that happened; the Vout figure at those corners is the independent one.',
  ];
}

if (process.argv[1] === fileURLToPath(import.meta.url)) {
  const files = [['demo', 'examples/demo.yaml'], ['charger', 'examples/charger-fb-1kw.yaml']] as const;
  const designs = [];
  for (const [key, f] of files) designs.push({ key, design: (await loadDesignOrThrow(fileURLToPath(new URL(`../${f}`, import.meta.url)))).design });
  const c = await measureIdealCase(designs);
  process.stdout.write(`${idealLines(c).join('\n')}\n`);
}
