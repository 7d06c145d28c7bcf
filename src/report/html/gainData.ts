/** Numbers behind the gain-against-frequency figure: FHA curves, zero-phase boundary, operating points. Pure. */
import { effectiveTurnsRatio } from '../../design/transformer.js';
import type { Design } from '../../design/types.js';
import { fhaGain, zeroPhaseFn } from '../../fha/gain.js';
import { acResistance, bridgeFactor, rectifierDrop, tankConstants } from '../../fha/predict.js';
import type { CornerResult, Results } from '../../results/types.js';
import { finite } from './format.js';
import { niceDomain } from './svg.js';

export interface LoadKey { label: string; load: number }
export interface OpPoint { fs: number; gain: number }

export interface GainPoint {
  id: string;
  status: string;
  /** Index into GainFigureData.loads. */
  load: number;
  fha: OpPoint | null;
  sim: OpPoint | null;
  /** The ideal time-domain model's operating point (absent or null without an ideal column). */
  ideal?: OpPoint | null;
  /**
   * A bench point (`run --measured`): its fs and the gain of its measured Vout by the same
   * definition as the models' (n (Vout + VF) / Vin,eff). Needs the design; absent otherwise.
   */
  measured?: OpPoint | null;
  /** The bench point's measured Vout, V, and its gap to the simulation ((measured - sim) / |sim|). */
  bench?: { vout: number; simGap: number | null };
}

export interface GainCurve {
  load: number;
  /** Gain on GainFigureData.grid; null where FHA gives none. */
  gain: (number | null)[];
  /** Envelope over the corners' tank tolerance sets, when they differ from the nominal tank. */
  band?: { lo: number[]; hi: number[] };
}

export interface GainPanel {
  vin: number;
  curves: GainCurve[];
  points: GainPoint[];
  /** Gain that output.voltage needs at this Vin (from the corners' FHA results). */
  target: number | null;
  /** Vout = gain * perGain - drop at this Vin (design known). */
  vout: { perGain: number; drop: number } | null;
}

export interface GainFigureData {
  hasDesign: boolean;
  loads: LoadKey[];
  panels: GainPanel[];
  /** Nominal tank's series and no-load resonances, Hz. */
  fr: number | null;
  fp: number | null;
  /** Zero-phase locus (fs, M(fs_zp)) over Q, nominal tank; null without design. */
  boundary: { fs: number[]; gain: number[] } | null;
  /** Frequencies the curves are evaluated at, Hz. */
  grid: number[];
  fsAxis: { d0: number; d1: number; ticks: number[] };
  gainAxis: { d0: number; d1: number; ticks: number[] };
}

/** Curve resolution (points per curve) and zero-phase locus resolution. */
const GRID_POINTS = 160;
const BOUNDARY_POINTS = 90;

const uniqSorted = (xs: number[]) => [...new Set(xs)].sort((a, b) => a - b);

function opPoint(fs: unknown, gain: unknown): OpPoint | null {
  const f = finite(fs);
  const g = finite(gain);
  return f !== null && g !== null && f > 0 ? { fs: f, gain: g } : null;
}

/** Loads by label, light to heavy (largest resistance first). */
function loadKeys(corners: CornerResult[]): LoadKey[] {
  const m = new Map<string, number>();
  for (const c of corners) if (!m.has(String(c.inputs.loadLabel))) m.set(String(c.inputs.loadLabel), finite(c.inputs.load) ?? 0);
  return [...m].map(([label, load]) => ({ label, load })).sort((a, b) => b.load - a.load);
}

/**
 * FHA gain at each grid frequency for one load resistance and tank, at the Q of the output set point:
 * Q = Zr / Rac with Rac = 8 n^2 (Vo + drop) RL / (pi^2 Vo) (docs/method.md#fha-rectifier, #gain). This is the
 * Q predictCorner uses when regulating, so a regulated corner's FHA point lies on its curve; at a
 * fixed frequency the corner's own Vo shifts Q only through the drop term.
 */
export function gainCurve(design: Design, load: number, tank: { lr: number; cr: number; lm: number }, grid: number[]): (number | null)[] {
  const { fr, zr, ln } = tankConstants(tank);
  const q = zr / acResistance(effectiveTurnsRatio(design.tank.integrated, design.tank.lr, design.tank.lm, design.tank.turnsRatio), design.output.voltage, rectifierDrop(design), load);
  return grid.map((fs) => finite(fhaGain(fs / fr, q, ln)));
}

/** Zero-phase boundary of the nominal tank as a locus over Q from 1e-3 to 30 (docs/method.md#zero-phase). */
export function zeroPhaseLocus(fr: number, ln: number, points = BOUNDARY_POINTS): { fs: number[]; gain: number[] } {
  const fs: number[] = [];
  const gain: number[] = [];
  for (let i = 0; i < points; i++) {
    const q = 1e-3 * (3e4) ** (i / (points - 1));
    const fn = zeroPhaseFn(q, ln);
    fs.push(fn * fr);
    gain.push(fhaGain(fn, q, ln));
  }
  return { fs, gain };
}

function band(curves: (number | null)[][]): { lo: number[]; hi: number[] } {
  const at = (i: number) => curves.map((c) => c[i]).filter((v): v is number => v !== null);
  return {
    lo: curves[0]!.map((_, i) => Math.min(...at(i))),
    hi: curves[0]!.map((_, i) => Math.max(...at(i))),
  };
}

/**
 * A bench point on the gain axes: M = (Vout + drop) / perGain, the inverse of the panel's Vout scale,
 * so the measured gain uses the same n, VF and Vin,eff as the FHA and simulated gains. Without the
 * design there is no scale and no marker (a guessed drop would draw a plausible wrong point).
 */
function benchPoint(m: NonNullable<CornerResult['measured']>, scale: { perGain: number; drop: number } | null): Pick<GainPoint, 'measured' | 'bench'> {
  const vout = finite(m.vout);
  const gain = scale && vout !== null && scale.perGain > 0 ? (vout + scale.drop) / scale.perGain : null;
  return { measured: opPoint(m.fs, gain), ...(vout !== null ? { bench: { vout, simGap: finite(m.errors?.sim?.vout) } } : {}) };
}

/** Everything the gain figure draws, from results and (when known) the design. */
export function gainFigureData(results: Results, design?: Design): GainFigureData {
  const corners = results.corners;
  const loads = loadKeys(corners);
  const vins = uniqSorted(corners.map((c) => finite(c.inputs.vin)).filter((v): v is number => v !== null));
  const nominal = corners.find((c) => c.inputs.tolerance?.lr === 0 && c.inputs.tolerance?.cr === 0 && c.inputs.tolerance?.lm === 0) ?? corners[0];
  const tc = design ? tankConstants(design.tank) : null;
  const fr = tc?.fr ?? finite(nominal?.fha.fr);
  const fp = tc?.fp ?? finite(nominal?.fha.fp);

  const voutScale = (vin: number) => (design
    ? { perGain: (bridgeFactor(design) * vin) / effectiveTurnsRatio(design.tank.integrated, design.tank.lr, design.tank.lm, design.tank.turnsRatio), drop: rectifierDrop(design) }
    : null);
  const points = (vin: number): GainPoint[] => corners.filter((c) => c.inputs.vin === vin).map((c) => ({
    id: c.id, status: c.status, load: loads.findIndex((l) => l.label === String(c.inputs.loadLabel)),
    fha: opPoint(c.fha.fs, c.fha.gain), sim: c.sim ? opPoint(c.sim.fs, c.sim.gain) : null,
    ideal: c.ideal ? opPoint(c.ideal.fs, c.ideal.gain) : null,
    ...(c.measured ? benchPoint(c.measured, voutScale(vin)) : {}),
  }));
  const all = vins.flatMap(points);
  const pfs = all.flatMap((p) => [p.fha?.fs, p.sim?.fs, p.ideal?.fs, p.measured?.fs]).filter((v): v is number => v !== undefined);
  const pg = all.flatMap((p) => [p.fha?.gain, p.sim?.gain, p.ideal?.gain, p.measured?.gain]).filter((v): v is number => v !== undefined);
  // From 0.6 fr (or just below fp) to 1.4 fr, widened to every operating point.
  const lo = Math.min(fr ? Math.max(0.6 * fr, 0.95 * (fp ?? 0)) : Infinity, 0.92 * Math.min(...pfs));
  const hi = Math.max(fr ? 1.4 * fr : -Infinity, 1.08 * Math.max(...pfs));
  const fsAxis = Number.isFinite(lo) && Number.isFinite(hi) ? niceDomain(lo, hi, 6) : niceDomain(0, 1, 5);
  const grid = Array.from({ length: GRID_POINTS }, (_, i) => fsAxis.d0 + ((fsAxis.d1 - fsAxis.d0) * i) / (GRID_POINTS - 1));

  const panels: GainPanel[] = vins.map((vin) => {
    const here = corners.filter((c) => c.inputs.vin === vin);
    const target = finite(here[0]?.fha.gainTarget);
    if (!design) return { vin, curves: [], points: points(vin), target, vout: null };
    const curves: GainCurve[] = loads.map((l, li) => ({ l, li })).filter(({ l }) => here.some((c) => String(c.inputs.loadLabel) === l.label))
      .map(({ l, li }) => {
        const gain = gainCurve(design, l.load, design.tank, grid);
        const tanks = new Map<string, { lr: number; cr: number; lm: number }>();
        for (const c of here) if (String(c.inputs.loadLabel) === l.label) tanks.set(`${c.inputs.lr}|${c.inputs.cr}|${c.inputs.lm}`, { lr: c.inputs.lr, cr: c.inputs.cr, lm: c.inputs.lm });
        tanks.delete(`${design.tank.lr}|${design.tank.cr}|${design.tank.lm}`);
        if (tanks.size === 0) return { load: li, gain };
        return { load: li, gain, band: band([gain, ...[...tanks.values()].map((t) => gainCurve(design, l.load, t, grid))]) };
      });
    return { vin, curves, points: points(vin), target, vout: voutScale(vin) };
  });

  const curveMin = Math.min(...panels.flatMap((p) => p.curves.flatMap((c) => c.gain.filter((g): g is number => g !== null))));
  const targets = panels.map((p) => p.target).filter((t): t is number => t !== null);
  const gLo = Math.max(0, 0.95 * Math.min(...pg, ...targets, Number.isFinite(curveMin) ? curveMin : Infinity, 1));
  const gHi = Math.max(1.3, 1.2 * Math.max(...pg, ...targets, 0));
  return {
    hasDesign: Boolean(design), loads, panels, fr, fp,
    boundary: design && tc ? zeroPhaseLocus(tc.fr, tc.ln) : null,
    grid, fsAxis, gainAxis: niceDomain(gLo, gHi, 6),
  };
}
