/** RESULTS.md as a string, from one bench run's measurements. */
import { CHECK_CYCLES } from '../src/run/steady.js';
import { renderScreening, type ScreeningCase } from './screening.js';
import { confirmedSplit, renderConfirmed, type ConfirmedCase } from './confirmed.js';
import {
  BEFORE, CYCLES_STRETCH, CYCLES_TARGET, ENGINE_RATIO_TARGET, FHA_RATE_TARGET, FIRST_RUN_CYCLES, MEMORY_TARGET_MB, SIMS_TARGET,
  type MethodSummary, type ScoredRow,
} from './analyze.js';
import type { Reference } from './reference.js';
import type { EngineCase } from './engines.js';
import type { FhaRate } from './fha.js';
import type { CaseCache } from './cache.js';
import type { MemoryCase } from './memory.js';
import type { MachineInfo } from './machine.js';
import type { FirstPoint } from './settling.js';
import type { SaveCost } from './costs.js';
import { CAP_BALANCE_TARGET, CAP_RATIO_TARGET, capLines, capSummary, type CapCase } from './capacitor.js';
import * as S from './report-sections.js';
import { REGULATION_TOLERANCE } from '../src/run/regulate.js';
import { fix, passFail, pct } from './util.js';
import { idealLines, type IdealCase } from './ideal.js';

export interface BenchData {
  machine: MachineInfo;
  date: string;
  totalS: number;
  /** Share of the machine's CPU used by other processes, per phase (null: /proc unreadable). */
  foreign: { phase: string; share: number | null }[];
  /** src/ files modified while the bench ran (the bench measured the code as it was at its start). */
  changed: string[];
  designs: { key: string; file: string; corners: number }[];
  settleEngine: string;
  settle: ScoredRow[];
  refs: Reference[];
  summaries: MethodSummary[];
  engines: EngineCase;
  fha: FhaRate[];
  cache: CaseCache;
  memory: MemoryCase;
  first: FirstPoint[];
  saveCost: SaveCost[];
  capacitor: CapCase;
  /** Case 8, the ideal column (bench/ideal.ts). */
  ideal?: IdealCase;
  /** Case 9, Monte Carlo screening (bench/screening.ts). */
  screening?: ScreeningCase;
  /** Case 10, cycles per confirmed Monte Carlo corner (bench/confirmed.ts). */
  confirmed?: ConfirmedCase;
}

interface Target { name: string; target: string; figure: string; ok: boolean }

function targets(d: BenchData): Target[] {
  const sum = (m: string, scope: string) => d.summaries.find((s) => s.method === m && s.scope === scope)!;
  const model = sum('model', 'all');
  const demoKey = d.designs[0]!.key;
  const regModel = sum('model', demoKey);
  const ratio = S.engineRatios(d.engines).perCorner;
  const minRate = Math.min(...d.fha.map((r) => r.perSecond));
  const worstMem = Math.max(...d.memory.rows.map((r) => r.perWorkerMB));
  const cap = capSummary(d.capacitor);
  return [
    { name: '1. settling, model start', target: `mean cycles per corner <= ${CYCLES_TARGET}`, figure: `${fix(model.meanCycles, 1)} (all ${model.corners} corners)`, ok: model.meanCycles <= CYCLES_TARGET },
    { name: '1. settling, stretch', target: `mean cycles per corner <= ${CYCLES_STRETCH}`, figure: fix(model.meanCycles, 1), ok: model.meanCycles <= CYCLES_STRETCH },
    { name: '1. settling, accuracy', target: 'model-start Vout within 0.2 % of the settled reference, every corner', figure: `max abs error ${pct(model.maxAbsError).replace('+', '')}${model.unverified ? `, ${model.unverified} unverified` : ''}`, ok: model.allWithin },
    { name: '2. regulation', target: `mean operating points per regulated corner (${demoKey}, model start) <= ${SIMS_TARGET}`, figure: `${fix(regModel.meanSimulations, 2)} (fha start ${fix(sum('fha', demoKey).meanSimulations, 2)})`, ok: regModel.meanSimulations <= SIMS_TARGET },
    { name: '3. engines', target: `median wall time per corner wasm / ngspice <= ${ENGINE_RATIO_TARGET}`, figure: fix(ratio, 2), ok: ratio <= ENGINE_RATIO_TARGET },
    { name: '4. FHA', target: `predictions/s >= ${FHA_RATE_TARGET}`, figure: `${minRate.toFixed(0)} (slowest list; ${(minRate / FHA_RATE_TARGET).toFixed(1)}x the target)`, ok: minRate >= FHA_RATE_TARGET },
    { name: '5. cache', target: 'second run: 0 simulations, cache hits = corners', figure: `${d.cache.secondSimulations} simulations, ${d.cache.secondCacheHits}/${d.cache.corners} hits, time ratio ${(d.cache.secondMs / d.cache.firstMs).toFixed(3)}`, ok: d.cache.secondSimulations === 0 && d.cache.secondCacheHits === d.cache.corners && d.cache.sameValues },
    { name: '7. output capacitor', target: `mean cycles per corner with 10 mF <= ${CAP_RATIO_TARGET}x those with 470 uF, every corner charge-balanced within ${pct(CAP_BALANCE_TARGET, 0).replace('+', '')}`,
      figure: `${fix(cap.large, 1)} / ${fix(cap.small, 1)} = ${fix(cap.ratio, 2)}x; worst balance ${pct(cap.worst).replace('+', '')}`, ok: cap.ratio <= CAP_RATIO_TARGET && cap.worst <= CAP_BALANCE_TARGET && cap.allSettled },
    ...(d.screening ? [{ name: '9. screening', target: '6000 sample-corners through FHA + the ideal model in <= 30 s on one core', figure: `${d.screening.seconds.toFixed(1)} s wall, ${d.screening.cpuSeconds.toFixed(1)} CPU s`, ok: d.screening.seconds <= 30 && d.screening.cpuSeconds <= 30 }] : []),
    ...(d.confirmed ? [{ name: '10. confirmed corners', target: `mean cycles per confirmed corner <= ${CYCLES_STRETCH}, every one proven settled`, figure: `${d.confirmed.meanCycles.toFixed(1)} (${d.confirmed.confirmed} corners, ${d.confirmed.settled} settled)`, ok: d.confirmed.meanCycles <= CYCLES_STRETCH && d.confirmed.settled === d.confirmed.confirmed }] : []),
    { name: '6. memory', target: `peak RSS per wasm worker <= ${MEMORY_TARGET_MB} MB`, figure: `${worstMem.toFixed(0)} MB (worst of ${d.memory.rows.map((r) => `${r.workers}`).join(' and ')} worker runs)`, ok: worstMem <= MEMORY_TARGET_MB },
  ];
}

export function renderResults(d: BenchData): string {
  const m = d.machine;
  const ts = targets(d);
  const model = (scope: string) => d.summaries.find((s) => s.method === 'model' && s.scope === scope)!;
  const ratios = S.engineRatios(d.engines);
  const missed = ts.filter((t) => !t.ok);
  const L: string[] = [
    '# tankcheck benchmark results', '',
    `Written by \`npm run bench\` (bench/run.ts) on ${d.date}, in one run of ${(d.totalS / 60).toFixed(1)} min. Every figure comes from ` +
      'that run; ratios compare measurements taken side by side in it. Repeat runs of the same job vary by about +-15 % on ' +
      'this kind of machine (measured during development: the same native run took 557-780 ms), so time ratios within about 20 % of a target are not decisive.', '',
    ...(d.changed.length ? [`**Source files changed while this bench ran** (it measured the code as loaded at its start): ${d.changed.join(', ')}. Run it again for figures of the current code.`, ''] : []),
    '## Machine', '',
    `- ${m.os}; ${m.cpu}, ${m.cpus} logical CPUs (availableParallelism ${m.parallelism}); memory ${m.totalMemMB} MB, ${m.freeMemMB} MB free at start; Node ${m.node}`,
    `- system engine (\`ngspice -v\`): ${m.ngspiceV.join(' / ')}; engine.version() = ${d.engines.ngspiceVersion}`,
    `- embedded engine: ${m.wasmPackage}, engine.version() = ${d.engines.wasmVersion}`,
    `- designs: ${d.designs.map((x) => `${x.file} (${x.corners} corners)`).join(', ')}`,
    `- CPU used by other processes during each phase (share of the machine, /proc/stat minus this process tree): ` +
      d.foreign.map((f) => `${f.phase} ${f.share === null ? '?' : `${(f.share * 100).toFixed(0)} %`}`).join(', ') +
      (d.foreign.some((f) => (f.share ?? 0) > 0.1) ? '. **The machine was shared** during part of the run: absolute times there are inflated and time ratios noisier than usual.' : '.'), '',
    '## Reproduce', '', '```sh',
    'apt-get install -y ngspice        # the system engine (Debian ngspice 39 here)',
    'npm ci',
    'npm run bench                     # = node --import tsx bench/run.ts; progress on stderr, writes bench/RESULTS.md',
    '```', '',
    '## Targets', '', '| case | target | figure | result |', '|---|---|---|---|',
    ...ts.map((t) => `| ${t.name} | ${t.target} | ${t.figure} | ${passFail(t.ok)} |`), '',
    ...(missed.length ? ['Missed: ' + missed.map((t) => t.name).join('; ') + '. The reasons are under each case and in "Why targets were missed".', ''] : []),
    `## 1. Settling (system engine ${d.settleEngine}, one corner at a time)`, '',
    'Each corner of both designs is simulated by `simulateCorner` with `seed` = `zero`, `fha` and `model` (the default), ' +
      'methods interleaved per corner. Cycles, runs and operating points are the corner\'s `sim.cycles`, `sim.runs` and ' +
      '`sim.simulations`. **Vout error** is each method\'s Vout against a settled reference run **at that method\'s own final ' +
      'switching frequency** (one reference per distinct frequency: fixed corners share one; a regulated corner has one per method).', '',
    ...S.methodTable(d.summaries, model), '',
    `Cycles per corner, min-max: ${(['zero', 'fha', 'model'] as const).map((m) => {
      const c = d.settle.filter((r) => r.method === m).map((r) => r.cycles);
      return `${m} ${Math.min(...c)}-${Math.max(...c)}`;
    }).join(', ')}. A start counts as settled when simulateSteady's check passes (charge balance and tank periodicity within 1 %, and ` +
      'the output within settleTolerance, 0.1 % by default, of its equilibrium by the charge balance and between the window halves); the Vout error column shows how close that stop is to the settled reference.', '',
    ...S.extraCyclesLines(d.settle), '',
    `The first run of every operating point is APPROACH_CYCLES = ${FIRST_RUN_CYCLES} cycles; when its last ${CHECK_CYCLES} cycles do not prove ` +
      `the steady state, the next run starts from the reduced-rank extrapolation of its cycle-boundary states and checks ${CHECK_CYCLES} cycles ` +
      '(src/run/steady.ts, src/periodic/).', '',
    `**Before and after.** Before the extrapolated restarts (bench run of 2026-12-02 10:09 UTC at commit 682f757: first runs of 3 x 6 cycles, ` +
      `12-cycle continuations), the 'model' start took a mean of ${BEFORE.meanCycles} cycles per corner (${BEFORE.range}) with a worst Vout error ` +
      `of ${pct(BEFORE.maxVoutError)}; now ${fix(model('all').meanCycles, 1)} cycles with ${pct(model('all').maxAbsError)}, ` +
      `${fix(BEFORE.meanCycles / model('all').meanCycles, 2)}x fewer.`, '',
    `Cost split of a 'model' corner (means over all corners): startPoint ${fix(model('all').meanStartMs, 0)} ms, inside the engine ` +
      `${fix(model('all').meanEngineMs, 0)} ms, median wall ${fix(model('all').medianWallMs, 0)} ms.`, '',
    '<details><summary>Every corner and start</summary>', '', ...S.settleTable(d.settle), '', '</details>', '',
    ...S.referenceTable(d.refs), '',
    `## 2. Regulation (${d.designs[0]!.key}, regulated corners)`, '',
    ...d.summaries.filter((s) => s.scope === d.designs[0]!.key).map((s) => `- ${s.method} start: mean ${fix(s.meanSimulations, 2)} operating points per corner, ${fix(s.meanRuns, 2)} runs, ${fix(s.meanCycles, 1)} cycles`), '',
    `The search stops once Vout is within AIM x REGULATION_TOLERANCE (${(REGULATION_TOLERANCE * 100).toFixed(1)} %) of output.voltage ` +
      '(src/run/regulate.ts; AIM is internal to that file). How far the first operating point of each start lands (simulated on its own, ' +
      'the way regulate() starts), and how many operating points the corner took in case 1:', '',
    ...S.firstPointTable(d.first, d.settle), '',
    '## 3. Engines (same designs, model start, one worker / one job each)', '',
    `Median over ${d.engines.rows.length} corners of the wall time per corner, wasm / system ngspice: **${fix(ratios.perCorner, 2)}**; per simulated cycle: ${fix(ratios.perCycle, 2)}. ` +
      `Each corner ran ${d.engines.rounds} times on each engine after a warm-up pass, alternating which engine goes first; the table gives medians. ` +
      `Start-up, timed apart and excluded above: wasm worker start (engine load) ${d.engines.wasmStartMs.toFixed(0)} ms; the warm-up pass over all corners took ` +
      `${d.engines.warmupWasmMs.toFixed(0)} ms on wasm (JIT warm-up included) and ${d.engines.warmupNgspiceMs.toFixed(0)} ms on ngspice. ` +
      'The engines are different ngspice versions, so a corner may settle in a different number of cycles; the per-cycle column allows for that.', '',
    ...S.engineTable(d.engines), '',
    '## 4. FHA predictions', '', ...S.fhaTable(d.fha, FHA_RATE_TARGET), '',
    `## 5. Cache (${d.cache.design}, runStudy twice with createFileCache in a fresh temp folder, system engine)`, '', ...S.cacheLines(d.cache), '',
    `## 6. Peak memory of the embedded engine (${d.memory.design}, runStudy, RSS sampled every 50 ms)`, '', ...S.memoryLines(d.memory), '',
    `## 7. Output capacitor: 470 uF against 10 mF (${d.capacitor.design}, system engine, model start, default settings)`, '',
    'Steady state needs the output capacitor charge-balanced (simulation.chargeBalanceTolerance) and the tank periodic, not only a steady Vout; ' +
      "the extrapolated restart skips the capacitor's charge with the other modes, and a capacitor too slow for it is brought to its equilibrium " +
      `by a shooting step (src/run/shooting.ts). Before the extrapolated restarts (bench of 2026-12-02 10:09 UTC, commit 682f757) the means were ` +
      `${BEFORE.cap470} cycles with 470 uF and ${BEFORE.cap10m} with 10 mF, worst balance ${pct(BEFORE.worstBalance)}. ` +
      'The extra corner is the demo at 340 V, 25 % load, fixed 80.51 kHz.', '',
    ...capLines(d.capacitor), '',
    ...(d.ideal ? ['## 8. The ideal column (demo and charger, cost per corner and agreement with the simulation, both engines)', '', ...idealLines(d.ideal), ''] : []),
    ...(d.screening ? [renderScreening(d.screening)] : []),
    ...(d.confirmed ? [renderConfirmed(d.confirmed, CYCLES_STRETCH), ''] : []),
    '## Cost drivers in the run path (informational)', '',
    ...S.saveCostLines(d.saveCost), '',
    '## Why targets were missed', '',
    ...(missed.length ? missed.map((t) => `- ${t.name}: ${t.figure} against ${t.target}. ${whyMissed(t.name, d)}`) : ['All targets met.']), '',
    '## Not measured', '',
    '- The default test suite\'s cost drivers: running the whole suite takes minutes and is not the bench\'s to run (each engineer runs only their own tests).', '',
  ];
  return L.join('\n');
}

function whyMissed(name: string, d: BenchData): string {
  if (name.endsWith('stretch')) return whyMissed('1. settling, model start', d);
  if (name === '1. settling, model start') {
    const extra = d.settle.filter((r) => r.method === 'model' && r.cycles > FIRST_RUN_CYCLES);
    return `Corners above ${FIRST_RUN_CYCLES} cycles: ${extra.map((r) => `${r.corner.id} (${r.cycles}: ${r.simulations} op. points, ${r.runs} runs)`).join('; ')}. ` +
      'A regulated corner whose first operating point misses output.voltage by more than the search aim needs a second one ' +
      `(another ${FIRST_RUN_CYCLES}+ cycles). With the model start that happened at: ` +
      (secondPoint(d).map((p) => `${p.cornerId} (first point Vout ${pct(p.error)})`).join(', ') || 'none') +
      `${signNote(secondPoint(d))}. A corner whose first run does not prove the steady state adds check runs of ${CHECK_CYCLES} cycles and more; ` +
      `here more than one check run was needed at ${extra.filter((r) => r.runs > r.simulations + 1).map((r) => `${r.corner.id} (${r.runs - r.simulations} check runs)`).join(', ') || 'no corner'} ` +
      '(compare the banded references: an output that keeps a small oscillation makes the window check pass or fail by chance, and the extrapolation fits that noise instead of a transient).';
  }
  if (name.startsWith('1. settling, accuracy')) return 'See the corners flagged ">0.2 %" or unverified in the table of case 1.';
  if (name.startsWith('3.')) {
    const r = S.engineRatios(d.engines);
    const near = r.perCorner <= ENGINE_RATIO_TARGET * 1.15;
    return `The two engines are different ngspice builds (45.2 compiled to WebAssembly against native 39); per simulated cycle the ratio is ${fix(r.perCycle, 2)}. ` +
      (near ? 'The miss is within the +-15 % run-to-run spread, so it is a near miss. ' : 'The miss is larger than the +-15 % run-to-run spread. ') +
      'Saving only the measured window cuts a wasm run more than a native one (see the cost drivers).';
  }
  if (name.startsWith('4.')) {
    const slow = d.fha.reduce((a, b) => (a.perSecond <= b.perSecond ? a : b));
    return `The slowest list (${slow.design}, ${slow.mode}) costs ${(1e6 / slow.perSecond).toFixed(1)} us per prediction. ` +
      (slow.mode === 'regulated' ? 'A regulated prediction adds the bisection for fs (fnForGain) to the closed-form stresses. ' : '') +
      'A rate near the target is within the timing noise of a shared machine (see the CPU use of other processes above).';
  }
  if (name.startsWith('10.') && d.confirmed) {
    return `${confirmedSplit(d.confirmed)} A corner whose first frequency misses the search's aim (0.4 %) takes a second one: ` +
      `its first run (${FIRST_RUN_CYCLES} cycles) only predicts the output and the second frequency needs a check run or two of ${CHECK_CYCLES} cycles. ` +
      'At the demo\'s 340 V full-load corner the simulated output at the ideal model\'s frequency is 0.56 % low (case 1 references), just ' +
      'outside the aim, and the low-line, full-load samples behave alike; the cause of that model-to-simulation gap is not isolated (the ' +
      'model\'s diode is VF + rd i, the deck\'s is exponential). Corners with one operating point and more than 11 cycles needed more than ' +
      'one check run: numerical ringing the extrapolation cannot skip (see case 1).';
  }
  return 'See the case above.';
}

/** First points of the model start at corners that needed more than one operating point. */
function secondPoint(d: BenchData): FirstPoint[] {
  const multi = new Set(d.settle.filter((r) => r.method === 'model' && r.simulations > 1).map((r) => `${r.design}|${r.corner.id}`));
  return d.first.filter((p) => p.method === 'model' && multi.has(`${p.design}|${p.cornerId}`));
}

/** Which way the model's first points erred, when they all erred the same way. */
function signNote(points: readonly FirstPoint[]): string {
  if (points.length === 0) return '';
  if (points.every((p) => p.error < 0)) return ' (the simulated Vout is lower: the time-domain model predicts too much gain there)';
  if (points.every((p) => p.error > 0)) return ' (the simulated Vout is higher: the time-domain model predicts too little gain there)';
  return '';
}
