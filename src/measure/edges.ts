import type { Waveforms } from './types.js';
import { locate, type GridPoint } from './window.js';

/** Gate level separating off from on (gate commands are 0..1, on above 0.5). */
export const GATE_LEVEL = 0.5;

export type EdgeDirection = 'rise' | 'fall';

/**
 * Times where the PWL signal y crosses `level` in the given direction, with from <= time < to.
 * A rise is y[j] < level <= y[j + 1], a fall y[j] >= level > y[j + 1], so a sample lying exactly
 * on the level is counted once. The crossing time is interpolated linearly inside the segment.
 */
export function findCrossings(
  t: Float64Array,
  y: Float64Array,
  level: number,
  direction: EdgeDirection,
  from: number,
  to: number,
): GridPoint[] {
  const out: GridPoint[] = [];
  const rise = direction === 'rise';
  const jEnd = Math.min(locate(t, to).i, t.length - 2);
  for (let j = locate(t, from).i; j <= jEnd; j++) {
    const a = y[j];
    const b = y[j + 1];
    if (rise ? a < level && b >= level : a >= level && b < level) {
      const f = (level - a) / (b - a);
      const time = t[j] + f * (t[j + 1] - t[j]);
      if (time >= from && time < to) out.push({ t: time, i: j, f });
    }
  }
  return out;
}

/** Rising and falling gate edges of every switch (index as Waveforms.switches). */
export interface GateEdges {
  rise: GridPoint[][];
  fall: GridPoint[][];
}

/**
 * Gate edges of every switch with from <= t < to, found once so that the measurements can share them
 * (each then keeps the part it needs with `within`).
 */
export function findGateEdges(w: Waveforms, from: number, to: number): GateEdges {
  const scan = (d: EdgeDirection) => w.switches.map((s) => findCrossings(w.t, s.gate, GATE_LEVEL, d, from, to));
  return { rise: scan('rise'), fall: scan('fall') };
}

/** The edges of an ascending list with from <= t < to. */
export function within(edges: GridPoint[], from: number, to: number): GridPoint[] {
  return edges.filter((e) => e.t >= from && e.t < to);
}

/**
 * +1 for the switches that turn on with the HB high side (HB: index 0; FB: S1 and S4 = 0 and 3),
 * -1 for the others. While a +1 switch conducts the bridge applies +Vin_eff to the tank.
 */
export function bridgeSign(w: Waveforms, k: number): 1 | -1 {
  if (w.inverter === 'half-bridge') return k === 0 ? 1 : -1;
  return k === 0 || k === 3 ? 1 : -1;
}

/** Expected switch and diode counts per topology; throws a clear Error otherwise. */
export function checkTopology(w: Waveforms): void {
  const sw = w.inverter === 'half-bridge' ? 2 : 4;
  const di = w.rectifier === 'center-tapped' ? 2 : 4;
  if (w.switches.length !== sw) {
    throw new Error(`measure: ${w.inverter} needs ${sw} switch traces, got ${w.switches.length}`);
  }
  if (w.diodes.length !== di) {
    throw new Error(`measure: ${w.rectifier} rectifier needs ${di} diode traces, got ${w.diodes.length}`);
  }
}
