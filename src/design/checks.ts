import type { Design } from './types.js';
import { effectiveTurnsRatio } from './transformer.js';
import { formatSi } from '../units/index.js';
import type { Loc, Reader } from './reader.js';

/** The design without name/file/devices: everything the physical checks look at. */
type Core = Omit<Design, 'name' | 'file' | 'devices'>;

const f = formatSi;
const g = (x: number): string => String(Number(x.toPrecision(3)));

/** Fixed switching frequencies with the key path each came from. */
function fixedFrequencies(d: Core, r: Reader): { fs: number; path: string }[] {
  const out: { fs: number; path: string }[] = [];
  if (d.operating.frequency !== 'regulate') {
    const single = r.seen.has('operating.frequency');
    d.operating.frequency.forEach((fs, i) => out.push({ fs, path: single ? 'operating.frequency' : `operating.frequency[${i}]` }));
  }
  d.operating.corners.forEach((c, i) => {
    if (c.frequency !== null) out.push({ fs: c.frequency, path: `operating.corners[${i}].frequency` });
  });
  return out;
}

/**
 * Cross-field physics checks on a design whose fields each parsed and passed their own limits.
 * Errors where the file cannot be simulated meaningfully, warnings where it can but looks wrong.
 * Formulas: docs/method.md#fha-inverter (dead-time factor), #normalised (fr, fp), #gain (Vo = M Vin_eff / n - V_drop), #zero-phase (fs < fp is capacitive at every load).
 */
export function checkPhysics(d: Core, r: Reader): void {
  const at = (path: string): Loc => r.seen.get(path) ?? { line: 0, column: 0 };
  const { lr, cr, lm } = d.tank;
  // the equivalent ideal transformer's ratio (k Np/Ns for an integrated tank)
  const n = effectiveTurnsRatio(d.tank.integrated, lr, lm, d.tank.turnsRatio);

  // An LLC tank needs Lm > Lr (Ln = Lm/Lr > 1); below that the design is almost surely swapped values.
  const tankPair = (lrV: number, lmV: number, path: string, what: string): void => {
    if (lmV <= lrV) {
      r.problem('error', 'implausible', path, at(path),
        `physically implausible${what}: Lm (${f(lmV, 'H')}) must exceed Lr (${f(lrV, 'H')}) for an LLC tank (Ln = Lm/Lr = ${g(lmV / lrV)})`,
        { expected: `Lm > ${f(lrV, 'H')}`, received: f(lmV, 'H') });
    }
  };
  tankPair(lr, lm, 'tank.lm', '');
  d.operating.corners.forEach((c, i) => {
    if (c.lr !== undefined || c.lm !== undefined) {
      const key = c.lm !== undefined ? 'lm' : 'lr';
      tankPair(c.lr ?? lr, c.lm ?? lm, `operating.corners[${i}].${key}`, ` in this corner`);
    }
  });
  const t = d.tolerances;
  if (t.corners !== 'nominal' && lm > lr && lm * (1 - t.lm) <= lr * (1 + t.lr)) {
    r.problem('warning', 'implausible', 'tolerances.lm', at('tolerances.lm'),
      `at the tolerance extremes Lm (${f(lm * (1 - t.lm), 'H')}) falls to or below Lr (${f(lr * (1 + t.lr), 'H')})`);
  }

  if (t.corners !== 'random') {
    for (const key of ['samples', 'seed', 'distribution', 'turnsRatio'] as const) {
      const seen = r.seen.get(`tolerances.${key}`);
      if (seen) r.problem('warning', 'implausible', `tolerances.${key}`, seen, `tolerances.${key} has an effect only with tolerances.corners: random`);
    }
  }

  const fr = 1 / (2 * Math.PI * Math.sqrt(lr * cr));
  const fp = 1 / (2 * Math.PI * Math.sqrt((lr + lm) * cr));
  if (fr < 1e3 || fr > 2e7) {
    r.problem('warning', 'implausible', 'tank.cr', at('tank.cr'),
      `the series resonance fr = 1/(2 pi sqrt(Lr Cr)) = ${f(fr, 'Hz')} is outside 1 kHz .. 20 MHz; check the unit prefixes of lr and cr`);
  }

  const td = d.switches.deadTime;
  const fixed = fixedFrequencies(d, r);
  const fastest = fixed.reduce((a, b) => (b.fs > a.fs ? b : a), { fs: 0, path: '' });
  if (fastest.fs > 0 && td >= 1 / (2 * fastest.fs)) {
    r.problem('error', 'range', 'switches.deadTime', at('switches.deadTime'),
      `dead time ${f(td, 's')} is not shorter than half the switching period at ${f(fastest.fs, 'Hz')} (${f(1 / (2 * fastest.fs), 's')}, from ${fastest.path})`,
      { expected: `< ${f(1 / (2 * fastest.fs), 's')}`, received: f(td, 's') });
  } else if (fastest.fs > 0 && td * fastest.fs > 0.1) {
    const x = Math.PI * fastest.fs * td;
    r.problem('warning', 'implausible', 'switches.deadTime', at('switches.deadTime'),
      `dead time ${f(td, 's')} is ${g(td * fastest.fs * 100)}% of the period at ${f(fastest.fs, 'Hz')}; FHA ignores it (the inverter fundamental shrinks by sin(pi fs td)/(pi fs td) = ${g(Math.sin(x) / x)})`);
  }
  for (const { fs, path } of fixed) {
    if (fs < fp) {
      r.problem('warning', 'implausible', path, at(path),
        `${f(fs, 'Hz')} is below fp = 1/(2 pi sqrt((Lr+Lm) Cr)) = ${f(fp, 'Hz')}: the tank input is capacitive at every load (no ZVS)`);
    } else if (fs > 10 * fr) {
      r.problem('warning', 'implausible', path, at(path),
        `${f(fs, 'Hz')} is more than 10 times fr = ${f(fr, 'Hz')}; check the unit prefix`);
    }
  }

  // Regulated corners: the tank gain needed for output.voltage, M = n V_rect / Vin_eff (docs/method.md#gain, #solving).
  const regulated = d.operating.frequency === 'regulate' ? d.operating.vin.map((v, i) => ({ vin: v, path: `operating.vin[${i}]` })) : [];
  d.operating.corners.forEach((c, i) => { if (c.frequency === null) regulated.push({ vin: c.vin, path: `operating.corners[${i}].vin` }); });
  const drops = d.topology.rectifier === 'full-bridge' ? 2 : 1;
  const vRect = d.output.voltage + drops * d.rectifier.forwardVoltage;
  const kb = d.topology.inverter === 'half-bridge' ? 0.5 : 1;
  for (const { vin, path } of regulated) {
    const m = (n * vRect) / (kb * vin);
    if (m < 0.3 || m > 3) {
      r.problem('warning', 'implausible', 'tank.turnsRatio', at('tank.turnsRatio'),
        `regulating to ${f(d.output.voltage, 'V')} at vin = ${f(vin, 'V')} (${path}) needs a tank gain M = n (Vo + drops) / Vin_eff = ${g(m)}, far from 1; check turnsRatio, output.voltage and topology.inverter`);
      break;
    }
  }
}
