import type { CornerResult, Results } from '../results/types.js';
import { grid } from './table.js';

const num = (x: number | null | undefined, digits = 4) => (x === null || x === undefined || !Number.isFinite(x) ? '-' : Number(x.toPrecision(digits)).toString());
const pct = (e: number | undefined) => (e === undefined ? '' : `${e >= 0 ? '+' : ''}${(e * 100).toFixed(1)}%`);

/** What a gap between the bench and the models can mean; printed under every measured table. */
export const MEASURED_CAUTION = 'A gap between bench and models can come from losses and parasitics the models leave out\n'
  + '(switching, core and winding AC losses, layout inductance), probe and instrument error, temperature,\n'
  + 'or a tank value that differs from the design file. The simulated efficiency counts conduction\n'
  + 'losses of the modelled parts only.';

/** Measured corners, largest |sim gap| in Vout first (no simulation: last). */
export function byLargestGap(results: Results): CornerResult[] {
  const gap = (c: CornerResult) => Math.abs(c.measured?.errors.sim?.vout ?? -1);
  return results.corners.filter((c) => c.measured).sort((a, b) => gap(b) - gap(a));
}

/**
 * The measured-points table of `tankcheck run --measured`: per point the measured Vout beside FHA,
 * the ideal model and the simulation with each one's gap ((measured - model) / model), the
 * efficiencies, and `*` where the simulation misses the point by more than compare.measured.
 */
export function renderMeasuredTable(results: Results): string {
  const corners = byLargestGap(results);
  if (corners.length === 0 || !results.measured) return '';
  const head = ['measured point', 'Vin V', 'load', 'fs kHz', 'Vout meas', 'FHA', 'gap', 'ideal', 'gap', 'sim', 'gap', 'eff meas', 'eff sim'];
  const rows = corners.map((c) => {
    const m = c.measured!;
    const miss = m.within === false ? '*' : '';
    return [`line ${m.line}`, num(m.vin), c.inputs.loadLabel, num(m.fs / 1e3), num(m.vout),
      num(c.fha.vout), pct(m.errors.fha?.vout), num(c.ideal?.vout), pct(m.errors.ideal?.vout), num(c.sim?.vout), `${pct(m.errors.sim?.vout)}${miss}`,
      m.efficiency === undefined ? '-' : `${(m.efficiency * 100).toFixed(1)}%`, m.simEfficiency === null ? '-' : `${(m.simEfficiency * 100).toFixed(1)}%`];
  });
  const r = results.measured;
  const lines = [`\nMeasured points (${r.file}; gap = (measured - model) / model; * beyond compare.measured ${(r.tolerance * 100).toFixed(0)} %):\n`, grid(head, rows)];
  lines.push(`${r.missed} of ${r.points} points missed by the simulation.`);
  if (r.hint) lines.push(`Pattern: ${r.hint.message}.`);
  lines.push(MEASURED_CAUTION, '');
  return lines.join('\n');
}
