/**
 * The measured-points section (`run --measured`): per bench point the measured values beside FHA,
 * the ideal model and the simulation with each one's gap, largest simulation gap first, then the
 * pattern hint and what a gap can mean. Pure.
 */
import type { MeasuredMetric } from '../../measured/compare.js';
import type { CornerResult, Results } from '../../results/types.js';
import { byLargestGap, MEASURED_CAUTION } from '../measured.js';
import { benchAnchor, esc, rowAnchor } from './escape.js';
import { finite, num, pct, pctAbs, sig } from './format.js';

/** Measured metrics in row order, with their display name, unit and significant digits. */
export const BENCH_METRICS: { key: MeasuredMetric; label: string; unit: string; digits: number }[] = [
  { key: 'vout', label: 'Vout', unit: 'V', digits: 4 },
  { key: 'tankCurrentRms', label: 'tank current rms', unit: 'A', digits: 3 },
  { key: 'crVoltagePeak', label: 'Cr voltage peak', unit: 'V', digits: 4 },
  { key: 'switchTurnOffCurrent', label: 'switch turn-off current', unit: 'A', digits: 3 },
];

const MODELS = ['fha', 'ideal', 'sim'] as const;
const FLAG = '<span class="mark" aria-label="beyond compare.measured">▲</span>';

function modelValue(c: CornerResult, model: (typeof MODELS)[number], key: MeasuredMetric): unknown {
  const m = c[model] as unknown as Record<string, unknown> | null | undefined;
  return m ? m[key] : null;
}

function verdict(within: boolean | null, tolerance: number): string {
  if (within === null) return '<td class="st" rowspan="ROWS">– no simulation</td>';
  return within ? `<td class="st st-ok" rowspan="ROWS">✓ within ${esc(pctAbs(tolerance))}</td>`
    : `<td class="st st-diverged" rowspan="ROWS">✗ sim misses by more than ${esc(pctAbs(tolerance))}</td>`;
}

const percent = (x: unknown) => (finite(x) === null ? '–' : `${(finite(x)! * 100).toFixed(1)} %`);

/** One bench point: a row per measured metric, the point's own cells spanning them. */
function pointRows(c: CornerResult): string {
  const m = c.measured!;
  const keys = BENCH_METRICS.filter((k) => finite(m[k.key]) !== null);
  const lead = `<th scope="row" rowspan="ROWS"><a href="#${rowAnchor(c.id)}">line ${esc(m.line)}</a><br><small>${esc(c.id)}</small></th>`
    + `<td rowspan="ROWS">${esc(num(m.vin))}</td><td rowspan="ROWS">${esc(c.inputs.loadLabel)}</td><td rowspan="ROWS">${esc(num(m.fs, 4, 1e3))}</td>`;
  const rows = keys.map((k, i) => {
    const cells = MODELS.map((model) => {
      const gap = m.errors[model]?.[k.key];
      const miss = model === 'sim' && finite(gap) !== null && Math.abs(gap!) > m.tolerance;
      return `<td class="grp">${esc(sig(modelValue(c, model, k.key), k.digits))}</td><td class="err${miss ? ' flag' : ''}">${esc(pct(gap))}${miss ? FLAG : ''}</td>`;
    }).join('');
    const metric = `<td class="metric">${esc(k.label)}${k.unit ? ` <small>${esc(k.unit)}</small>` : ''}</td><td class="grp meas">${esc(sig(m[k.key], k.digits))}</td>`;
    const tail = i === 0
      ? `${verdict(m.within, m.tolerance)}<td rowspan="ROWS">${percent(m.efficiency)}</td><td rowspan="ROWS">${percent(m.simEfficiency)}</td><td class="notes" rowspan="ROWS">${esc(m.note ?? '')}</td>` : '';
    return `<tr${i === 0 ? ` id="${benchAnchor(c.id)}"` : ''} data-within="${m.within === null ? 'none' : String(m.within)}">${i === 0 ? lead : ''}${metric}${cells}${tail}</tr>`;
  });
  return rows.join('').replaceAll('rowspan="ROWS"', `rowspan="${keys.length}"`);
}

function header(): string {
  const col = (t: string, extra = '') => `<th scope="col"${extra}>${t}</th>`;
  return `<thead><tr>${col('point')}${col('Vin V')}${col('load')}${col('fs kHz')}${col('metric')}${col('measured', ' class="grp"')}`
    + `${col('FHA', ' class="grp"')}${col('gap')}${col('ideal', ' class="grp" title="ideal time-domain model"')}${col('gap')}${col('sim', ' class="grp"')}${col('gap')}`
    + `${col('simulation against the bench')}${col('efficiency<br><small>bench</small>')}${col('efficiency<br><small>sim, conduction only</small>')}${col('note')}</tr></thead>`;
}

/** Section body; empty when the run had no measured points. */
export function renderMeasuredSection(results: Results): string {
  const r = results.measured;
  const corners = byLargestGap(results);
  if (!r || corners.length === 0) return '';
  const intro = `<p class="caption">Bench points from <code>${esc(r.file)}</code>, each simulated at its measured fs, input voltage and load with the nominal tank. `
    + `gap = (measured − model) / |model|: −3 % means the bench read 3 % below the model. ${FLAG} marks a simulation gap beyond compare.measured (${esc(pctAbs(r.tolerance))}). `
    + 'Largest simulation gap in Vout first; each point links to its row in the side-by-side table. On the gain plot the bench points are the filled triangles.</p>';
  const count = `<p><strong>${r.missed} of ${r.points}</strong> point${r.points === 1 ? '' : 's'} missed by the simulation (beyond ${esc(pctAbs(r.tolerance))}).</p>`;
  const hint = r.hint ? `<p class="notice"><strong>Pattern:</strong> ${esc(r.hint.message)}.</p>`
    : '<p class="notice"><strong>Pattern:</strong> none: the simulation gaps in Vout show no consistent offset, nor a trend with fs or load.</p>';
  const caution = `<p class="caution"><strong>What a gap can mean.</strong> ${esc(MEASURED_CAUTION.replace(/\n/g, ' '))} `
    + 'A consistent gap that follows the switching frequency points at Lm, Cr or Lr (they set the gain curve\'s shape); one that follows the load points at the rectifier drop and the winding, switch and trace resistances; a uniform offset points at the turns ratio or the instruments.</p>';
  return `${intro}${count}${hint}<div class="tablewrap"><table class="cmp bench" id="bench">${header()}<tbody>${corners.map(pointRows).join('')}</tbody></table></div>${caution}`;
}
