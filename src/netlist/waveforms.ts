import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { Waveforms, SwitchTrace, DiodeTrace } from '../measure/types.js';
import type { DeckSeed } from './types.js';
import { MIN_KNEE_VOLTAGE } from './devices.js';
import { rectifierDrop } from '../fha/predict.js';
import { locate, valueAt } from '../measure/window.js';

type Vectors = Record<string, Float64Array>;

function need(v: Vectors, name: string): Float64Array {
  const x = v[name];
  if (!x) throw new Error(`simulator result lacks vector ${name}`);
  return x;
}

function map(len: number, f: (i: number) => number): Float64Array {
  const out = new Float64Array(len);
  for (let i = 0; i < len; i++) out[i] = f(i);
  return out;
}

/** Map the deck's saved vectors (see savedVectors) onto the measurement model, signs included. */
export function toWaveforms(design: Design, corner: Corner, fs: number, v: Vectors): Waveforms {
  const t = need(v, 'time');
  const len = t.length;
  const n = corner.turnsRatio;
  const vin = corner.vin;
  const fb = design.topology.inverter === 'full-bridge';
  const fbr = design.topology.rectifier === 'full-bridge';
  const va = need(v, 'v(a)');
  const vb = fb ? need(v, 'v(b)') : new Float64Array(len);
  const g1 = need(v, 'v(g1)');
  const g2 = need(v, 'v(g2)');
  const ir = need(v, 'i(vlr)');
  const t2 = need(v, 'v(t2)');
  const t3 = need(v, 'v(t3)');
  const s1 = need(v, 'v(s1)');
  const s2 = need(v, 'v(s2)');
  const out = need(v, 'v(out)');
  const id = [1, 2, 3, 4].slice(0, fbr ? 4 : 2).map((k) => need(v, `i(vd${k})`));
  const isecRef = map(len, (i) => (id[0]![i]! - id[1]![i]!) / n);
  const switches: SwitchTrace[] = [
    { name: 'S1', vds: map(len, (i) => vin - va[i]!), gate: g1, current: need(v, 'i(vsw1)') },
    { name: 'S2', vds: va, gate: g2, current: need(v, 'i(vsw2)') },
  ];
  if (fb) {
    switches.push({ name: 'S3', vds: map(len, (i) => vin - vb[i]!), gate: g2, current: need(v, 'i(vsw3)') });
    switches.push({ name: 'S4', vds: vb, gate: g1, current: need(v, 'i(vsw4)') });
  }
  const diodes: DiodeTrace[] = fbr
    ? [
        { name: 'D1', current: id[0]!, reverseVoltage: map(len, (i) => out[i]! - s1[i]!) },
        { name: 'D2', current: id[1]!, reverseVoltage: s1 },
        { name: 'D3', current: id[2]!, reverseVoltage: map(len, (i) => out[i]! - s2[i]!) },
        { name: 'D4', current: id[3]!, reverseVoltage: s2 },
      ]
    : [
        { name: 'D1', current: id[0]!, reverseVoltage: map(len, (i) => out[i]! - s1[i]!) },
        { name: 'D2', current: id[1]!, reverseVoltage: map(len, (i) => out[i]! - s2[i]!) },
      ];
  // Current delivered into the output node: D1 + D2 (CT) or D1 + D3 (full-bridge rectifier).
  const rect = fbr ? [id[0]!, id[2]!] : [id[0]!, id[1]!];
  return {
    t, inverter: design.topology.inverter, rectifier: design.topology.rectifier, vin, fs, turnsRatio: n,
    rectifierDrop: modelDrop(design), deadTime: design.switches.deadTime, load: corner.load,
    tankCurrent: ir,
    magnetizingCurrent: map(len, (i) => ir[i]! - isecRef[i]!),
    crVoltage: map(len, (i) => t2[i]! - t3[i]!),
    bridgeVoltage: map(len, (i) => va[i]! - vb[i]!),
    switches, diodes, vout: out,
    outputCapCurrent: map(len, (i) => rect[0]![i]! + rect[1]![i]! - out[i]! / corner.load),
    secondaryCurrentReferred: isecRef,
    // the input source feeds the high-side drain(s): S1, and S3 of a full bridge
    inputCurrent: fb ? map(len, (i) => switches[0]!.current[i]! + switches[2]!.current[i]!) : switches[0]!.current,
  } as Waveforms;
}

/** State at the last saved point, to continue a run from where the previous one ended. */
export function finalState(w: Waveforms, v: Vectors): DeckSeed {
  return stateAt(w, v, w.t[w.t.length - 1]!);
}

/**
 * Circuit state at time `time` (linear interpolation between saved points), in the DeckSeed
 * variables: the states a run starts from. At a whole number of cycles after the deck's time 0 it
 * is the state at the same switching phase as the deck's initial conditions.
 */
export function stateAt(w: Waveforms, v: Vectors, time: number): DeckSeed {
  const p = locate(w.t, time);
  return {
    vo: valueAt(need(v, 'v(co)'), p),
    ir: valueAt(w.tankCurrent, p),
    im: valueAt(w.magnetizingCurrent, p),
    vcr: valueAt(w.crVoltage, p),
    va: valueAt(need(v, 'v(a)'), p),
    vb: w.inverter === 'full-bridge' ? valueAt(need(v, 'v(b)'), p) : 0,
  };
}

/**
 * Forward drop of the simulated rectifier path: the design's drop, except that the fitted diode
 * never drops less than MIN_KNEE_VOLTAGE (a user diode model is taken at the design's value).
 */
export function modelDrop(design: Design): number {
  const vf = design.rectifier.forwardVoltage;
  return rectifierDrop(design, design.devices.diodeModel ? vf : Math.max(vf, MIN_KNEE_VOLTAGE));
}
