import type { Deck } from './deck.js';
import { checkDeckExpressions, paramLines } from './params.js';

/** Node the hand-run deck gives the Cr voltage, v(t2) - v(t3), so that `.meas` can read it. */
export const HAND_CR_NODE = 'vcr_meas';

/**
 * Make a deck runnable by hand with `ngspice -b deck.cir`: batch mode needs an output request, so
 * add `.meas` cards over the last `windowCycles` cycles (average output voltage, tank current RMS
 * and peak, Cr voltage extremes, and the gate and tank-current periods, which follow `fs`). The
 * windows are expressions over the deck's parameters. tankcheck itself measures from the saved
 * vectors instead.
 *
 * The Cr voltage is the difference of two saved nodes; `.meas` reads only saved vectors (`v(t2,t3)`
 * is not one, and an expression's helper node is not saved by the wasm build), so a unity-gain
 * voltage source copies it onto its own saved node. It draws no current from the tank.
 */
export function withHandMeasurements(deck: Deck, windowCycles: number): string {
  const span = 'from={tstop-mcycles*period} to={tstop}';
  const after = 'td={tstop-mcycles*period}';
  const cards = [
    `* measurements for hand runs (ngspice -b), over the last mcycles switching cycles`,
    paramLines([['mcycles', windowCycles]], new Set()),
    `E${HAND_CR_NODE} ${HAND_CR_NODE} 0 t2 t3 1`,
    `.meas tran vout_avg avg v(out) ${span}`,
    `.meas tran vout_pp pp v(out) ${span}`,
    `.meas tran tank_rms rms i(vlr) ${span}`,
    `.meas tran tank_max max i(vlr) ${span}`,
    `.meas tran tank_min min i(vlr) ${span}`,
    `.meas tran vcr_max max v(${HAND_CR_NODE}) ${span}`,
    `.meas tran vcr_min min v(${HAND_CR_NODE}) ${span}`,
    `.meas tran gate_period trig v(g1) val=0.5 ${after} rise=1 targ v(g1) val=0.5 ${after} rise=2`,
    `.meas tran tank_period trig i(vlr) val=0 ${after} rise=1 targ i(vlr) val=0 ${after} rise=2`,
  ].join('\n');
  const text = deck.text
    .replace(/^(\.save .*)$/m, `$1 v(${HAND_CR_NODE})`)
    .replace(/^\.tran /m, `${cards}\n.tran `);
  checkDeckExpressions(text);
  return text;
}
