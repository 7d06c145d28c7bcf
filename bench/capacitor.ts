/**
 * Case 7: settling cost of a large output capacitor. Every demo corner, plus the demo's 340 V / 25 %
 * corner at a fixed 80.51 kHz, is simulated with the demo's 470 uF and with 10 mF (system engine, model
 * start, default settings). Steady state needs charge balance, so without the shooting step the
 * 10 mF corners would wait out Co (ESR + Rth || RL), hundreds of cycles.
 */
import type { Design } from '../src/design/types.js';
import type { SimEngine } from '../src/engine/index.js';
import { expandCorners } from '../src/corners/expand.js';
import { predictCorner } from '../src/fha/predict.js';
import { simulateCorner } from '../src/run/corner.js';
import type { BenchDesign } from './settling.js';
import { fix, log, mean, pct } from './util.js';

export const CAPACITANCES = [470e-6, 10e-3] as const;
/** Target: the 10 mF corners take at most this many times the cycles of the 470 uF ones. */
export const CAP_RATIO_TARGET = 2;
/** Target: every corner's final charge balance within this share of Io. */
export const CAP_BALANCE_TARGET = 0.01;

export interface CapRow {
  co: number;
  cornerId: string;
  status: string;
  cycles: number;
  runs: number;
  simulations: number;
  chargeBalance: number;
  periodicity: number;
  diodeCurrentAvg: number;
  iout: number;
}

export interface CapCase {
  design: string;
  rows: CapRow[];
}

function variants(d: Design): Design[] {
  const fixed: Design = { ...d, operating: { ...d.operating, vin: [340], load: [{ kind: 'percent', value: 0.25 }], frequency: [80.51e3] } };
  return [d, fixed];
}

export async function measureCapacitors(bd: BenchDesign, engine: SimEngine): Promise<CapCase> {
  const rows: CapRow[] = [];
  for (const base of variants(bd.design)) {
    for (const corner of expandCorners(base)) {
      for (const co of CAPACITANCES) {
        const design = { ...base, output: { ...base.output, capacitance: co } };
        const out = await simulateCorner(engine, design, corner, predictCorner(design, corner));
        const s = out.result.sim;
        const row: CapRow = { co, cornerId: corner.id, status: out.result.status, cycles: s?.cycles ?? NaN, runs: s?.runs ?? NaN,
          simulations: s?.simulations ?? NaN, chargeBalance: s?.chargeBalanceError ?? NaN, periodicity: s?.periodicityError ?? NaN,
          diodeCurrentAvg: s?.diodeCurrentAvg ?? NaN, iout: s?.iout ?? NaN };
        rows.push(row);
        log(`capacitor ${corner.id} Co ${co * 1e6} uF: ${row.status}, ${row.cycles} cycles, ${row.runs} runs, charge balance ${pct(row.chargeBalance)}`);
      }
    }
  }
  return { design: bd.key, rows };
}

/** Mean cycles per corner at each capacitance, their ratio and the worst final charge balance. */
export function capSummary(c: CapCase) {
  const at = (co: number) => c.rows.filter((r) => r.co === co);
  const small = mean(at(CAPACITANCES[0]).map((r) => r.cycles));
  const large = mean(at(CAPACITANCES[1]).map((r) => r.cycles));
  const worst = Math.max(...c.rows.map((r) => Math.abs(r.chargeBalance)));
  return { small, large, ratio: large / small, worst, allSettled: c.rows.every((r) => r.status !== 'not-settled' && r.status !== 'failed') };
}

export function capLines(c: CapCase): string[] {
  const s = capSummary(c);
  return [
    `Mean cycles per corner: ${fix(s.small, 1)} with 470 uF, ${fix(s.large, 1)} with 10 mF (ratio ${fix(s.ratio, 2)}); ` +
      `worst final charge balance ${pct(s.worst)} of Io; every corner settled: ${s.allSettled ? 'yes' : 'no'}.`, '',
    '| corner | Co | status | cycles | runs | op. points | charge balance | periodicity | diode avg (A) | Io / 2 (A) |',
    '|---|---|---|--:|--:|--:|--:|--:|--:|--:|',
    ...c.rows.map((r) => `| ${r.cornerId} | ${r.co >= 1e-3 ? `${r.co * 1e3} mF` : `${Math.round(r.co * 1e6)} uF`} | ${r.status} | ${r.cycles} | ${r.runs} | ${r.simulations} | ` +
      `${pct(r.chargeBalance)} | ${pct(r.periodicity)} | ${fix(r.diodeCurrentAvg, 4)} | ${fix(r.iout / 2, 4)} |`),
  ];
}
