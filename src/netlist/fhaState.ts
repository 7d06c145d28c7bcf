import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { DeckSeed } from './types.js';
import { bridgeFactor, rectifierDrop, tankConstants } from '../fha/predict.js';
import { inputImpedance } from '../fha/gain.js';

/**
 * Initial state at t = 0 (low-side turn-off) from the FHA phasors. The bridge fundamental is
 * centred on the middle of the dead time, (4/pi) Vin_eff sin(w (t - td/2)); the tank current lags
 * it by phi, the primary voltage leads or lags by the transfer angle, Im lags that voltage by 90
 * degrees and the Cr voltage lags the tank current by 90 degrees around its DC bias. Every state is
 * taken at its value at that instant, not its mean (a mean-valued start settled more slowly when measured).
 */
export function fhaSeed(design: Design, corner: Corner, fs: number, vout: number): DeckSeed {
  const { fr, zr, ln } = tankConstants(corner);
  const n = corner.turnsRatio;
  const vinEff = bridgeFactor(design) * corner.vin;
  const drop = rectifierDrop(design);
  const vo = Math.max(vout, 1e-3);
  const rac = (8 * n * n * (vo + drop) * corner.load) / (Math.PI ** 2 * vo);
  const q = zr / rac;
  const fn = fs / fr;
  const w = 2 * Math.PI * fs;
  const v1 = (4 / Math.PI) * vinEff;
  const z = inputImpedance(fn, q, ln);
  const zAbs = zr * Math.hypot(z.re, z.im);
  const phi = Math.atan2(z.im, z.re);
  const irPk = v1 / zAbs;
  // Primary voltage phasor: Vp = V1 - Zs I, with Zs = j zr (fn - 1/fn); I = (v1/|Zin|) e^{-j phi}.
  const xs = zr * (fn - 1 / fn);
  const vpRe = v1 - irPk * xs * Math.sin(phi);
  const vpIm = -irPk * xs * Math.cos(phi);
  const vpAbs = Math.hypot(vpRe, vpIm);
  const theta = Math.atan2(vpIm, vpRe);
  const a0 = -w * (design.switches.deadTime / 2); // angle of t = 0 on the fundamental
  const ir = irPk * Math.sin(a0 - phi);
  const im = (vpAbs / (w * corner.lm)) * Math.sin(a0 + theta - Math.PI / 2);
  const vcrDc = design.topology.inverter === 'half-bridge' ? corner.vin / 2 : 0;
  const vcr = vcrDc + (irPk / (w * corner.cr)) * Math.sin(a0 - phi - Math.PI / 2);
  const va = 0;
  const vb = design.topology.inverter === 'full-bridge' ? corner.vin : 0;
  return { vo: vout, ir, im, vcr, va, vb };
}
