import type { Circuit } from './model.js';
import type { HalfStats } from './stats.js';
import type { HeldOutputResult, RectMode, Segment, TdParams } from './types.js';

const MIRROR: Record<RectMode, RectMode> = { P: 'N', N: 'P', O: 'O' };

/**
 * Rectifier intervals of the half period [td, T/2 + td) that starts at the high-side turn-on:
 * the computed [td, T/2) followed by the mirror image (P <-> N) of [0, td). Intervals shorter
 * than 1e-6 of the half period are rounding artefacts at exact boundaries and are dropped.
 */
export function labelSegments(c: Circuit, st: HalfStats): Segment[] {
  const raw: Segment[] = [];
  for (const s of st.segments) {
    if (s.end > c.td) raw.push({ mode: s.mode, start: Math.max(s.start, c.td), end: s.end });
  }
  for (const s of st.segments) {
    if (s.start < c.td) raw.push({ mode: MIRROR[s.mode], start: s.start + c.half, end: Math.min(s.end, c.td) + c.half });
  }
  const kept = raw.filter((s) => s.end - s.start > 1e-6 * c.half);
  const out: Segment[] = [];
  for (const s of kept) {
    const last = out[out.length - 1];
    if (last && last.mode === s.mode) last.end = s.end;
    else out.push({ ...s });
  }
  return out.map((s) => ({ mode: s.mode, start: s.start * c.base.t, end: s.end * c.base.t }));
}

/**
 * Mode label of rectifier intervals, dropping those shorter than minDuration (s) and merging
 * neighbours of equal state; use it to label with the same minimum as a measured waveform.
 * 'O' if nothing is left.
 */
export function modeLabel(segments: Segment[], minDuration: number): string {
  const kept: RectMode[] = [];
  for (const s of segments) {
    if (s.end - s.start < minDuration) continue;
    if (kept[kept.length - 1] !== s.mode) kept.push(s.mode);
  }
  return kept.join('') || 'O';
}

/** Converts the converged normalized solution to SI results. */
export function buildResult(
  p: TdParams, c: Circuit, vo: number, z: number[], st: HalfStats, iterations: number, usedFallback: boolean,
): HeldOutputResult {
  const { v, i, t } = c.base;
  const vi = v * i;
  const half = c.half;
  const ioRect = (p.n * i * st.absSec) / half;
  const diodeRms = p.n * i * Math.sqrt(st.sec2 / (2 * half));
  const secPeak = Math.max(st.secMax, -st.secMin, 0);
  const uMax = Math.max(st.vcrMax - c.vdc, c.vdc - st.vcrMin);
  const segments = labelSegments(c, st);
  const isec = (z[0] - z[1]) * i;
  const drop = c.nd * p.vf;
  const vinEff = p.inverter === 'full-bridge' ? p.vin : p.vin / 2;
  return {
    vo,
    ioRect,
    gain: (p.n * (vo + drop)) / vinEff,
    mode: segments.map((s) => s.mode).join('') || 'O',
    segments,
    tankCurrentRms: i * Math.sqrt(st.ir2 / half),
    tankCurrentPeak: i * Math.max(-st.irMin, st.irMax),
    magnetizingCurrentPeak: i * Math.max(-st.imMin, st.imMax),
    crVoltageMax: v * (c.vdc + uMax),
    crVoltageMin: v * (c.vdc - uMax),
    turnOffCurrent: -z[0] * i,
    turnOnCurrent: st.irAtGate * i,
    switchCurrentRms: i * Math.sqrt(st.pinIr2 / (2 * half)),
    diodeCurrentPeak: p.n * i * secPeak,
    diodeCurrentRms: diodeRms,
    diodeCurrentAvg: ioRect / 2,
    lmVoltagePeakOpen: v * Math.max(st.vmMax, -st.vmMin, 0),
    outputRippleCurrentRms: Math.sqrt(Math.max(0, 2 * diodeRms * diodeRms - ioRect * ioRect)),
    zvs: c.ce === 0 && c.td === 0 ? z[0] <= 0 : st.railAtGate,
    bridgeVoltageAtGate: st.vAtGate * v,
    zvsTransitionTime: st.zvsTime === null ? null : st.zvsTime * t,
    power: {
      input: (vi * c.srcFactor * (st.qH - st.qL + c.ce * st.hardDv)) / (2 * half),
      output: vo * ioRect,
      switchConduction: (vi * c.rs * st.pinIr2) / half,
      diodeResistive: (vi * c.rd * st.sec2) / half,
      diodeForward: drop * ioRect,
      hardSwitching: (vi * 0.5 * c.ce * st.hardDv * st.hardDv) / half,
    },
    seed: {
      ir: z[0] * i,
      im: z[1] * i,
      vcr: (z[2] + c.vdc) * v,
      vNode: p.inverter === 'full-bridge' ? [0, p.vin] : [0],
      iSecPrimary: isec,
      iSecondary: p.n * isec,
      iDiodeP: Math.max(p.n * isec, 0),
      iDiodeN: Math.max(-p.n * isec, 0),
      vo,
    },
    iterations,
    usedFallback,
  };
}
