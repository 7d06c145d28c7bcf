import { mkdir } from 'node:fs/promises';
import type { Design } from '../design/types.js';
import { buildDeck } from '../netlist/deck.js';
import { planStudy, type PlanItem, type StudyPlan } from '../plan/plan.js';
import { shardItems, type ShardSpec } from '../plan/shard.js';
import { withHandMeasurements } from '../netlist/hand.js';
import { renderCsv } from '../report/csv.js';
import { insideDir, writeFilesAtomic } from '../run/files.js';

/** Cycles in a deck written for hand runs, and the window its .meas cards average over. */
export const HAND_CYCLES = 100;
export const HAND_WINDOW = 10;

/** The hand-run deck of one plan item (simulated items only: a screened one has no start point). */
export function handDeck(design: Design, it: PlanItem): string {
  const start = it.start!;
  return withHandMeasurements(buildDeck({ design, corner: it.corner, fs: start.fs, seed: start.seed, cycles: HAND_CYCLES, saveCycles: HAND_WINDOW }), HAND_WINDOW);
}

/**
 * Write one hand-runnable deck per simulated item of the plan (`<id>.cir`; with a shard, that
 * shard's items) and `index.csv`. Each deck starts from the plan's start point: the time-domain
 * model's periodic state; regulated corners run at the model's frequency for output.voltage
 * (tankcheck run then confirms it in simulation), or FHA's when the model has none. Decks are
 * written one at a time (each atomically), so a large plan is never held in memory; index.csv last.
 */
export async function writeDecks(design: Design, dir: string, only?: string, shard?: ShardSpec, plan: StudyPlan = planStudy(design, { only })): Promise<number> {
  const chosen = shard ? shardItems(plan.items.map((it) => it.cost), shard).map((i) => plan.items[i]!) : plan.items;
  const index = [['corner', 'vin_V', 'load_ohm', 'fs_Hz', 'fs_source', 'lr_H', 'cr_F', 'lm_H', 'turns_ratio', 'fha_vout_V', 'fha_gain', 'deck']] as unknown[][];
  await mkdir(dir, { recursive: true });
  let n = 0;
  for (const it of chosen.filter((x) => x.simulate)) {
    const { corner: c, fha, start } = it;
    const source = c.fs !== null ? 'fixed' : start!.source === 'model' ? 'model-regulated' : fha.fs !== null ? 'fha-regulated' : 'zero-phase-boundary';
    const name = `${c.id}.cir`;
    await writeFilesAtomic([{ path: insideDir(dir, name), text: handDeck(design, it) }]);
    index.push([c.id, c.vin, c.load, start!.fs, source, c.lr, c.cr, c.lm, c.turnsRatio, fha.vout, fha.gain, name]);
    n++;
  }
  await writeFilesAtomic([{ path: insideDir(dir, 'index.csv'), text: renderCsv(index) }]);
  return n;
}
