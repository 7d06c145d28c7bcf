import type { DiodeTrace, SwitchTrace, Waveforms } from '../measure/types.js';
import type { PeriodTrace } from '../tdmodel/trace.js';
import type { TdParams } from '../tdmodel/index.js';

/** Periods laid end to end: the middle one is measured, its neighbours hold the gate edges around it. */
export const TRACE_PERIODS = 3;

/**
 * The ideal model's period as the measurement model's Waveforms, the same vectors and signs the
 * deck's vectors are mapped onto (netlist/waveforms.ts), repeated TRACE_PERIODS times:
 * - switch currents: the pinned group carries the tank current, a free node splits it half and
 *   half between the two Coss of a leg (equal capacitances);
 * - FB legs: v_A = (Vin + v_b) / 2, v_B = (Vin - v_b) / 2 (symmetric legs);
 * - diodes: the secondary current n i_sec in its half; reverse voltages from the winding voltage
 *   vm / n (CT: Vo -+ vm / n; FB rectifier: the two winding ends split the winding voltage
 *   symmetrically about Vo / 2, which gives the conducting pairs' drops exactly);
 * - the output is held at vo: no ripple; the capacitor current is the rectified current less vo / load.
 * load (ohm) and rectifierDrop (V, for the gain) as in the deck's waveforms (modelDrop there), so
 * that the gain and output-current definitions agree.
 */
export function idealWaveforms(p: TdParams, tr: PeriodTrace, vo: number, load: number, rectifierDrop: number): Waveforms {
  const m = tr.t.length;
  const len = m * TRACE_PERIODS;
  const period = 1 / p.fs;
  const n = p.n;
  const fb = p.inverter === 'full-bridge';
  const fbr = p.rectifier === 'full-bridge';
  const rep = (f: (k: number) => number) => {
    const out = new Float64Array(len);
    for (let r = 0; r < TRACE_PERIODS; r++) for (let k = 0; k < m; k++) out[r * m + k] = f(k);
    return out;
  };
  const t = new Float64Array(len);
  // the trace's last time may exceed 1/fs by a rounding error; capped, the periods laid end to end
  // never run backwards (rounding of the sums is monotonic)
  for (let r = 0; r < TRACE_PERIODS; r++) for (let k = 0; k < m; k++) t[r * m + k] = Math.min(tr.t[k], period) + r * period;
  const vin = p.vin;
  const isec = (k: number) => tr.ir[k] - tr.im[k];
  const hiCurrent = (k: number) => sideCurrent(tr, k, 'high');
  const loCurrent = (k: number) => sideCurrent(tr, k, 'low');
  const va = (k: number) => (fb ? (vin + tr.vb[k]) / 2 : tr.vb[k]);
  const vB = (k: number) => (vin - tr.vb[k]) / 2;
  const g1 = rep((k) => tr.highGate[k]);
  const g2 = rep((k) => tr.lowGate[k]);
  const switches: SwitchTrace[] = [
    { name: 'S1', vds: rep((k) => vin - va(k)), gate: g1, current: rep(hiCurrent) },
    { name: 'S2', vds: rep(va), gate: g2, current: rep(loCurrent) },
  ];
  if (fb) {
    // Leg B mirrors leg A: S3 switches with S2, S4 with S1; the tank current enters node B.
    switches.push({ name: 'S3', vds: rep((k) => vin - vB(k)), gate: g2, current: rep(loCurrent) });
    switches.push({ name: 'S4', vds: rep(vB), gate: g1, current: rep(hiCurrent) });
  }
  const dP = rep((k) => Math.max(n * isec(k), 0));
  const dN = rep((k) => Math.max(-n * isec(k), 0));
  const ws = (k: number) => tr.vm[k] / n;
  const diodes: DiodeTrace[] = fbr
    ? [
        { name: 'D1', current: dP, reverseVoltage: rep((k) => (vo - ws(k)) / 2) },
        { name: 'D2', current: dN, reverseVoltage: rep((k) => (vo + ws(k)) / 2) },
        { name: 'D3', current: dN, reverseVoltage: rep((k) => (vo + ws(k)) / 2) },
        { name: 'D4', current: dP, reverseVoltage: rep((k) => (vo - ws(k)) / 2) },
      ]
    : [
        { name: 'D1', current: dP, reverseVoltage: rep((k) => vo - ws(k)) },
        { name: 'D2', current: dN, reverseVoltage: rep((k) => vo + ws(k)) },
      ];
  return {
    t, inverter: p.inverter, rectifier: p.rectifier, vin, fs: p.fs, load, turnsRatio: n, rectifierDrop, deadTime: p.deadTime,
    tankCurrent: rep((k) => tr.ir[k]),
    magnetizingCurrent: rep((k) => tr.im[k]),
    crVoltage: rep((k) => tr.vcr[k]),
    bridgeVoltage: rep((k) => tr.vb[k]),
    switches, diodes,
    vout: rep(() => vo),
    outputCapCurrent: rep((k) => n * Math.abs(isec(k)) - vo / load),
    secondaryCurrentReferred: rep(isec),
  };
}

/**
 * Drain-to-source current of the high- or low-side group at sample k: the tank current while
 * that group is pinned (negative = body diode), half of it while the node swings freely.
 */
function sideCurrent(tr: PeriodTrace, k: number, side: 'high' | 'low'): number {
  const ir = tr.ir[k];
  switch (tr.path[k]) {
    case 'high': return side === 'high' ? ir : 0;
    case 'low': return side === 'low' ? -ir : 0;
    case 'free': return side === 'high' ? ir / 2 : -ir / 2;
    default: return 0;
  }
}
