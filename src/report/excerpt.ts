import type { Waveforms } from '../measure/types.js';
import type { WaveformExcerpt } from '../results/types.js';
import { findCrossings, GATE_LEVEL } from '../measure/edges.js';
import { locate, valueAt } from '../measure/window.js';

/** Points per series kept for the report (evenly spaced in time, linearly interpolated). */
export const EXCERPT_POINTS = 600;

/**
 * Downsample the measurement window to a fixed time grid for plots: tank and magnetizing current,
 * bridge voltage, Cr voltage, diode currents, output voltage and the high-side gate turn-on edges.
 * Pure; keeps at most `cycles` switching cycles (default 2 of the window) so plots stay readable.
 * Sampling and edges use the measurement's own PWL interpolation (measure/window, measure/edges),
 * so a plotted edge sits where the measurements put it.
 */
export function excerpt(id: string, w: Waveforms, tStart: number, windowCycles: number, cycles = 2, points = EXCERPT_POINTS): WaveformExcerpt {
  const period = 1 / w.fs;
  const t0 = tStart + (windowCycles - cycles) * period;
  const t1 = tStart + windowCycles * period;
  const grid = Array.from({ length: points }, (_, i) => locate(w.t, t0 + ((t1 - t0) * i) / (points - 1)));
  const sample = (y: Float64Array) => grid.map((p) => round(valueAt(y, p)));
  const series: Record<string, number[]> = {
    tankCurrent: sample(w.tankCurrent),
    magnetizingCurrent: sample(w.magnetizingCurrent),
    bridgeVoltage: sample(w.bridgeVoltage),
    crVoltage: sample(w.crVoltage),
    vout: sample(w.vout),
  };
  w.diodes.forEach((d) => { series[`diode${d.name}`] = sample(d.current); });
  const edges = findCrossings(w.t, w.switches[0]!.gate, GATE_LEVEL, 'rise', t0, t1).map((e) => round(e.t - t0));
  return { id, fs: w.fs, t: grid.map((p) => round(p.t - t0)), series, edges };
}

/** Six significant digits keep the companion file small and byte-stable. */
function round(x: number): number {
  return Number(x.toPrecision(6));
}
