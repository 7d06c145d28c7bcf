import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from './types.js';
import { fhaGain, fnForGain, inputImpedance, peakGainFn, zeroPhaseFn } from './gain.js';

/** Upper search limit for fn when regulating; beyond it the corner is reported unreachable. */
const FN_MAX = 50;

/** Inverter factor k_b: Vin_eff = k_b Vin (1/2 half-bridge, 1 full-bridge). */
export function bridgeFactor(design: Design): number {
  return design.topology.inverter === 'half-bridge' ? 0.5 : 1;
}

/** Total forward drop in the rectifier current path: VF (center-tapped) or 2 VF (full-bridge). */
export function rectifierDrop(design: Design, vf = design.rectifier.forwardVoltage): number {
  return design.topology.rectifier === 'center-tapped' ? vf : 2 * vf;
}

/** Tank constants of one corner: fr, fp, Zr, Ln. */
export function tankConstants(c: Pick<Corner, 'lr' | 'cr' | 'lm'>) {
  const fr = 1 / (2 * Math.PI * Math.sqrt(c.lr * c.cr));
  const fp = 1 / (2 * Math.PI * Math.sqrt((c.lr + c.lm) * c.cr));
  return { fr, fp, zr: Math.sqrt(c.lr / c.cr), ln: c.lm / c.lr };
}

/** Rac = 8 n^2 V_rect / (pi^2 Io) (docs/method.md#fha-rectifier, with the diode drop in V_rect). */
export function acResistance(n: number, vout: number, drop: number, load: number): number {
  return (8 * n * n * (vout + drop) * load) / (Math.PI ** 2 * vout);
}

/**
 * Output voltage at a fixed frequency: the unique root of M(Q(Vo)) Vin_eff / n - drop - Vo = 0
 * (Q rises with Vo when drop > 0, so the left side falls strictly; bisection).
 */
function solveFixedVout(fn: number, zr: number, ln: number, n: number, vinEff: number, drop: number, load: number): number {
  const g = (vo: number) => fhaGain(fn, zr / acResistance(n, vo, drop, load), ln) * vinEff / n - drop - vo;
  if (drop === 0) return fhaGain(fn, zr / ((8 * n * n * load) / Math.PI ** 2), ln) * vinEff / n;
  let lo = 1e-12 * vinEff;
  if (g(lo) <= 0) return 0;
  let hi = vinEff / n;
  while (g(hi) > 0) hi *= 2;
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (mid === lo || mid === hi) break;
    if (g(mid) > 0) lo = mid;
    else hi = mid;
  }
  return 0.5 * (lo + hi);
}

/**
 * FHA prediction for one corner (docs/method.md#fha). Fixed frequency: Vo follows
 * from the gain. Regulated (corner.fs null): fs is solved for output.voltage on the branch above
 * the zero-phase boundary; a target above M(fn_zp) is unreachable with ZVS and yields nulls.
 */
export function predictCorner(design: Design, corner: Corner): FhaResult {
  const { fr, fp, zr, ln } = tankConstants(corner);
  const n = corner.turnsRatio;
  const vinEff = bridgeFactor(design) * corner.vin;
  const drop = rectifierDrop(design);
  const warnings: string[] = [];
  const zvsRequiredCurrent = (2 * design.switches.coss * corner.vin) / design.switches.deadTime;

  let fn: number | null;
  let vout: number;
  let q: number;
  let gainTarget: number;
  if (corner.fs === null) {
    vout = design.output.voltage;
    q = zr / acResistance(n, vout, drop, corner.load);
    gainTarget = (n * (vout + drop)) / vinEff;
    const fnZp = zeroPhaseFn(q, ln);
    fn = fnForGain(gainTarget, q, ln, fnZp, FN_MAX);
    if (fn === null && gainTarget > fhaGain(fnZp, q, ln)) {
      warnings.push(`needs gain ${gainTarget.toFixed(4)} but FHA reaches at most ${fhaGain(fnZp, q, ln).toFixed(4)} with an inductive tank (at the zero-phase boundary): unreachable with ZVS`);
    } else if (fn === null) {
      warnings.push(`needs gain ${gainTarget.toFixed(4)}, still above it at fs = ${FN_MAX} fr: cannot regulate by frequency`);
    }
  } else {
    fn = corner.fs / fr;
    vout = solveFixedVout(fn, zr, ln, n, vinEff, drop, corner.load);
    q = vout > 0 ? zr / acResistance(n, vout, drop, corner.load) : 0;
    gainTarget = (n * (design.output.voltage + drop)) / vinEff;
  }
  if (gainTarget <= ln / (ln + 1)) {
    warnings.push(`light load: needs gain ${gainTarget.toFixed(4)} <= Ln/(Ln+1) = ${(ln / (ln + 1)).toFixed(4)}, the lowest gain FHA reaches at no load; regulation relies on the load and parasitic capacitance makes it worse`);
  }
  const fnZp = zeroPhaseFn(q, ln);
  const fnPk = peakGainFn(q, ln);
  const common = {
    fr, fp, zr, rac: zr / q, q, ln, gainTarget, zvsRequiredCurrent,
    fsZeroPhase: fnZp * fr, gainAtZeroPhase: fhaGain(fnZp, q, ln),
    fsPeakGain: fnPk * fr, peakGain: q === 0 ? Infinity : fhaGain(fnPk, q, ln),
  };
  if (fn === null) return result(common, null, warnings);

  const fs = fn * fr;
  const gain = fhaGain(fn, q, ln);
  const vrect = vout + drop;
  const iout = vout / corner.load;
  const z = inputImpedance(fn, q, ln);
  const phase = Math.atan2(z.im, z.re);
  const ws = 2 * Math.PI * fs;
  const ioeRms = (Math.PI * iout) / (2 * Math.SQRT2 * n);
  const imPk = (2 * n * vrect) / (Math.PI ** 2 * fs * corner.lm);
  const irRms = Math.sqrt(ioeRms ** 2 + imPk ** 2 / 2);
  const irPk = Math.SQRT2 * irRms;
  const vcrAc = irPk / (ws * corner.cr);
  const vcrDc = design.topology.inverter === 'half-bridge' ? corner.vin / 2 : 0;
  const iOff = irPk * Math.sin(phase);
  const region = fn >= fnZp ? 'inductive' : 'capacitive';
  const vf = design.rectifier.forwardVoltage;
  if (region === 'inductive' && fn > 1 && design.tank.lr * iOff ** 2 < 2 * design.switches.coss * corner.vin ** 2) {
    warnings.push('above resonance only Lr drives the dead-time transition: its energy is below what the switch capacitances need (docs/method.md#zvs)');
  }
  const zvsTime = deadTimeZvs(design.switches.deadTime, fs, phase, warnings);
  return result(common, {
    fs, fn, gain, vout, iout, region, phase,
    zvs: region === 'inductive' && iOff >= zvsRequiredCurrent && zvsTime,
    zvsMargin: iOff - zvsRequiredCurrent,
    zcs: fs <= fr,
    tankCurrentRms: irRms,
    tankCurrentPeak: irPk,
    magnetizingCurrentPeak: imPk,
    crVoltagePeak: vcrDc + vcrAc,
    crVoltageMin: vcrDc - vcrAc,
    switchCurrentRms: irRms / Math.SQRT2,
    switchTurnOffCurrent: iOff,
    diodeCurrentAvg: iout / 2,
    diodeCurrentPeak: (Math.PI / 2) * iout,
    diodeCurrentRms: (Math.PI / 4) * iout,
    diodeReverseVoltage: design.topology.rectifier === 'center-tapped' ? 2 * vout + vf : vout + vf,
    outputRippleCurrentRms: Math.sqrt(Math.PI ** 2 / 8 - 1) * iout,
  }, warnings);
}

/**
 * Dead time against the (given or solved) switching period, for the ZVS verdict; pushes warnings.
 * - The dead time must be shorter than half the period (the rule of the fixed-frequency design
 *   check): otherwise the bridge never conducts and there is no ZVS to speak of.
 * - Above 10 % of the period the bridge fundamental shrinks by sin(pi fs td) / (pi fs td) (a
 *   trapezoid instead of a square; docs/method.md#fha-inverter), which FHA's gain leaves out: warn.
 * - The tank current lags the fundamental by the impedance phase, so it reverses phase / (2 pi fs)
 *   after the fundamental's zero crossing, which sits in the middle of the dead time. The incoming
 *   switch's gate edge comes td / 2 after it: ZVS needs td < phase / (pi fs), otherwise the current
 *   swings the node back before the edge (docs/method.md#zvs, condition 4).
 * Returns whether the dead time allows ZVS.
 */
export function deadTimeZvs(td: number, fs: number, phase: number, warnings: string[]): boolean {
  if (!(td > 0)) return true;
  const us = (t: number) => `${(t * 1e6).toPrecision(3)} us`;
  const khz = `${(fs / 1e3).toPrecision(4)} kHz`;
  if (td >= 1 / (2 * fs)) {
    warnings.push(`dead time ${us(td)} is not shorter than half the switching period at ${khz} (${us(1 / (2 * fs))}): the bridge cannot run there, no ZVS`);
    return false;
  }
  if (td * fs > 0.1) {
    const x = Math.PI * fs * td;
    warnings.push(`dead time ${us(td)} is ${(td * fs * 100).toPrecision(3)} % of the period at ${khz}; the bridge fundamental shrinks by sin(pi fs td)/(pi fs td) = ${(Math.sin(x) / x).toPrecision(4)}, which FHA's gain leaves out`);
  }
  const reversal = phase > 0 ? phase / (Math.PI * fs) : 0;
  if (td >= reversal) {
    warnings.push(`dead time ${us(td)} outlasts the ${us(reversal)} before the tank current reverses at ${khz} (phase ${(phase * 180 / Math.PI).toFixed(1)} deg): no ZVS`);
    return false;
  }
  return true;
}

type Common = Pick<FhaResult, 'fr' | 'fp' | 'zr' | 'rac' | 'q' | 'ln' | 'gainTarget' | 'zvsRequiredCurrent' | 'fsZeroPhase' | 'gainAtZeroPhase' | 'fsPeakGain' | 'peakGain'>;
type Operating = Omit<FhaResult, keyof Common | 'warnings'>;

/**
 * One object literal in a fixed key order for both outcomes: the same hidden class every time
 * (object spreads here made each prediction ~50x slower through dictionary-mode objects).
 */
function result(c: Common, o: { [K in keyof Operating]: NonNullable<Operating[K]> } | null, warnings: string[]): FhaResult {
  return {
    fr: c.fr, fp: c.fp, zr: c.zr, rac: c.rac, q: c.q, ln: c.ln, gainTarget: c.gainTarget, zvsRequiredCurrent: c.zvsRequiredCurrent,
    fsZeroPhase: c.fsZeroPhase, gainAtZeroPhase: c.gainAtZeroPhase, fsPeakGain: c.fsPeakGain, peakGain: c.peakGain,
    warnings,
    fs: o ? o.fs : null, fn: o ? o.fn : null, gain: o ? o.gain : null, vout: o ? o.vout : null, iout: o ? o.iout : null,
    region: o ? o.region : null, phase: o ? o.phase : null, zvs: o ? o.zvs : null, zvsMargin: o ? o.zvsMargin : null,
    zcs: o ? o.zcs : null,
    tankCurrentRms: o ? o.tankCurrentRms : null, tankCurrentPeak: o ? o.tankCurrentPeak : null,
    magnetizingCurrentPeak: o ? o.magnetizingCurrentPeak : null, crVoltagePeak: o ? o.crVoltagePeak : null,
    crVoltageMin: o ? o.crVoltageMin : null, switchCurrentRms: o ? o.switchCurrentRms : null,
    switchTurnOffCurrent: o ? o.switchTurnOffCurrent : null, diodeCurrentAvg: o ? o.diodeCurrentAvg : null,
    diodeCurrentPeak: o ? o.diodeCurrentPeak : null, diodeCurrentRms: o ? o.diodeCurrentRms : null,
    diodeReverseVoltage: o ? o.diodeReverseVoltage : null, outputRippleCurrentRms: o ? o.outputRippleCurrentRms : null,
  };
}
