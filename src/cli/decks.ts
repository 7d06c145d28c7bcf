import { mkdir } from 'node:fs/promises';
import type { Design } from '../design/types.js';
import { expandCorners, filterCorners } from '../corners/expand.js';
import { predictCorner } from '../fha/predict.js';
import { buildDeck } from '../netlist/deck.js';
import { startPoint } from '../plan/start.js';
import { withHandMeasurements } from '../netlist/hand.js';
import { csvField } from '../report/csv.js';
import { insideDir, writeFilesAtomic } from '../run/files.js';

/** Cycles in a deck written for hand runs, and the window its .meas cards average over. */
export const HAND_CYCLES = 100;
export const HAND_WINDOW = 10;

/**
 * Write one hand-runnable deck per corner (`<id>.cir`) and `index.csv`. Each deck starts from the
 * time-domain model's periodic state; regulated corners run at the model's frequency for
 * output.voltage (tankcheck run then confirms it in simulation), or FHA's when the model has none.
 */
export async function writeDecks(design: Design, dir: string, only?: string): Promise<number> {
  const corners = filterCorners(expandCorners(design), only);
  const files: { path: string; text: string }[] = [];
  const index = [['corner', 'vin_V', 'load_ohm', 'fs_Hz', 'fs_source', 'lr_H', 'cr_F', 'lm_H', 'turns_ratio', 'fha_vout_V', 'fha_gain', 'deck'].join(',')];
  for (const c of corners) {
    const fha = predictCorner(design, c);
    const start = startPoint(design, c, fha);
    const fs = start.fs;
    const source = c.fs !== null ? 'fixed' : start.source === 'model' ? 'model-regulated' : fha.fs !== null ? 'fha-regulated' : 'zero-phase-boundary';
    const deck = buildDeck({ design, corner: c, fs, seed: start.seed, cycles: HAND_CYCLES, saveCycles: HAND_WINDOW });
    const name = `${c.id}.cir`;
    files.push({ path: insideDir(dir, name), text: withHandMeasurements(deck, HAND_WINDOW) });
    index.push([c.id, c.vin, c.load, fs, source, c.lr, c.cr, c.lm, c.turnsRatio, fha.vout, fha.gain, name].map(csvField).join(','));
  }
  files.push({ path: insideDir(dir, 'index.csv'), text: `${index.join('\r\n')}\r\n` });
  await mkdir(dir, { recursive: true });
  await writeFilesAtomic(files);
  return corners.length;
}
