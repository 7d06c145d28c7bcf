/**
 * Fully settled references: one long run from the model's periodic state at a given switching
 * frequency; Vout is the average of the last 20 cycles, and the run counts as settled when its last
 * REF_CHECK_WINDOWS 10-cycle windows (so also the last two) agree within REF_AGREEMENT. When they do not, the run is continued from its
 * final state for REF_EXTRA_CYCLES, saving the last 200: if the 10-cycle window averages there stay
 * within a band of +-REF_BAND_MAX (a persistent small oscillation of the output, seen at full load
 * above resonance), Vout is their mean and the reference is 'banded' with that half-width.
 */
import type { Corner } from '../src/corners/types.js';
import type { SimEngine } from '../src/engine/index.js';
import { mapPool } from '../src/engine/index.js';
import { predictCorner } from '../src/fha/predict.js';
import { startPoint } from '../src/plan/start.js';
import { buildDeck } from '../src/netlist/deck.js';
import { finalState, toWaveforms } from '../src/netlist/waveforms.js';
import { makeSpan, spanAverage } from '../src/measure/index.js';
import type { BenchDesign } from './settling.js';
import { log } from './util.js';

/** Cycles of one reference run. */
export const REF_CYCLES = 1500;
/** Relative agreement of the last 10-cycle windows that confirms a settled reference. */
export const REF_AGREEMENT = 1e-5;
/** How many of the last 10-cycle windows must agree within REF_AGREEMENT (max - min). */
export const REF_CHECK_WINDOWS = 4;
/** Cycles of the continuation of a reference that did not settle, and the cycles it saves. */
export const REF_EXTRA_CYCLES = 500;
const REF_EXTRA_SAVED = 200;
/** Largest half-width (relative) of the 10-cycle window band for a usable 'banded' reference: a quarter of the 0.2 % target. */
export const REF_BAND_MAX = 5e-4;

export interface RefRequest {
  key: string;
  design: BenchDesign;
  corner: Corner;
  fs: number;
}

export interface Reference {
  key: string;
  fs: number;
  vout: number;
  /** |w2 - w1| / |w2| of the last two 10-cycle window averages. */
  windowDiff: number;
  cycles: number;
  /** 'settled' (last windows within REF_AGREEMENT), 'banded' (persistent oscillation within +-band), 'unsettled'. */
  state: 'settled' | 'banded' | 'unsettled' | 'failed';
  /** Half-width of the 10-cycle window averages relative to Vout (0 when settled). */
  band: number;
  failure?: string;
  wallMs: number;
}

/** Key of a reference: design, corner and the frequency to 9 significant digits. */
export function refKey(design: string, cornerId: string, fs: number): string {
  return `${design}|${cornerId}|${fs.toPrecision(9)}`;
}

export async function settledReference(engine: SimEngine, req: RefRequest): Promise<Reference> {
  const { design } = req.design;
  const fs = req.fs;
  const T = 1 / fs;
  const fixed: Corner = { ...req.corner, fs };
  let seed = startPoint(design, fixed, predictCorner(design, fixed), 'model').seed;
  const t0 = performance.now();
  let cycles = 0;
  for (let pass = 0; pass < 2; pass++) {
    const n = pass === 0 ? REF_CYCLES : REF_EXTRA_CYCLES;
    const saved = pass === 0 ? REF_CHECK_WINDOWS * 10 : REF_EXTRA_SAVED;
    const deck = buildDeck({ design, corner: fixed, fs, seed, cycles: n, saveCycles: saved });
    const res = await engine.run({ id: `ref-${req.corner.id}`, deck: deck.text, timeoutMs: 900_000 });
    cycles += n;
    const base = { key: req.key, fs, cycles };
    if (!res.ok) {
      return { ...base, vout: NaN, windowDiff: NaN, state: 'failed', band: NaN, wallMs: performance.now() - t0,
        failure: `${res.failure?.kind}: ${res.failure?.message}` };
    }
    const w = toWaveforms(design, fixed, fs, res.vectors);
    const avg = (a: number, b: number) => spanAverage(makeSpan(w.t, Math.max(a, w.t[0]!), b), w.vout);
    const wins = Array.from({ length: saved / 10 }, (_, k) => avg(deck.tstop - (saved - 10 * k) * T, deck.tstop - (saved - 10 * k - 10) * T));
    const [w1, w2] = wins.slice(-2) as [number, number];
    const windowDiff = Math.abs(w2 - w1) / Math.abs(w2);
    const spread = (xs: number[]) => (Math.max(...xs) - Math.min(...xs)) / Math.abs(xs[xs.length - 1]!);
    // settled: the last REF_CHECK_WINDOWS windows all agree (two alone can agree by chance inside an oscillation)
    if (spread(wins.slice(-REF_CHECK_WINDOWS)) <= REF_AGREEMENT) {
      return { ...base, vout: avg(deck.tstop - 20 * T, deck.tstop), windowDiff, state: 'settled', band: 0, wallMs: performance.now() - t0 };
    }
    if (pass === 1) {
      const vout = wins.reduce((a, b) => a + b, 0) / wins.length;
      const band = (Math.max(...wins) - Math.min(...wins)) / 2 / Math.abs(vout);
      return { ...base, vout, windowDiff, state: band <= REF_BAND_MAX ? 'banded' : 'unsettled', band, wallMs: performance.now() - t0 };
    }
    seed = finalState(w, res.vectors);
  }
  throw new Error('unreachable');
}

/** All references, two at a time (their wall time is not a figure of the bench). */
export async function runReferences(engine: SimEngine, reqs: readonly RefRequest[]): Promise<Map<string, Reference>> {
  const out = new Map<string, Reference>();
  let done = 0;
  await mapPool(reqs, 2, async (req) => {
    const r = await settledReference(engine, req);
    out.set(req.key, r);
    done += 1;
    log(`reference ${done}/${reqs.length} ${req.design.key} ${req.corner.id} at ${(req.fs / 1e3).toFixed(3)} kHz: ` +
      `Vout ${r.vout.toFixed(5)} V, last windows differ ${r.windowDiff.toExponential(1)}, ${r.state}${r.state === 'banded' ? ` +-${(r.band * 100).toFixed(4)} %` : ''}` +
      `${r.failure ? ` (${r.failure})` : ''}, ${r.cycles} cycles, ${(r.wallMs / 1000).toFixed(1)} s`);
  });
  return out;
}
