import type { MeasureWindow, SimMetrics, Waveforms } from './types.js';
import { checkTopology, findCrossings, findGateEdges, GATE_LEVEL, within, type GateEdges } from './edges.js';
import { modeOfWindow } from './mode.js';
import { resolveMeasureOptions, type MeasureOptions } from './options.js';
import { regionOf, summarizeZvs, turnOffCurrent, turnOnEdges } from './switching.js';
import { makeSpan, spanStats, type Span } from './window.js';
import { summarizeZcs, zcsIntervals } from './zcs.js';

/** Fewer samples than this per switching cycle cannot resolve edges or peaks; measure() refuses. */
export const MIN_POINTS_PER_CYCLE = 16;

/**
 * Span of a measurement window [tStart, tStart + cycles / w.fs]. Refuses (throws) a window that is
 * not a positive whole number of cycles, reaches outside the data, or holds too few samples.
 */
export function windowSpan(w: Waveforms, window: MeasureWindow): Span {
  const { tStart, cycles } = window;
  if (!Number.isInteger(cycles) || cycles < 1) {
    throw new Error(`measure: window.cycles must be a positive whole number of switching cycles, got ${cycles}`);
  }
  if (!Number.isFinite(tStart)) throw new Error(`measure: window.tStart must be finite, got ${tStart}`);
  const span = makeSpan(w.t, tStart, tStart + cycles / w.fs);
  const points = span.end.i - span.start.i + 2;
  if (points < MIN_POINTS_PER_CYCLE * cycles) {
    throw new Error(`measure: ${points} samples in ${cycles} cycles; need at least ${MIN_POINTS_PER_CYCLE} per cycle`);
  }
  return span;
}

/**
 * Switching frequency from the high-side gate rising edges, Hz: (k - 1) / (last - first) over the k
 * edges in the window (over the whole record when the window holds fewer than 2). Throws when it
 * differs from the design w.fs by more than `tolerance` (relative): the window, sized from w.fs,
 * would then not be whole cycles.
 */
export function gateFrequency(w: Waveforms, span: Span, tolerance: number, gates?: GateEdges): number {
  const gate = w.switches[0].gate;
  let edges = gates ? within(gates.rise[0], span.start.t, span.end.t) : findCrossings(w.t, gate, GATE_LEVEL, 'rise', span.start.t, span.end.t);
  if (edges.length < 2) edges = findCrossings(w.t, gate, GATE_LEVEL, 'rise', w.t[0], Infinity);
  if (edges.length < 2) throw new Error('measure: fewer than 2 high-side gate rising edges; cannot measure fs');
  const fs = (edges.length - 1) / (edges[edges.length - 1].t - edges[0].t);
  if (Math.abs(fs / w.fs - 1) > tolerance) {
    throw new Error(`measure: gate edges give fs = ${fs} Hz, design fs = ${w.fs} Hz (tolerance ${tolerance})`);
  }
  return fs;
}

/** Rejects waveform sets the measurements cannot use, with the offending field named. */
export function checkWaveforms(w: Waveforms): void {
  const n = w.t.length;
  if (n < 2) throw new Error(`measure: need at least 2 time points, got ${n}`);
  for (const [name, v] of [['vin', w.vin], ['fs', w.fs], ['turnsRatio', w.turnsRatio]] as const) {
    if (!(Number.isFinite(v) && v > 0)) throw new Error(`measure: ${name} must be a positive number, got ${v}`);
  }
  if (w.load !== undefined && !(w.load > 0)) throw new Error(`measure: load must be > 0 ohm, got ${w.load}`);
  checkTopology(w);
  const vectors: [string, Float64Array][] = [
    ['tankCurrent', w.tankCurrent], ['magnetizingCurrent', w.magnetizingCurrent], ['crVoltage', w.crVoltage],
    ['bridgeVoltage', w.bridgeVoltage], ['vout', w.vout], ['outputCapCurrent', w.outputCapCurrent],
    ['secondaryCurrentReferred', w.secondaryCurrentReferred],
  ];
  for (const s of w.switches) vectors.push([`${s.name}.vds`, s.vds], [`${s.name}.gate`, s.gate], [`${s.name}.current`, s.current]);
  for (const d of w.diodes) vectors.push([`${d.name}.current`, d.current], [`${d.name}.reverseVoltage`, d.reverseVoltage]);
  for (const [name, v] of vectors) {
    if (v.length !== n) throw new Error(`measure: ${name} has ${v.length} points, time has ${n}`);
  }
  for (let i = 1; i < n; i++) {
    if (!(w.t[i] >= w.t[i - 1])) throw new Error(`measure: time is not non-decreasing at index ${i}`);
  }
}

/**
 * Measures one simulated LLC run over a steady-state window of whole switching cycles and returns
 * the metrics FHA also predicts. Worst case per metric, over switches or diodes and over every edge
 * or conduction interval in the window:
 * - currents: RMS and peak |i| of the tank; peak |i_m|; max and min of v_Cr;
 * - switchCurrentRms: largest switch RMS; switchTurnOffCurrent: smallest ZVS-direction current at a
 *   gate falling edge (negative = wrong direction), see turnOffCurrent;
 * - diode avg/peak/rms: largest per diode; diodeReverseVoltage: largest reverse voltage;
 *   diodeReverseCurrent: largest -i_D (0 when never negative); all 0 without conduction;
 * - gain = n (avg vout + rectifierDrop) / Vin_eff, Vin_eff = Vin/2 (HB) or Vin (FB);
 * - zvs, zvsState, zvsWorstVoltage, zvsMarginTime: see turnOnEdges and summarizeZvs;
 * - region: see regionOf; zcs, zcsRatio: see zcsIntervals; mode: see modeOfWindow.
 * Throws an Error naming the problem for unusable input (see checkWaveforms, windowSpan, gateFrequency).
 */
export function measure(w: Waveforms, window: MeasureWindow, opts?: MeasureOptions): SimMetrics {
  const o = resolveMeasureOptions(opts);
  checkWaveforms(w);
  const span = windowSpan(w, window);
  const period = 1 / w.fs;
  const gates = findGateEdges(w, Math.max(w.t[0], span.start.t - period), Math.min(w.t[w.t.length - 1], span.end.t + period));
  const fs = gateFrequency(w, span, o.fsTolerance, gates);
  const peakOf = (y: Float64Array) => {
    const s = spanStats(span, y);
    return Math.max(-s.min, s.max);
  };

  const vo = spanStats(span, w.vout);
  const tank = spanStats(span, w.tankCurrent);
  const cr = spanStats(span, w.crVoltage);
  const cap = spanStats(span, w.outputCapCurrent);
  const diodes = w.diodes.map((d) => ({ i: spanStats(span, d.current), vr: spanStats(span, d.reverseVoltage).max }));
  const worstDiode = (f: (d: (typeof diodes)[number]) => number) => Math.max(...diodes.map(f));

  const sumDiodeAvg = diodes.reduce((s, d) => s + d.i.avg, 0);
  const rectified = w.rectifier === 'full-bridge' ? sumDiodeAvg / 2 : sumDiodeAvg;
  const iout = w.load !== undefined ? vo.avg / w.load : rectified - cap.avg;
  const pout = w.load !== undefined ? (vo.rms * vo.rms) / w.load : vo.avg * iout;
  const vinEff = w.inverter === 'half-bridge' ? w.vin / 2 : w.vin;

  const edges = turnOnEdges(w, span, o.zvsThreshold, gates);
  const diodePeak = worstDiode((d) => d.i.max);
  const intervals = zcsIntervals(w, span, diodePeak > 0 ? o.conductionThreshold * diodePeak : 0, gates);

  return {
    fs,
    gain: (w.turnsRatio * (vo.avg + w.rectifierDrop)) / vinEff,
    vout: vo.avg,
    voutRipple: vo.max - vo.min,
    iout,
    pout,
    ...(w.inputCurrent ? { inputPower: w.vin * spanStats(span, w.inputCurrent).avg } : {}),
    tankCurrentRms: tank.rms,
    tankCurrentPeak: Math.max(-tank.min, tank.max),
    magnetizingCurrentPeak: peakOf(w.magnetizingCurrent),
    crVoltagePeak: cr.max,
    crVoltageMin: cr.min,
    switchCurrentRms: Math.max(...w.switches.map((s) => spanStats(span, s.current).rms)),
    switchTurnOffCurrent: turnOffCurrent(w, span, gates),
    diodeCurrentAvg: worstDiode((d) => d.i.avg),
    diodeCurrentPeak: Math.max(0, diodePeak),
    diodeCurrentRms: worstDiode((d) => d.i.rms),
    diodeReverseVoltage: worstDiode((d) => d.vr),
    diodeReverseCurrent: Math.max(0, worstDiode((d) => -d.i.min)),
    outputRippleCurrentRms: cap.rms,
    ...summarizeZvs(edges, o.zvsThreshold),
    region: regionOf(edges),
    ...summarizeZcs(intervals, o.zcsThreshold),
    mode: modeOfWindow(w, span, peakOf(w.secondaryCurrentReferred), o.modeThreshold, o.modeMinSegment, gates),
  };
}
