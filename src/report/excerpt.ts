import type { Waveforms } from '../measure/types.js';
import type { WaveformExcerpt } from '../results/types.js';

/** Points per series kept for the report (evenly spaced in time, linearly interpolated). */
export const EXCERPT_POINTS = 600;

/**
 * Downsample the measurement window to a fixed time grid for plots: tank and magnetizing current,
 * bridge voltage, Cr voltage, diode currents, output voltage and the high-side gate turn-on edges.
 * Pure; keeps at most `cycles` switching cycles (default 2 of the window) so plots stay readable.
 */
export function excerpt(id: string, w: Waveforms, tStart: number, windowCycles: number, cycles = 2, points = EXCERPT_POINTS): WaveformExcerpt {
  const period = 1 / w.fs;
  const t0 = tStart + (windowCycles - cycles) * period;
  const t1 = tStart + windowCycles * period;
  const grid = Array.from({ length: points }, (_, i) => t0 + ((t1 - t0) * i) / (points - 1));
  const sample = (y: Float64Array) => resample(w.t, y, grid);
  const series: Record<string, number[]> = {
    tankCurrent: sample(w.tankCurrent),
    magnetizingCurrent: sample(w.magnetizingCurrent),
    bridgeVoltage: sample(w.bridgeVoltage),
    crVoltage: sample(w.crVoltage),
    vout: sample(w.vout),
  };
  w.diodes.forEach((d) => { series[`diode${d.name}`] = sample(d.current); });
  const g = w.switches[0]!.gate;
  const edges: number[] = [];
  for (let i = 1; i < w.t.length; i++) {
    const ti = w.t[i]!;
    if (ti < t0 || ti > t1) continue;
    if (g[i - 1]! < 0.5 && g[i]! >= 0.5) edges.push(round(ti - t0));
  }
  return { id, fs: w.fs, t: grid.map((x) => round(x - t0)), series, edges };
}

function resample(t: Float64Array, y: Float64Array, grid: number[]): number[] {
  const out: number[] = [];
  let j = 0;
  for (const x of grid) {
    while (j < t.length - 2 && t[j + 1]! < x) j++;
    const dt = t[j + 1]! - t[j]!;
    const f = dt > 0 ? Math.min(Math.max((x - t[j]!) / dt, 0), 1) : 0;
    out.push(round(y[j]! + f * (y[j + 1]! - y[j]!)));
  }
  return out;
}

/** Six significant digits keep the companion file small and byte-stable. */
function round(x: number): number {
  return Number(x.toPrecision(6));
}
