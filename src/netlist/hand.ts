import type { Deck } from './deck.js';
import { spiceNumber } from './render.js';

/**
 * Make a deck runnable by hand with `ngspice -b deck.cir`: batch mode needs an output request, so
 * add `.meas` cards over the last `windowCycles` cycles (average output voltage, tank current RMS
 * and peak, Cr voltage extremes). tankcheck itself measures from the saved vectors instead.
 */
export function withHandMeasurements(deck: Deck, windowCycles: number): string {
  const from = spiceNumber(deck.tstop - windowCycles * deck.period);
  const to = spiceNumber(deck.tstop);
  const span = `from=${from} to=${to}`;
  const cards = [
    `* measurements for hand runs, over the last ${windowCycles} switching cycles`,
    `.meas tran vout_avg avg v(out) ${span}`,
    `.meas tran vout_pp pp v(out) ${span}`,
    `.meas tran tank_rms rms i(vlr) ${span}`,
    `.meas tran tank_max max i(vlr) ${span}`,
    `.meas tran tank_min min i(vlr) ${span}`,
    `.meas tran vcr_max max v(t2,t3) ${span}`,
    `.meas tran vcr_min min v(t2,t3) ${span}`,
  ].join('\n');
  return deck.text.replace(/^\.tran /m, `${cards}\n.tran `);
}
