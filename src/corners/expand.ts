import { effectiveTurnsRatio } from '../design/transformer.js';
import type { Design, ExplicitCorner, LoadSpec } from '../design/types.js';
import type { Corner, TolSide } from './types.js';
import { sampleCorners } from './random.js';
import { idNumber, num } from '../units/index.js';
import { matchesPattern } from './match.js';

/** Load resistance in ohm: %, W and A are converted at output.voltage; ohm is used as is. */
export function loadResistance(spec: LoadSpec, design: Design): number {
  const v = design.output.voltage;
  switch (spec.kind) {
    case 'percent': return (v * v) / (spec.value * design.operating.ratedPower);
    case 'watt': return (v * v) / spec.value;
    case 'ampere': return v / spec.value;
    case 'ohm': return spec.value;
  }
}

export { idNumber };

export function loadLabel(spec: LoadSpec): string {
  switch (spec.kind) {
    case 'percent': return `${num(spec.value * 100, 6)}%`;
    case 'watt': return `${num(spec.value, 6)} W`;
    case 'ampere': return `${num(spec.value, 6)} A`;
    case 'ohm': return `${num(spec.value, 6)} ohm`;
  }
}

function loadIdPart(spec: LoadSpec): string {
  const unit = { percent: 'pct', watt: 'w', ampere: 'a', ohm: 'ohm' }[spec.kind];
  return `${idNumber(spec.kind === 'percent' ? spec.value * 100 : spec.value)}${unit}`;
}

function freqIdPart(fs: number | null): string {
  return fs === null ? 'reg' : `f${idNumber(fs / 1e3)}k`;
}

const SIDE_CODE: Record<TolSide, string> = { [-1]: 'L', 0: 'N', 1: 'H' };

function tolIdPart(t: Corner['tolerance']): string {
  if (t.lr === 0 && t.cr === 0 && t.lm === 0) return 'nom';
  return `lr${SIDE_CODE[t.lr]}-cr${SIDE_CODE[t.cr]}-lm${SIDE_CODE[t.lm]}`;
}

/** Tolerance sets in a fixed order: nominal first, then every low/high combination (lr, cr, lm): 9 sets, fewer when a tolerance is 0 (that element stays nominal). */
export function toleranceSets(design: Design): Corner['tolerance'][] {
  const sets: Corner['tolerance'][] = [{ lr: 0, cr: 0, lm: 0 }];
  if (design.tolerances.corners === 'nominal') return sets;
  const sides = (tol: number): TolSide[] => (tol > 0 ? [-1, 1] : [0]);
  for (const lr of sides(design.tolerances.lr))
    for (const cr of sides(design.tolerances.cr))
      for (const lm of sides(design.tolerances.lm))
        if (lr !== 0 || cr !== 0 || lm !== 0) sets.push({ lr, cr, lm });
  return sets;
}

const NOMINAL: Corner['tolerance'] = { lr: 0, cr: 0, lm: 0 };

/**
 * A corner's turnsRatio is the equivalent ideal transformer's, which every model uses; an
 * integrated tank's entered winding ratio Np/Ns is kept beside it (see design/transformer.ts).
 */
function turns(design: Design, v: { lr: number; lm: number }, winding: number): Pick<Corner, 'turnsRatio' | 'windingRatio'> {
  if (!design.tank.integrated) return { turnsRatio: winding };
  return { turnsRatio: effectiveTurnsRatio(true, v.lr, v.lm, winding), windingRatio: winding };
}

/** tolId replaces the tolerance-set part of the id (a Monte Carlo sample's "s0017"). */
function makeCorner(design: Design, vin: number, load: LoadSpec, fs: number | null,
  tol: Corner['tolerance'], values: { lr: number; cr: number; lm: number }, prefix: string, tolId = tolIdPart(tol)): Corner {
  const r = loadResistance(load, design);
  const v = design.output.voltage;
  return {
    id: `${prefix}v${idNumber(vin)}_${loadIdPart(load)}_${freqIdPart(fs)}_${tolId}`,
    vin, load: r, loadLabel: loadLabel(load), iout: v / r, pout: (v * v) / r, fs,
    ...values, ...turns(design, values, design.tank.turnsRatio), tolerance: tol,
  };
}

/**
 * Every corner of a design: vin x load x frequency x tolerance set (in that nesting order; with
 * corners: random, x sample instead of tolerance set), then the explicit `operating.corners`.
 * Ids derive from the values (a sample's from its number), so the same file gives the same ids
 * in the same order on every run; a repeated id gets a numeric suffix.
 */
export function expandCorners(design: Design): Corner[] {
  const out: Corner[] = [];
  const { tank, tolerances: tl } = design;
  const freqs = design.operating.frequency === 'regulate' ? [null] : design.operating.frequency;
  const sets = toleranceSets(design);
  const samples = tl.corners === 'random' ? sampleCorners(design) : [];
  for (const vin of design.operating.vin)
    for (const load of design.operating.load)
      for (const fs of freqs) {
        if (tl.corners === 'random') {
          for (const s of samples) {
            const c = makeCorner(design, vin, load, fs, NOMINAL, s.values, '', s.suffix);
            out.push({ ...c, ...turns(design, s.values, s.turnsRatio), sample: s.index, deviation: s.deviation });
          }
          continue;
        }
        for (const tol of sets) {
          const values = { lr: tank.lr * (1 + tol.lr * tl.lr), cr: tank.cr * (1 + tol.cr * tl.cr), lm: tank.lm * (1 + tol.lm * tl.lm) };
          out.push(makeCorner(design, vin, load, fs, tol, values, ''));
        }
      }
  design.operating.corners.forEach((x: ExplicitCorner, i) => {
    const values = { lr: x.lr ?? tank.lr, cr: x.cr ?? tank.cr, lm: x.lm ?? tank.lm };
    out.push(makeCorner(design, x.vin, x.load, x.frequency, { lr: 0, cr: 0, lm: 0 }, values, `x${i + 1}_`));
  });
  const seen = new Map<string, number>();
  for (const c of out) {
    const k = (seen.get(c.id) ?? 0) + 1;
    seen.set(c.id, k);
    if (k > 1) c.id = `${c.id}-${k}`;
  }
  return out;
}

/**
 * Keep corners whose id matches `pattern` (see `matchesPattern`: `*` and `?` wildcards match the
 * whole id; a pattern without them matches a part of it). No pattern keeps every corner.
 */
export function filterCorners(corners: Corner[], pattern: string | undefined): Corner[] {
  if (!pattern) return corners;
  return corners.filter((c) => matchesPattern(pattern, c.id));
}
