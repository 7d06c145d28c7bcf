/**
 * One shooting step on the slow state of the converter: the output capacitor voltage. The tank
 * settles within tens of cycles, but the output capacitor approaches its equilibrium with the time
 * constant Co (ESR + Rth || RL), hundreds of cycles with a large capacitor. Waiting that out is
 * what a plain transient run does. Instead, one window of whole cycles gives the capacitor's
 * average current; with the output resistance seen by the capacitor, the equilibrium voltage
 * follows at once, and the next run starts from it: a Newton step on the periodic-steady-state
 * condition "capacitor charge balanced over a cycle" (T. J. Aprille, T. N. Trick, "Steady-state
 * analysis of nonlinear circuits with periodic inputs", Proc. IEEE, vol. 60, no. 1, pp. 108-114,
 * 1972, applied here to the one slow state only). When two windows at different voltages exist, the
 * resistance is their secant slope instead of a model estimate.
 */
import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { predictCorner } from '../fha/predict.js';
import { solveSteadyState } from '../tdmodel/index.js';
import type { DeckSeed } from '../netlist/types.js';
import { modelParams } from '../ideal/params.js';

/** Averages of one window: output capacitor voltage, V, and capacitor current, A. */
export interface SlowPoint {
  vco: number;
  icap: number;
}

/**
 * Equilibrium capacitor voltage predicted from one window, V. Near the equilibrium V* the
 * capacitor current is linear in its voltage, i = (V* - v) / R; averaged over the window that is
 * avg(i) = (V* - avg(v)) / R, so V* = avg(v) + R avg(i) exactly for a linear source, whatever the
 * window length. `r` is the resistance the capacitor sees (ESR + Rth || RL), ohm.
 */
export function equilibriumVoltage(p: SlowPoint, r: number): number {
  return p.vco + r * p.icap;
}

/** Resistance seen by the capacitor from two windows at different voltages, ohm; null when not positive and finite. */
export function secantResistance(a: SlowPoint, b: SlowPoint): number | null {
  const r = -(b.vco - a.vco) / (b.icap - a.icap);
  return Number.isFinite(r) && r > 0 ? r : null;
}

/** Change of the tank state at t = 0 per ampere of rectifier output current, along the slow manifold (A/A, V/A). */
export interface SlowDirection {
  ir: number;
  im: number;
  vcr: number;
}

/** The slow mode of one operating point: the resistance the capacitor sees and the tank's drift with it. */
export interface SlowMode {
  /** ESR + Rth || RL, ohm. */
  r: number;
  /** Tank state change per ampere of rectifier output current at a fixed frequency (zero when unknown). */
  direction: SlowDirection;
}

/**
 * Slow mode of the converter at this operating point, from the ideal time-domain model solved at
 * two loads 1 % apart: the output resistance Rth = -dVo/dIo, and how the tank's periodic state moves
 * with the current it delivers. The tank's periodic state depends on the clamped output voltage, not
 * on the load, so the two solutions are two points of the quasi-static curve the tank follows while
 * the output capacitor charges. Moving the tank state with the restart keeps it consistent: behind a
 * stiff output (small Rth) the tank state moves a lot per volt, and a capacitor voltage set alone
 * starts a new tank transient. The move is taken per ampere, not per volt: the current change is
 * measured in the simulation, while the model's Rth may be off (its diode is VF + rd i, the deck's
 * is exponential). FHA's Rth and no tank move where the model fails.
 */
export function slowMode(design: Design, corner: Corner, fs: number): SlowMode {
  const rl = corner.load;
  const par = (rth: number) => (Number.isFinite(rth) && rth > 0 ? (rth * rl) / (rth + rl) : rl);
  try {
    const p = modelParams(design, corner, fs);
    const a = solveSteadyState(p, rl);
    const b = solveSteadyState(p, rl * 1.01, { guess: a.seed, voGuess: a.vo });
    const di = b.vo / (rl * 1.01) - a.vo / rl;
    const rth = -(b.vo - a.vo) / di;
    if (!(Number.isFinite(rth) && rth > 0)) throw new Error('no slope');
    const direction = { ir: (b.seed.ir - a.seed.ir) / di, im: (b.seed.im - a.seed.im) / di, vcr: (b.seed.vcr - a.seed.vcr) / di };
    return { r: design.output.esr + par(rth), direction };
  } catch {
    const vo = (r: number) => predictCorner(design, { ...corner, fs, load: r }).vout ?? 0;
    const v1 = vo(rl);
    const v2 = vo(rl * 1.01);
    const rth = -(v2 - v1) / (v2 / (rl * 1.01) - v1 / rl);
    return { r: design.output.esr + par(rth), direction: { ir: 0, im: 0, vcr: 0 } };
  }
}

/**
 * The restart state of a shooting step from the window point p and its predicted equilibrium vEq:
 * the capacitor at vEq, the tank state moved along the slow direction by the rectifier current
 * change that equilibrium needs, (vEq - p.vco) / RL - p.icap (at equilibrium the rectifier delivers
 * exactly the load current; now it delivers the load current plus p.icap).
 */
export function shootState(state: DeckSeed, p: SlowPoint, vEq: number, load: number, d: SlowDirection): DeckSeed {
  const di = (vEq - p.vco) / load - p.icap;
  return { ...state, vo: vEq, ir: state.ir + d.ir * di, im: state.im + d.im * di, vcr: state.vcr + d.vcr * di };
}
