/** Markdown tables of the six cases (RESULTS.md body). */
import { extraCyclesReason, FIRST_RUN_CYCLES, VOUT_TARGET, type MethodSummary, type ScoredRow } from './analyze.js';
import { REF_AGREEMENT, REF_BAND_MAX, REF_CHECK_WINDOWS, REF_CYCLES, REF_EXTRA_CYCLES, type Reference } from './reference.js';
import type { EngineCase } from './engines.js';
import type { FhaRate } from './fha.js';
import type { CaseCache } from './cache.js';
import type { MemoryCase } from './memory.js';
import type { FirstPoint } from './settling.js';
import type { SaveCost } from './costs.js';
import { fix, median, pct } from './util.js';
import { APPROACH_CYCLES, CHECK_CYCLES } from '../src/run/steady.js';

const kHz = (fs: number | null | undefined) => fix(fs === null || fs === undefined ? null : fs / 1e3, 3);

export function settleTable(rows: readonly ScoredRow[]): string[] {
  const out = [
    '| design | corner | start | status | cycles | runs | op. points | final fs (kHz) | Vout (V) | reference Vout (V) | error | wall (ms) | engine (ms) |',
    '|---|---|---|---|--:|--:|--:|--:|--:|--:|--:|--:|--:|',
  ];
  for (const r of rows) {
    const band = r.ref?.state === 'banded' ? ` +-${(r.ref.band * 100).toFixed(3)}` : '';
    const flag = r.error !== null && Math.abs(r.error) + (r.ref?.band ?? 0) > VOUT_TARGET ? ' **>0.2 %**' : '';
    out.push(`| ${r.design} | ${r.corner.id} | ${r.method} | ${r.status}${r.failure ? ` (${r.failure})` : ''} | ${r.cycles} | ${r.runs} | ${r.simulations} | ` +
      `${kHz(r.fs)} | ${fix(r.vout, 5)} | ${fix(r.ref?.vout, 5)} | ${pct(r.error)}${band}${flag} | ${r.wallMs.toFixed(0)} | ${r.engineMs.toFixed(0)} |`);
  }
  return out;
}

export function methodTable(sums: readonly MethodSummary[], model: (scope: string) => MethodSummary): string[] {
  const out = [
    '| start | scope | corners | mean cycles | cycles / model | mean runs | mean op. points | max abs Vout error | all within 0.2 % | wall, sum (ms) | wall / model | median wall per corner (ms) |',
    '|---|---|--:|--:|--:|--:|--:|--:|---|--:|--:|--:|',
  ];
  for (const s of sums) {
    const m = model(s.scope);
    out.push(`| ${s.method} | ${s.scope} | ${s.corners} | ${fix(s.meanCycles, 1)} | ${fix(s.meanCycles / m.meanCycles, 2)} | ${fix(s.meanRuns, 2)} | ` +
      `${fix(s.meanSimulations, 2)} | ${pct(s.maxAbsError).replace('+', '')} | ${s.allWithin ? 'yes' : `no${s.unverified ? ` (${s.unverified} unverified)` : ''}`} | ` +
      `${s.totalWallMs.toFixed(0)} | ${fix(s.totalWallMs / m.totalWallMs, 2)} | ${s.medianWallMs.toFixed(0)} |`);
  }
  return out;
}

export function referenceTable(refs: readonly Reference[]): string[] {
  const out = [
    `References: one run of ${REF_CYCLES} cycles from the time-domain model's periodic state at the listed frequency; ` +
      `Vout = average of the last 20 cycles; **settled** when the last ${REF_CHECK_WINDOWS} 10-cycle window averages (the last two among them) ` +
      `agree within ${REF_AGREEMENT.toExponential(0)} (max - min, relative). ` +
      `Otherwise the run goes on from its final state for ${REF_EXTRA_CYCLES} cycles: when its last twenty 10-cycle window averages stay ` +
      `within +-${(REF_BAND_MAX * 100).toFixed(2)} % of their mean (a persistent small oscillation of the output), the reference is **banded**: ` +
      'Vout = that mean, and the half-width of the band is added to the error before the 0.2 % check.',
    '',
    '| reference (design, corner, fs) | Vout (V) | last two windows differ | band (half-width) | cycles | state |',
    '|---|--:|--:|--:|--:|---|',
  ];
  for (const r of refs) {
    const state = r.state === 'settled' || r.state === 'banded' ? r.state : `**${r.state}**${r.failure ? ` (${r.failure})` : ''}`;
    out.push(`| ${r.key.replace(/\|/g, ', ')} Hz | ${fix(r.vout, 6)} | ${r.windowDiff.toExponential(1)} | ${r.band ? pct(r.band, 4).slice(1) : '-'} | ${r.cycles} | ${state} |`);
  }
  return out;
}

export function extraCyclesLines(rows: readonly ScoredRow[]): string[] {
  const extra = rows.filter((r) => r.method === 'model' && r.cycles > FIRST_RUN_CYCLES);
  if (extra.length === 0) return [`Every 'model' corner finished in its first run of ${FIRST_RUN_CYCLES} cycles.`];
  return [`'model' corners that needed more than one first run of ${FIRST_RUN_CYCLES} cycles:`, '',
    ...extra.map((r) => `- ${r.design} ${r.corner.id}: ${r.cycles} cycles = ${extraCyclesReason(r)}`)];
}

export function engineTable(e: EngineCase): string[] {
  const out = [
    `| design | corner | ngspice (ms) | wasm (ms) | wasm / ngspice (median of ${e.rounds} rounds) | cycles ngspice / wasm | wasm / ngspice per cycle | Vout wasm vs ngspice |`,
    '|---|---|--:|--:|--:|--:|--:|--:|',
  ];
  for (const r of e.rows) {
    const dv = r.ngspiceVout && r.wasmVout ? (r.wasmVout - r.ngspiceVout) / r.ngspiceVout : null;
    out.push(`| ${r.design} | ${r.cornerId} | ${r.ngspiceMs.toFixed(0)} | ${r.wasmMs.toFixed(0)} | ${r.ratio.toFixed(2)} | ` +
      `${r.ngspiceCycles} / ${r.wasmCycles} | ${perCycle(r).toFixed(2)} | ${pct(dv)} |`);
  }
  return out;
}

const perCycle = (r: EngineCase['rows'][number]) => (r.wasmMs / r.wasmCycles) / (r.ngspiceMs / r.ngspiceCycles);

export function engineRatios(e: EngineCase): { perCorner: number; perCycle: number } {
  return { perCorner: median(e.rows.map((r) => r.ratio)), perCycle: median(e.rows.map(perCycle)) };
}

export function fhaTable(rates: readonly FhaRate[], target: number): string[] {
  return ['| corner list | mode | corners (FHA unreachable) | predictions/s (median of passes) | / target |', '|---|---|--:|--:|--:|',
    ...rates.map((r) => `| ${r.design}, 20 vin x 20 loads x 9 tolerance sets${r.mode === 'fixed fs' ? ' x 2 fs' : ''} | ${r.mode} | ` +
      `${r.corners} (${r.unreachable}) | ${r.perSecond.toFixed(0)} | ${(r.perSecond / target).toFixed(2)} |`)];
}

export function cacheLines(c: CaseCache): string[] {
  return ['| run | wall (ms) | simulations | cache hits |', '|---|--:|--:|--:|',
    `| first (empty cache) | ${c.firstMs.toFixed(0)} | ${c.firstSimulations} | 0 |`,
    `| second | ${c.secondMs.toFixed(0)} | ${c.secondSimulations} | ${c.secondCacheHits} |`, '',
    `Second / first wall time: **${(c.secondMs / c.firstMs).toFixed(3)}**. Corners ${c.corners}, jobs ${c.jobs}. ` +
      `Simulated values identical in both runs: ${c.sameValues ? 'yes' : '**no**'}. ` +
      `Per corner, the second run computes the start point (FHA + time-domain model; median ${c.startMedianMs.toFixed(1)} ms) and the key ` +
      `(deck + SHA-256; median ${c.keyMedianMs.toFixed(1)} ms), then reads the entry.`];
}

export function memoryLines(m: MemoryCase): string[] {
  return ['| wasm workers (= jobs) | RSS before (MB) | peak RSS (MB) | (peak - before) / workers (MB) | study wall (ms) |', '|--:|--:|--:|--:|--:|',
    ...m.rows.map((r) => `| ${r.workers} | ${r.preMB.toFixed(0)} | ${r.peakMB.toFixed(0)} | ${r.perWorkerMB.toFixed(0)} | ${r.wallMs.toFixed(0)} |`),
    '', 'Each row runs in a fresh child process (bench/memory-child.ts), so no earlier run is in the baseline. ' +
      `Failed corners: ${m.rows.map((r) => r.failed).join(' / ')}.` +
      (m.rows.length > 1 ? ` Study wall time, 2 workers / 1 worker: ${(m.rows[1]!.wallMs / m.rows[0]!.wallMs).toFixed(2)} (worker start included; on a 2-vCPU virtual machine two CPU-bound processes each run at about half speed, so little parallel speed-up shows).` : ''),
    ...(m.skipped ? ['', `2-worker run skipped: ${m.skipped}.`] : [])];
}

export function firstPointTable(ps: readonly FirstPoint[], rows: readonly ScoredRow[]): string[] {
  const sims = (p: FirstPoint) => rows.find((r) => r.design === p.design && r.corner.id === p.cornerId && r.method === p.method)?.simulations;
  return ['| corner | start | first fs (kHz) | first-point Vout (V) | from output.voltage | operating points in case 1 |', '|---|---|--:|--:|--:|--:|',
    ...ps.map((p) => `| ${p.cornerId} | ${p.method} | ${kHz(p.fs)} | ${fix(p.vout, 4)} | ${pct(p.error)} | ${sims(p) ?? '-'} |`)];
}

export function saveCostLines(cs: readonly SaveCost[]): string[] {
  if (cs.length === 0) return ['(not measured)'];
  const c0 = cs[0]!;
  return [
    `simulateSteady saves all vectors for every cycle of a run: the last ${CHECK_CYCLES}-cycle window is measured, and the state at every ` +
      `cycle boundary feeds the extrapolation. The same ${APPROACH_CYCLES}-cycle deck (${c0.cornerId}, model start; the first run of an operating point), ` +
      `median of ${c0.reps} alternating runs per variant:`, '',
    `| engine | saving all ${APPROACH_CYCLES} cycles (ms) | saving the last ${CHECK_CYCLES} (ms) | last ${CHECK_CYCLES} / all |`, '|---|--:|--:|--:|',
    ...cs.map((c) => `| ${c.engine} | ${c.saveAllMs.toFixed(0)} | ${c.saveWindowMs.toFixed(0)} | ${(c.saveWindowMs / c.saveAllMs).toFixed(2)} |`),
  ];
}
