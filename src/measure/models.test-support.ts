/**
 * TEST-ONLY model builders for synthesize(): the ideal converter at fs = fr (docs/method.md#tank-currents) and
 * invented below/above-resonance and pure-sine sets whose answers follow from their construction.
 */
import type { Inverter, Rectifier } from '../design/types.js';
import type { Waveforms } from './types.js';
import { synthesize } from './synthetic.test-support.js';

/** Record options shared by the model builders below. */
export interface RecordSpec {
  inverter?: Inverter;
  rectifier?: Rectifier;
  deadTime?: number;
  swing?: number;
  cycles?: number;
  pointsPerCycle?: number;
  voutRipple?: number;
}

const base = (r: RecordSpec) => ({
  inverter: r.inverter ?? ('half-bridge' as Inverter),
  rectifier: r.rectifier ?? ('center-tapped' as Rectifier),
  deadTime: r.deadTime ?? 0,
  cycles: r.cycles ?? 8,
  pointsPerCycle: r.pointsPerCycle ?? 3000,
  swing: r.swing,
  voutRipple: r.voutRipple,
});

/** Physical tank of the ideal converter (ideal diodes, stiff output). */
export interface TankSpec {
  vin: number;
  lr: number;
  cr: number;
  lm: number;
  n: number;
  load: number;
}

/**
 * Ideal LLC at fs = fr (docs/method.md#tank-currents): Vo = Vin_eff / n (gain 1), Lm clamped to +n Vo for the
 * whole half period, so i_m is a triangle of peak Im = n Vo / (4 fs Lm) and i_r = A sin(wr tau - theta)
 * with A cos(theta) = pi Io / (2n), A sin(theta) = Im. Cr voltage ac part -A Zr cos(wr tau - theta).
 */
export function resonantSet(tank: TankSpec, rec: RecordSpec = {}): Waveforms {
  const b = base(rec);
  const fr = 1 / (2 * Math.PI * Math.sqrt(tank.lr * tank.cr));
  const vinEff = b.inverter === 'half-bridge' ? tank.vin / 2 : tank.vin;
  const vout = vinEff / tank.n;
  const io = vout / tank.load;
  const im = (tank.n * vout) / (4 * fr * tank.lm);
  const ic = (Math.PI * io) / (2 * tank.n);
  const a = Math.hypot(ic, im);
  const theta = Math.atan2(im, ic);
  const wr = 2 * Math.PI * fr;
  const zr = Math.sqrt(tank.lr / tank.cr);
  return synthesize({ ...b, vin: tank.vin, fs: fr, n: tank.n, vout, load: tank.load }, {
    tank: (x) => a * Math.sin(wr * x - theta),
    magnetizing: (x) => -im + ((tank.n * vout) / tank.lm) * x,
    crAc: (x) => -a * zr * Math.cos(wr * x - theta),
  });
}

/** Common shape parameters of the invented below/above-resonance sets (HB, Vin 400 V, n 4, 4 ohm). */
export interface ShapeSpec {
  fs: number;
  /** fs / fr. */
  fn: number;
  /** Peak of the primary-referred secondary current, A. */
  ipk: number;
  /** Magnetizing peak, A. */
  im: number;
}

/**
 * Below resonance (PO): the secondary is a half-sine of duration Tr/2 = half * fn (fn < 1), then zero; i_m
 * rises from -Im to +Im during P and stays during O. Natural zero-current commutation.
 */
export function belowResonanceSet(sh: ShapeSpec, rec: RecordSpec = {}): Waveforms {
  const tp = (0.5 / sh.fs) * sh.fn;
  const mag = (x: number) => -sh.im + 2 * sh.im * Math.min(x / tp, 1);
  return synthesize({ ...base(rec), vin: 400, fs: sh.fs, n: 4, vout: 50, load: 4 }, {
    tank: (x) => mag(x) + (x < tp ? sh.ipk * Math.sin((Math.PI * x) / tp) : 0),
    magnetizing: mag,
    crAc: (x) => -100 * Math.cos(2 * Math.PI * sh.fs * x),
    kinks: [tp],
  });
}

/**
 * Above resonance (NP): the previous half's current, cut by the edge at +Icut, ramps linearly to 0
 * over tc (N in this half), then a resonant arc Ipk sin(wr (tau - tc)) runs until the next edge cuts
 * it at Icut = Ipk sin(wr (half - tc)) (hard commutation).
 */
export function aboveResonanceSet(sh: ShapeSpec & { tc: number }, rec: RecordSpec = {}): Waveforms {
  const half = 0.5 / sh.fs;
  const wr = 2 * Math.PI * sh.fs / sh.fn;
  const icut = sh.ipk * Math.sin(wr * (half - sh.tc));
  const isec = (x: number) => (x < sh.tc ? -icut * (1 - x / sh.tc) : sh.ipk * Math.sin(wr * (x - sh.tc)));
  const mag = (x: number) => -sh.im + (2 * sh.im * x) / half;
  return synthesize({ ...base(rec), vin: 400, fs: sh.fs, n: 4, vout: 50, load: 4 }, {
    tank: (x) => mag(x) + isec(x),
    magnetizing: mag,
    crAc: (x) => -100 * Math.cos(2 * Math.PI * sh.fs * x),
    kinks: [sh.tc],
  });
}

/** Tank current A sin(ws tau + phase) with no magnetizing current (phase > 0 leads: capacitive). */
export function sineSet(fs: number, amplitude: number, phase: number, rec: RecordSpec = {}): Waveforms {
  const ws = 2 * Math.PI * fs;
  return synthesize({ ...base(rec), vin: 400, fs, n: 4, vout: 50, load: 4 }, {
    tank: (x) => amplitude * Math.sin(ws * x + phase),
    magnetizing: () => 0,
    crAc: (x) => -100 * Math.cos(ws * x + phase),
  });
}
