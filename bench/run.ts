/**
 * `npm run bench`: measures in one run, side by side, the settling of every corner by start method,
 * the regulation search, wasm against system ngspice, FHA prediction rate, the corner cache and the
 * embedded engine's memory, and writes bench/RESULTS.md. Progress goes to stderr.
 */
import { writeFile } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { loadDesignOrThrow } from '../src/design/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { createEngine, defaultJobs } from '../src/engine/index.js';
import { describeMachine, sourcesChangedSince } from './machine.js';
import { firstPoints, runSettling, type BenchDesign } from './settling.js';
import { measureConfirmed } from './confirmed.js';
import { refKey, runReferences, type RefRequest } from './reference.js';
import { methodSummaries, scoreRows } from './analyze.js';
import { compareEngines } from './engines.js';
import { measureFhaRate } from './fha.js';
import { measureCache } from './cache.js';
import { measureMemory } from './memory.js';
import { measureSaveCost } from './costs.js';
import { measureCapacitors } from './capacitor.js';
import { renderResults } from './report.js';
import { elapsedS, log } from './util.js';
import { measureIdealCase } from './ideal.js';
import { measureScreening } from './screening.js';
import { cpuSnapshot, foreignShare } from './cpu.js';

const here = (p: string) => fileURLToPath(new URL(p, import.meta.url));
const DESIGNS = [
  { key: 'demo', file: 'examples/demo.yaml' },
  { key: 'charger', file: 'examples/charger-fb-1kw.yaml' },
];

async function main(): Promise<void> {
  const startedAt = Date.now();
  const date = new Date(startedAt).toISOString().slice(0, 16).replace('T', ' ') + ' UTC';
  const machine = describeMachine();
  log(`${machine.cpu}, ${machine.cpus} CPUs, ${machine.freeMemMB} MB free, Node ${machine.node}`);
  const designs: BenchDesign[] = [];
  for (const d of DESIGNS) designs.push({ ...d, design: (await loadDesignOrThrow(here(`../${d.file}`))).design });

  const foreign: { phase: string; share: number | null }[] = [];
  let snap = cpuSnapshot();
  const phaseDone = (phase: string) => {
    const now = cpuSnapshot();
    foreign.push({ phase, share: foreignShare(snap, now) });
    snap = now;
  };
  await new Promise((r) => setTimeout(r, 2000));
  phaseDone('idle check before start (2 s)');
  const idle = foreign[0]!.share;
  if (idle !== null && idle > 0.2) log(`warning: other processes are using ${(idle * 100).toFixed(0)} % of the CPU; timings will be inflated and noisier`);
  log('case 6: memory of the embedded engine');
  const memory = await measureMemory(designs[0]!);

  phaseDone('6. memory');
  log('cases 1-2: settling by start method (system ngspice)');
  const ngspice = createEngine('ngspice');
  const settleEngine = await ngspice.version();
  const rows = await runSettling(designs, ngspice);

  phaseDone('1. settling runs');
  const reqs = new Map<string, RefRequest>();
  for (const r of rows) {
    if (r.fs === null || r.vout === null) continue;
    const key = refKey(r.design, r.corner.id, r.fs);
    if (!reqs.has(key)) reqs.set(key, { key, design: designs.find((d) => d.key === r.design)!, corner: r.corner, fs: r.fs });
  }
  log(`case 1: ${reqs.size} settled references (two at a time)`);
  const refs = await runReferences(ngspice, [...reqs.values()]);
  const settle = scoreRows(rows, refs);
  phaseDone('1. references');
  log('case 2: first operating point of each regulated corner');
  const first = await firstPoints(designs, ngspice);

  phaseDone('2. first points');
  log('case 3: engines');
  const engines = await compareEngines(designs);

  phaseDone('3. engines');
  log('case 4: FHA prediction rate');
  const fha = designs.map((d) => measureFhaRate(d));

  phaseDone('4. FHA');
  log('case 7: output capacitor 470 uF vs 10 mF (system ngspice)');
  const capacitor = await measureCapacitors(designs[0]!, ngspice);
  phaseDone('7. capacitor');
  log('case 5: cache');
  const cache = await measureCache(designs[0]!, ngspice, defaultJobs('ngspice'));
  await ngspice.close();

  phaseDone('5. cache');
  log('case 8: the ideal column (cost per corner, agreement with simulation on both engines)');
  const ideal = await measureIdealCase(designs);
  phaseDone('8. ideal column');
  const screening = measureScreening(designs[0]!.design);
  phaseDone('9. Monte Carlo screening');
  log('case 10: cycles per confirmed Monte Carlo corner (system ngspice)');
  const confirmedEngine = createEngine('ngspice');
  const confirmed = await measureConfirmed(designs[0]!.design, confirmedEngine);
  await confirmedEngine.close();
  phaseDone('10. confirmed corners');
  log('cost drivers: saved data per run');
  const saveCost = await measureSaveCost(designs[0]!, 3);
  phaseDone('cost drivers');
  log(`other processes' share of the CPU per phase: ${foreign.map((f) => `${f.phase} ${f.share === null ? '?' : (f.share * 100).toFixed(0) + ' %'}`).join(', ')}`);

  const text = renderResults({
    machine, date, totalS: elapsedS(), foreign, changed: sourcesChangedSince(startedAt), designs: designs.map((d) => ({ key: d.key, file: d.file, corners: expandCorners(d.design).length })),
    settleEngine, settle, refs: [...reqs.keys()].map((k) => refs.get(k)!), summaries: methodSummaries(settle, designs.map((d) => d.key)),
    engines, fha, cache, memory, first, saveCost, capacitor, ideal, screening, confirmed,
  });
  const out = here('./RESULTS.md');
  await writeFile(out, text);
  log(`wrote ${out} (${elapsedS().toFixed(0)} s in all)`);
}

main().catch((e: unknown) => {
  process.stderr.write(`bench failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exitCode = 1;
});
