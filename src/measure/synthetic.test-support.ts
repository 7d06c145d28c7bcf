/**
 * TEST-ONLY generators of synthetic LLC waveform sets with known answers (no simulator).
 * Time origin: the bridge applies +Vin_eff from t = k Ts to k Ts + Ts/2 (middle of the dead time).
 * Gates: high side (HB high, FB S1/S4) crosses 0.5 upward at k Ts + td/2 and downward at
 * k Ts + Ts/2 - td/2; the other group half a period later. Every quantity has half-wave symmetry,
 * f(t + Ts/2) = -f(t), built from a model of the first half period.
 *
 * Plumbing only, not a check of the physics: the generator builds in Vo = Vin_eff / n, a diode
 * blocking voltage of 2 Vo and the half-sine shapes, so measurements of these sets can only show
 * that measure() computes what it says from the waveforms it is given. The physics of simulated
 * numbers is checked against independent decks in tests/sim/reference.engine.test.ts.
 */
import type { Inverter, Rectifier } from '../design/types.js';
import type { SwitchTrace, Waveforms } from './types.js';

/** Primary-referred quantities over the first half period, tau in [0, Ts/2). */
export interface HalfPeriodModel {
  tank(tau: number): number;
  magnetizing(tau: number): number;
  /** AC part of the Cr voltage (the DC part Vin/2 is added for HB). */
  crAc(tau: number): number;
  /** Kinks of the model inside [0, Ts/2), added to the time grid so PWL sampling is exact there. */
  kinks?: number[];
}

export interface SyntheticConfig {
  inverter: Inverter;
  rectifier: Rectifier;
  vin: number;
  fs: number;
  n: number;
  vout: number;
  load: number;
  deadTime: number;
  cycles: number;
  pointsPerCycle: number;
  /** Node swing time after a gate falls, as a multiple of the dead time; > 1 leaves it incomplete. @default 0.5 */
  swing?: number;
  /** Amplitude of a 2 fs sine added to vout, V. @default 0 */
  voutRipple?: number;
}

/**
 * A deterministic non-uniform grid on [0, tEnd]: the uniform grid warped by u + 0.6 sin(2 pi m u)/(2 pi m)
 * (steps vary 0.4x..1.6x), merged with the given breakpoints.
 */
export function warpedGrid(tEnd: number, points: number, breakpoints: number[] = [], m = 37): Float64Array {
  const all: number[] = [];
  for (let j = 0; j <= points; j++) {
    const u = j / points;
    all.push(tEnd * (u + (0.6 * Math.sin(2 * Math.PI * m * u)) / (2 * Math.PI * m)));
  }
  for (const b of breakpoints) if (b >= 0 && b <= tEnd) all.push(b);
  all.sort((a, b) => a - b);
  return Float64Array.from(all.filter((v, i) => i === 0 || v !== all[i - 1]));
}

/** Builds a full Waveforms set from a half-period model. */
export function synthesize(cfg: SyntheticConfig, model: HalfPeriodModel): Waveforms {
  const Ts = 1 / cfg.fs;
  const half = Ts / 2;
  const td = cfg.deadTime;
  const gr = Ts * 1e-5; // gate ramp width
  const sw = Math.max((cfg.swing ?? 0.5) * td, gr); // node swing time
  const bps: number[] = [];
  for (let k = 0; k < 2 * cfg.cycles; k++) {
    const o = k * half;
    const taus = [0, td / 2, half - td / 2, td / 2 + gr, half - td / 2 + sw, sw - td / 2, ...(model.kinks ?? [])];
    for (const e of [td / 2, half - td / 2]) taus.push(e - gr / 2, e + gr / 2);
    for (const tau of taus) bps.push(o + tau);
  }
  const t = warpedGrid(cfg.cycles * Ts, cfg.cycles * cfg.pointsPerCycle, bps);
  const N = t.length;
  const arr = () => new Float64Array(N);
  const [tank, mag, cr, vA, isec, gHi, gLo, vout, cap] = [arr(), arr(), arr(), arr(), arr(), arr(), arr(), arr(), arr()];
  const [dP, dN, vrP, vrN, iHi, iLo] = [arr(), arr(), arr(), arr(), arr(), arr()];
  const io = cfg.vout / cfg.load;
  const vrBlock = cfg.rectifier === 'center-tapped' ? 2 * cfg.vout : cfg.vout;
  const ramp = (x: number) => Math.min(1, Math.max(0, x / gr + 0.5)); // 0 -> 1 around x = 0
  for (let j = 0; j < N; j++) {
    const k = Math.floor(t[j] / half);
    const tau = t[j] - k * half;
    const s = k % 2 === 0 ? 1 : -1;
    tank[j] = s * model.tank(tau);
    mag[j] = s * model.magnetizing(tau);
    cr[j] = (cfg.inverter === 'half-bridge' ? cfg.vin / 2 : 0) + s * model.crAc(tau);
    isec[j] = tank[j] - mag[j];
    // gate of the group that owns this half period, and of the other group
    const gOwn = Math.min(ramp(tau - td / 2), 1 - ramp(tau - (half - td / 2)));
    const gOther = tau < half / 2 ? 1 - ramp(tau + td / 2) : ramp(tau - half - td / 2);
    gHi[j] = s > 0 ? gOwn : gOther;
    gLo[j] = s > 0 ? gOther : gOwn;
    // switch node (leg A): after a gate falls (tau = -td/2 or half - td/2) it swings linearly over sw
    // towards the next level; an incoming switch forces the rest within gr after its edge (hard turn-on).
    const own = s > 0 ? cfg.vin : 0;
    if (tau < td / 2 + gr) {
      const x = Math.min(1, Math.max((tau + td / 2) / sw, tau >= td / 2 ? (tau - td / 2) / gr : 0));
      vA[j] = cfg.vin - own + (2 * own - cfg.vin) * x;
    } else if (tau >= half - td / 2) {
      vA[j] = own + (cfg.vin - 2 * own) * Math.min(1, (tau - (half - td / 2)) / sw);
    } else vA[j] = own;
    iHi[j] = s > 0 ? tank[j] : 0;
    iLo[j] = s > 0 ? 0 : -tank[j];
    dP[j] = cfg.n * Math.max(isec[j], 0);
    dN[j] = cfg.n * Math.max(-isec[j], 0);
    vrP[j] = isec[j] < 0 ? vrBlock : 0;
    vrN[j] = isec[j] > 0 ? vrBlock : 0;
    vout[j] = cfg.vout + (cfg.voutRipple ?? 0) * Math.sin(4 * Math.PI * cfg.fs * t[j]);
    cap[j] = dP[j] + dN[j] - io;
  }
  const vHi = vA.map((v) => cfg.vin - v);
  const sw2 = (name: string, vds: Float64Array, gate: Float64Array, current: Float64Array): SwitchTrace => ({ name, vds, gate, current });
  const switches =
    cfg.inverter === 'half-bridge'
      ? [sw2('S1', vHi, gHi, iHi), sw2('S2', vA, gLo, iLo)]
      : [sw2('S1', vHi, gHi, iHi), sw2('S2', vA, gLo, iLo), sw2('S3', vA, gLo, iLo), sw2('S4', vHi, gHi, iHi)];
  const diodes =
    cfg.rectifier === 'center-tapped'
      ? [{ name: 'D1', current: dP, reverseVoltage: vrP }, { name: 'D2', current: dN, reverseVoltage: vrN }]
      : [
          { name: 'D1', current: dP, reverseVoltage: vrP }, { name: 'D2', current: dN, reverseVoltage: vrN },
          { name: 'D3', current: dN, reverseVoltage: vrN }, { name: 'D4', current: dP, reverseVoltage: vrP },
        ];
  return {
    t, inverter: cfg.inverter, rectifier: cfg.rectifier, vin: cfg.vin, fs: cfg.fs, load: cfg.load,
    turnsRatio: cfg.n, rectifierDrop: 0, deadTime: td,
    tankCurrent: tank, magnetizingCurrent: mag, crVoltage: cr,
    bridgeVoltage: cfg.inverter === 'half-bridge' ? vA : vA.map((v) => 2 * v - cfg.vin),
    switches, diodes, vout, outputCapCurrent: cap, secondaryCurrentReferred: isec,
  };
}
