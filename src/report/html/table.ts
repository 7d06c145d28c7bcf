/** The side-by-side FHA | ideal | sim | error table, sortable and filterable by the page script. Pure. */
import type { ComparisonRow, CornerResult, Results } from '../../results/types.js';
import { esc, rowAnchor, waveAnchor } from './escape.js';
import { finite, num, pct, sig } from './format.js';
import { knownStatus, STATUS_ORDER, STATUS_STYLE, statusText } from './palette.js';

interface MetricColumn { key: string; label: string; unit: string; scale: number; digits: number }

/** Numeric metrics shown as FHA | ideal | sim | error groups, in column order. */
export const TABLE_METRICS: MetricColumn[] = [
  { key: 'fs', label: 'fs', unit: 'kHz', scale: 1e3, digits: 4 },
  { key: 'gain', label: 'gain M', unit: '', scale: 1, digits: 4 },
  { key: 'vout', label: 'Vout', unit: 'V', scale: 1, digits: 4 },
  { key: 'tankCurrentRms', label: 'Ir rms', unit: 'A', scale: 1, digits: 3 },
  { key: 'tankCurrentPeak', label: 'Ir peak', unit: 'A', scale: 1, digits: 3 },
  { key: 'crVoltagePeak', label: 'VCr peak', unit: 'V', scale: 1, digits: 4 },
  { key: 'switchTurnOffCurrent', label: 'switch I off', unit: 'A', scale: 1, digits: 3 },
  { key: 'diodeCurrentPeak', label: 'diode peak', unit: 'A', scale: 1, digits: 3 },
];

/** Readable metric names for reasons and the summary. */
export const METRIC_NAMES: Record<string, string> = {
  fs: 'switching frequency', vout: 'output voltage', gain: 'gain', tankCurrentRms: 'tank current rms',
  tankCurrentPeak: 'tank current peak', magnetizingCurrentPeak: 'magnetizing current peak', switchCurrentRms: 'switch current rms',
  switchTurnOffCurrent: 'switch turn-off current', diodeCurrentAvg: 'diode current avg', diodeCurrentPeak: 'diode current peak',
  diodeCurrentRms: 'diode current rms', outputRippleCurrentRms: 'output capacitor ripple current', crVoltagePeak: 'Cr voltage peak',
  diodeReverseVoltage: 'diode reverse voltage', zvs: 'ZVS', zcs: 'rectifier ZCS', region: 'tank region',
};

/** Columns before the metric triples and after them; indices are what the sort buttons carry. */
const LEAD = ['corner', 'Vin V', 'load', 'status'];
const TAIL = ['ZVS<br><small>FHA/sim</small>', 'ZCS<br><small>FHA/sim</small>', 'region<br><small>FHA/sim</small>', 'mode', 'notes'];

const sortButton = (col: number, text: string) => `<button type="button" data-col="${col}">${text}</button>`;
const FLAG = '<span class="mark" aria-label="beyond tolerance">▲</span>';
const ODD = '<span class="mark" title="the simulation contradicts the ideal time-domain model: suspect the design values, netlist or measurement">?</span>';
/** Cells per metric group: FHA, ideal (time-domain model), sim, error. */
const GROUP = ['FHA', 'ideal', 'sim', 'err'];

function header(): string {
  const top = [
    ...LEAD.map((h, i) => `<th rowspan="2" scope="col">${sortButton(i, esc(h))}</th>`),
    ...TABLE_METRICS.map((m) => `<th colspan="${GROUP.length}" scope="colgroup" class="grp">${esc(m.label)}${m.unit ? ` <small>${esc(m.unit)}</small>` : ''}</th>`),
    ...TAIL.map((h, i) => `<th rowspan="2" scope="col">${sortButton(LEAD.length + GROUP.length * TABLE_METRICS.length + i, h)}</th>`),
  ];
  const sub = TABLE_METRICS.flatMap((_, k) => GROUP.map((h, j) =>
    `<th scope="col"${j === 0 ? ' class="grp"' : ''}${h === 'ideal' ? ' title="ideal time-domain model"' : ''}>${sortButton(LEAD.length + GROUP.length * k + j, h)}</th>`));
  return `<thead><tr>${top.join('')}</tr><tr>${sub.join('')}</tr></thead>`;
}

function triple(c: CornerResult, m: MetricColumn): string {
  const r = c.comparison.find((x) => x.metric === m.key);
  const f = r ? r.fha : (c.fha as unknown as Record<string, unknown>)[m.key];
  const s = r ? r.sim : c.sim ? (c.sim as unknown as Record<string, unknown>)[m.key] : null;
  const flagged = r?.verdict === 'diverged';
  const err = r ? pct(r.error) : '';
  const tip = flagged ? ` title="${esc(`${r!.reason ?? 'beyond tolerance'}${r!.tolerance !== null ? ` (tolerance ${num(r!.tolerance * 100, 3)} %)` : ''}`)}"` : '';
  const abs = r && finite(r.error) !== null ? ` data-s="${Math.abs(r.error!)}"` : '';
  const errCell = flagged
    ? `<td class="err flag"${abs}${tip}>${esc(err || 'n/a')}${FLAG}${r!.unexpectedSign ? ODD : ''}</td>`
    : `<td class="err${r?.verdict === 'info' ? ' info' : ''}"${abs}>${esc(err)}</td>`;
  const i = c.ideal ? (c.ideal as unknown as Record<string, unknown>)[m.key] : null;
  return `<td class="grp">${esc(sig(f, m.digits, m.scale))}</td><td class="ideal">${esc(sig(i, m.digits, m.scale))}</td><td>${esc(sig(s, m.digits, m.scale))}</td>${errCell}`;
}

function show(v: ComparisonRow['fha'], metric: string): string {
  if (v === null || v === undefined) return '–';
  if (typeof v === 'boolean') return v ? 'ok' : 'lost';
  if (metric === 'region') return v === 'inductive' ? 'ind' : v === 'capacitive' ? 'cap' : String(v);
  return String(v);
}

function pair(c: CornerResult, metric: 'zvs' | 'zcs' | 'region'): string {
  const r = c.comparison.find((x) => x.metric === metric);
  let s = r ? r.sim : null;
  if (metric === 'zvs' && c.sim?.zvsState === 'partial') s = 'partial';
  const text = `${show(r ? r.fha : c.fha[metric], metric)}/${show(s, metric)}`;
  if (r?.verdict !== 'diverged') return `<td class="pair">${esc(text)}</td>`;
  return `<td class="pair flag" title="${esc(r.reason ?? 'FHA and simulation disagree')}">${esc(text)}${FLAG}</td>`;
}

function notes(c: CornerResult): string {
  const items = [
    ...c.divergences.map((d) => `<li><b>${esc(METRIC_NAMES[d.metric] ?? d.metric)}</b>${d.error !== null ? ` ${esc(pct(d.error))}` : ''}${d.cause ? ` [${esc(d.cause)}]` : ''}: ${esc(d.reason || 'beyond tolerance')}${d.unexpectedSign ? ' <i>(the simulation contradicts the ideal model: suspect the design values, netlist or measurement)</i>' : ''}</li>`),
    ...(c.ideal === null && c.idealReason ? [`<li><b>no ideal column</b>: ${esc(c.idealReason)}</li>`] : []),
    ...(c.failure ? [`<li><b>${esc(c.failure.kind)}</b>: ${esc(c.failure.message)}${c.failure.detail ? `<pre>${esc(c.failure.detail)}</pre>` : ''}</li>`] : []),
    ...(c.sim && !c.sim.settled ? [`<li><b>not settled</b>: output not proven within ${esc(pct(c.sim.settleError, 2))} of its steady value (charge balance and window halves)</li>`] : []),
    ...(c.fha.warnings ?? []).map((w) => `<li><b>FHA note</b>: ${esc(w)}</li>`),
  ];
  if (!items.length) return '<td class="notes"></td>';
  const what = [c.divergences.length ? `${c.divergences.length} diverged` : '', c.failure ? 'failure' : '', c.fha.warnings?.length ? `${c.fha.warnings.length} FHA note${c.fha.warnings.length > 1 ? 's' : ''}` : '']
    .filter(Boolean).join(', ') || 'details';
  return `<td class="notes" data-s="${c.divergences.length}"><button type="button" class="more" aria-expanded="false">${esc(what)}</button><ul>${items.join('')}</ul></td>`;
}

function row(c: CornerResult, waveIds: Set<string>): string {
  const st = knownStatus(c.status);
  const wave = waveIds.has(c.id) ? ` <a class="wl" href="#${waveAnchor(c.id)}" title="waveforms">≋</a>` : '';
  return `<tr id="${rowAnchor(c.id)}" data-status="${esc(c.status)}"><th scope="row">${esc(c.id)}${wave}</th>`
    + `<td>${esc(num(c.inputs.vin))}</td><td data-s="${finite(c.inputs.pout) ?? ''}">${esc(c.inputs.loadLabel)}</td>`
    + `<td class="st st-${st ?? 'unknown'}" data-s="${st ? STATUS_ORDER.indexOf(st) : 9}">${esc(statusText(c.status))}</td>`
    + TABLE_METRICS.map((m) => triple(c, m)).join('')
    + pair(c, 'zvs') + pair(c, 'zcs') + pair(c, 'region') + `<td class="pair">${esc(c.sim?.mode ?? '')}</td>${notes(c)}</tr>`;
}

function filter(results: Results): string {
  const counts = new Map<string, number>();
  for (const c of results.corners) counts.set(String(c.status), (counts.get(String(c.status)) ?? 0) + 1);
  const boxes = STATUS_ORDER.filter((s) => counts.has(s)).map((s) =>
    `<label class="st-${s}"><input type="checkbox" data-status="${s}" data-n="${counts.get(s)}" checked> ${STATUS_STYLE[s].symbol} ${STATUS_STYLE[s].label} (${counts.get(s)})</label>`);
  return `<fieldset class="filter" id="cmp-filter"><legend>Show status</legend>${boxes.join('')}<output id="cmp-count">${results.corners.length} of ${results.corners.length} corners shown</output></fieldset>`;
}

/** Section body: the status filter and the table (one row per corner, id anchors `c-<id>`). */
export function renderTable(results: Results, waveIds: Set<string>): string {
  return `${filter(results)}<p class="caption">FHA, simulated value and error (sim − FHA)/|FHA| per metric. ${FLAG} marks an error beyond its tolerance (hover for the reason, or click the notes); ? marks an error whose sign FHA theory rules out. ZVS/ZCS/region as FHA/sim. Click a column header to sort (error columns sort by size); ≋ links to the waveforms.</p>`
    + `<div class="tablewrap"><table class="cmp" id="cmp">${header()}<tbody>${results.corners.map((c) => row(c, waveIds)).join('')}</tbody></table></div>`;
}
