/** Corner map: a Vin x load grid per tank tolerance set, verdict as symbol + text + colour. Pure. */
import type { Design } from '../../design/types.js';
import type { CornerResult, CornerStatus, Results } from '../../results/types.js';
import { esc, rowAnchor } from './escape.js';
import { eng, num } from './format.js';
import { knownStatus, STATUS_STYLE, statusText } from './palette.js';
import { limitText } from './limits.js';

/** Worst first: the cell colour follows the worst corner in it. */
const SEVERITY: CornerStatus[] = ['failed', 'outside-limits', 'diverged', 'not-settled', 'unreachable', 'ok', 'predicted'];
/** More corners than this in one cell are shown as counts. */
const CELL_LIST_MAX = 4;

const diverges = (c: CornerResult, metric: string) => c.comparison.some((r) => r.metric === metric && r.verdict === 'diverged');

/** ZVS state as text: simulated when there is a simulation (FHA disagreement noted), else FHA's. */
export function zvsText(c: CornerResult): string {
  if (c.sim) {
    const state = c.sim.zvsState ?? (c.sim.zvs ? 'zvs' : 'hard');
    const t = state === 'zvs' ? 'ZVS ok' : state === 'partial' ? 'ZVS partial' : 'ZVS lost';
    return diverges(c, 'zvs') ? `${t} (FHA: ${c.fha.zvs ? 'ok' : 'lost'})` : t;
  }
  return c.fha.zvs === null || c.fha.zvs === undefined ? 'ZVS n/a' : `ZVS ${c.fha.zvs ? 'ok' : 'lost'}`;
}

/** Rectifier ZCS as text, same rules as zvsText. */
export function zcsText(c: CornerResult): string {
  if (c.sim) {
    const t = c.sim.zcs ? 'ZCS ok' : 'ZCS lost';
    return diverges(c, 'zcs') ? `${t} (FHA: ${c.fha.zcs ? 'ok' : 'lost'})` : t;
  }
  return c.fha.zcs === null || c.fha.zcs === undefined ? 'ZCS n/a' : `ZCS ${c.fha.zcs ? 'ok' : 'lost'}`;
}

function worst(cs: CornerResult[]): string {
  const known = cs.map((c) => knownStatus(c.status)).filter((s): s is CornerStatus => s !== null);
  return SEVERITY.find((s) => known.includes(s)) ?? 'unknown';
}

function item(c: CornerResult, withFs: boolean): string {
  const n = c.divergences.length;
  const fs = withFs ? `<b>${c.inputs.fs === null ? 'regulated' : `${num(c.inputs.fs, 4, 1e3)} kHz`}</b> ` : '';
  return `<a href="#${rowAnchor(c.id)}" title="${esc(c.id)}">${fs}<span class="v">${esc(statusText(c.status))}${n ? ` (${n})` : ''}</span>`
    + `<span class="sw">${c.sim ? '' : 'FHA: '}${esc(zvsText(c))} · ${esc(zcsText(c))}</span>`
    + `${c.checks?.length ? `<span class="lim">${esc(limitText(c))}</span>` : ''}</a>`;
}

function cell(cs: CornerResult[]): string {
  if (cs.length === 0) return '<td class="empty">–</td>';
  const cls = `st-${worst(cs)}`;
  if (cs.length <= CELL_LIST_MAX) return `<td class="${cls}">${cs.map((c) => item(c, cs.length > 1)).join('')}</td>`;
  const counts = new Map<string, number>();
  for (const c of cs) counts.set(String(c.status), (counts.get(String(c.status)) ?? 0) + 1);
  const text = [...counts].map(([s, k]) => `${esc(statusText(s))}: ${k}`).join('<br>');
  return `<td class="${cls}"><a href="#${rowAnchor(cs[0]!.id)}"><span class="v">${cs.length} corners</span><span class="sw">${text}</span></a></td>`;
}

const SIDE: Record<string, string> = { '-1': '−', '1': '+', '0': '' };

function tankLabel(c: CornerResult, design?: Design): string {
  const t = c.inputs.tolerance ?? { lr: 0, cr: 0, lm: 0 };
  const part = (name: string, side: number, tol: number | undefined, value: number, unit: string) => {
    const s = SIDE[String(side)] ?? '?';
    const shift = s && tol ? ` (${s}${num(tol * 100, 3)} %)` : s ? ` (${s})` : '';
    return `${name} ${eng(value, unit)}${shift}`;
  };
  const nominal = t.lr === 0 && t.cr === 0 && t.lm === 0;
  const head = nominal ? 'Nominal tank' : 'Tolerance set';
  return `${head}: ${part('Lr', t.lr, design?.tolerances.lr, c.inputs.lr, 'H')}, ${part('Cr', t.cr, design?.tolerances.cr, c.inputs.cr, 'F')}, ${part('Lm', t.lm, design?.tolerances.lm, c.inputs.lm, 'H')}`;
}

/** Corners grouped by tank (tolerance sides and element values), in first-seen order. */
export function tankGroups(corners: CornerResult[]): CornerResult[][] {
  const groups = new Map<string, CornerResult[]>();
  for (const c of corners) {
    const t = c.inputs.tolerance ?? { lr: 0, cr: 0, lm: 0 };
    const key = `${t.lr}|${t.cr}|${t.lm}|${c.inputs.lr}|${c.inputs.cr}|${c.inputs.lm}`;
    if (!groups.has(key)) groups.set(key, []);
    groups.get(key)!.push(c);
  }
  return [...groups.values()];
}

function grid(cs: CornerResult[], design?: Design): string {
  const vins = [...new Set(cs.map((c) => c.inputs.vin))].sort((a, b) => a - b);
  const loads = [...new Map(cs.map((c) => [String(c.inputs.loadLabel), c.inputs.load])).entries()].sort((a, b) => b[1] - a[1]);
  const head = `<tr><th scope="col">load \\ Vin</th>${vins.map((v) => `<th scope="col">${esc(num(v))} V</th>`).join('')}</tr>`;
  const rows = loads.map(([label]) => `<tr><th scope="row">${esc(label)}</th>${vins.map((v) => cell(cs.filter((c) => c.inputs.vin === v && String(c.inputs.loadLabel) === label))).join('')}</tr>`);
  return `<figure class="map"><figcaption>${esc(tankLabel(cs[0]!, design))}</figcaption><table class="map">${head}${rows.join('')}</table></figure>`;
}

/** Section body: key, then one grid per tank set. */
export function renderCornerMap(results: Results, design?: Design): string {
  if (results.corners.length === 0) return '<p>No corners.</p>';
  const key = Object.entries(STATUS_STYLE).map(([s, v]) => `<span class="st-${s}">${v.symbol} ${v.label}</span>`).join(' ');
  return `<p class="caption">Each cell: verdict (number of diverged metrics in brackets), then ZVS of the bridge switches and ZCS of the rectifier, simulated where a simulation exists, otherwise FHA's (marked FHA:), then the limits: ✓ within, or ! and the limits outside (FHA missed: FHA said within). Cells link to the table rows.</p>`
    + `<p class="legend key">${key}</p><div class="maps">${tankGroups(results.corners).map((g) => grid(g, design)).join('')}</div>`;
}
