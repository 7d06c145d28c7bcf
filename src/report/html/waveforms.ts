/** Waveform figures: five stacked panels per corner over the two-cycle excerpt. Pure. */
import type { CornerResult, Results, WaveformExcerpt } from '../../results/types.js';
import { esc, rowAnchor, waveAnchor } from './escape.js';
import { finite, num } from './format.js';
import { seriesColour, seriesDash, statusText } from './palette.js';
import { frame, linearScale, linePath, niceDomain, niceStep, px, ticksIn } from './svg.js';

interface PanelDef { title: string; unit: string; keys: (ex: WaveformExcerpt) => string[]; label: (key: string) => string; edges?: boolean }

const LABELS: Record<string, string> = { tankCurrent: 'tank i(Lr)', magnetizingCurrent: 'magnetizing i(Lm)', bridgeVoltage: 'bridge', crVoltage: 'v(Cr)', vout: 'Vout' };
const has = (ex: WaveformExcerpt, k: string) => Array.isArray(ex.series[k]) && ex.series[k]!.length > 0;

/** Panels top to bottom; a series absent from an excerpt is skipped. */
export const WAVE_PANELS: PanelDef[] = [
  { title: 'Tank and magnetizing current', unit: 'A', keys: (ex) => ['tankCurrent', 'magnetizingCurrent'].filter((k) => has(ex, k)), label: (k) => LABELS[k] ?? k },
  { title: 'Bridge voltage, high-side gate turn-on ▾', unit: 'V', keys: (ex) => ['bridgeVoltage'].filter((k) => has(ex, k)), label: (k) => LABELS[k] ?? k, edges: true },
  { title: 'Resonant capacitor voltage', unit: 'V', keys: (ex) => ['crVoltage'].filter((k) => has(ex, k)), label: (k) => LABELS[k] ?? k },
  { title: 'Rectifier diode currents', unit: 'A', keys: (ex) => Object.keys(ex.series).filter((k) => k.startsWith('diode') && has(ex, k)), label: (k) => k.replace(/^diode/, '') },
  { title: 'Output voltage', unit: 'V', keys: (ex) => ['vout'].filter((k) => has(ex, k)), label: (k) => LABELS[k] ?? k },
];

/** Corners that get a figure: the nominal corner (first id ending in _nom, else the first), then every diverged or outside-limits one. */
export function waveformCorners(results: Results): CornerResult[] {
  const nominal = results.corners.find((c) => c.id.endsWith('_nom')) ?? results.corners[0];
  const picked = [nominal, ...results.corners.filter((c) => c.status === 'diverged' || c.status === 'outside-limits')].filter((c): c is CornerResult => Boolean(c));
  return [...new Map(picked.map((c) => [c.id, c])).values()];
}

const W = 600;
const PH = 70;
const GAP = 24;
const L = 52;
const R = 12;
const TOP = 22;

/** Smallest and largest finite value over the arrays; [0, 1] when there is none. */
function extent(arrays: number[][]): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (const a of arrays) for (const v of a) if (Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
  return lo <= hi ? [lo, hi] : [0, 1];
}

/** Swatch + label per series, right-aligned above a panel (label widths estimated at 6 px a character). */
function legend(labels: string[], y: number): string {
  let x = W - R;
  const items: string[] = [];
  for (let j = labels.length - 1; j >= 0; j--) {
    x -= labels[j]!.length * 6;
    items.push(`<text class="lg" x="${x}" y="${y + 4}">${esc(labels[j])}</text>`);
    x -= 26;
    const dash = seriesDash(j);
    items.push(`<path class="lgsw" d="M${x} ${y}h22" stroke="${seriesColour(j)}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
    x -= 12;
  }
  return items.join('');
}

/** One corner's multi-panel SVG; data-series counts the drawn series. */
export function waveSvg(ex: WaveformExcerpt): string {
  const w = W - L - R;
  const tEnd = extent([ex.t])[1] || 1;
  const sx = linearScale(0, tEnd, 0, w);
  const xTicks = ticksIn(0, tEnd, niceStep(0, tEnd, 8));
  const edges = (ex.edges ?? []).filter((e) => finite(e) !== null && e >= 0 && e <= tEnd);
  const edgePath = edges.map((e) => `M${px(sx(e))} 0v${PH}`).join('');
  const out: string[] = [];
  let drawn = 0;
  WAVE_PANELS.forEach((p, i) => {
    const y0 = TOP + i * (PH + GAP);
    const keys = p.keys(ex);
    const [lo, hi] = extent(keys.map((k) => ex.series[k]!));
    const dom = niceDomain(lo, hi, 3);
    const sy = linearScale(dom.d0, dom.d1, PH, 0);
    const last = i === WAVE_PANELS.length - 1;
    out.push(frame({ x: L, y: y0, w, h: PH, xLabels: last,
      xAxis: { scale: sx, ticks: xTicks, format: (v) => num(v * 1e6, 3), label: 'time in the excerpt, µs' },
      yAxis: { scale: sy, ticks: dom.ticks, format: (v) => num(v, 4) } }));
    out.push(`<text class="ptitle" x="${L}" y="${y0 - 6}">${esc(p.title)}, ${p.unit}</text>${legend(keys.map(p.label), y0 - 9)}`);
    const inner = [edgePath ? `<path class="edge" d="${edgePath}"/>` : ''];
    if (dom.d0 < 0 && dom.d1 > 0) inner.push(`<path class="zero" d="M0 ${px(sy(0))}h${w}"/>`);
    keys.forEach((k, j) => {
      const dash = seriesDash(j);
      inner.push(`<path class="series" data-series="${esc(k)}" d="${linePath(ex.t, ex.series[k]!, sx, sy)}" stroke="${seriesColour(j)}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
      drawn++;
    });
    if (p.edges) inner.push(...edges.map((e) => `<path class="gate" d="M${px(sx(e) - 4)} 0h8l-4 6z"/>`));
    out.push(`<svg x="${L}" y="${y0}" width="${w}" height="${PH}">${inner.join('')}</svg>`);
  });
  const h = TOP + WAVE_PANELS.length * (PH + GAP) - GAP + 34;
  return `<svg class="plot wave" data-plot="wave" data-series="${drawn}" viewBox="0 0 ${W} ${h}" role="img" aria-label="${esc(`Waveforms of ${ex.id}`)}">${out.join('')}</svg>`;
}

function figure(c: CornerResult, ex: WaveformExcerpt | undefined, nominal: boolean): string {
  const fs = c.sim ? `fs ${num(c.sim.fs, 4, 1e3)} kHz (sim)` : '';
  const facts = [statusText(c.status), `Vin ${num(c.inputs.vin)} V`, `load ${c.inputs.loadLabel}`, fs, c.sim?.mode ? `mode ${c.sim.mode}` : '', nominal ? 'nominal corner' : '']
    .filter(Boolean).map((s) => esc(s)).join(' · ');
  const body = ex ? waveSvg(ex) : '<p class="notice">No waveform excerpt for this corner (it did not produce a measurement window).</p>';
  return `<figure class="wave" id="${waveAnchor(c.id)}"><figcaption><a href="#${rowAnchor(c.id)}">${esc(c.id)}</a> · ${facts}</figcaption>${body}</figure>`;
}

/**
 * Figures drawn at load; the rest sit in a collapsed block as an inert <template> that the page
 * script draws when the block is opened, so a large study still opens fast.
 */
export const WAVES_OPEN = 8;

/** Section body. */
export function renderWaveforms(results: Results, waveforms: WaveformExcerpt[]): string {
  const picked = waveformCorners(results);
  if (picked.length === 0) return '<p>No corners.</p>';
  const byId = new Map(waveforms.map((w) => [w.id, w]));
  const figs = picked.map((c, i) => figure(c, byId.get(c.id), i === 0));
  const caption = '<p class="caption">The last two switching cycles of the measurement window, for the nominal corner and every diverged or outside-limits corner. Signs: tank current positive from the bridge into Lr; v(Cr) bridge side minus transformer side; ▾ and the faint vertical lines mark the high-side gate turn-on edges.</p>';
  const open = figs.slice(0, WAVES_OPEN).join('');
  const rest = figs.length > WAVES_OPEN
    ? `<details class="more" id="more-waves"><summary>${figs.length - WAVES_OPEN} more diverged corners (open to draw)</summary><template><div class="waves">${figs.slice(WAVES_OPEN).join('')}</div></template></details>` : '';
  return `${caption}<div class="waves">${open}</div>${rest}`;
}
