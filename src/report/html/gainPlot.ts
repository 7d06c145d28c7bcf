/** The gain-against-switching-frequency section: one SVG panel per input voltage. Pure. */
import type { Design } from '../../design/types.js';
import type { Results } from '../../results/types.js';
import { benchAnchor, esc, rowAnchor } from './escape.js';
import { num, pct } from './format.js';
import { type GainFigureData, type GainPanel, type GainPoint, gainFigureData } from './gainData.js';
import { seriesColour, seriesDash } from './palette.js';
import { frame, linearScale, linePath, niceStep, px, type Scale, ticksIn } from './svg.js';

const W = 420;
const H = 300;
const M = { l: 48, r: 50, t: 26, b: 40 };

const kHz = (v: number) => num(v, 4, 1e3);

/**
 * Operating points in four layers (gap lines, simulated, ideal model as a cross, FHA on top: hollow,
 * so nothing hides), each marker a link to its table row with the values as a tooltip.
 */
function pointLayers(points: GainPoint[], sx: Scale, sy: Scale): string {
  const link = (p: GainPoint, body: string) => `<a href="#${rowAnchor(p.id)}" class="op"><title>${esc(tooltip(p))}</title>${body}</a>`;
  const gaps = points.filter((p) => p.fha && p.sim)
    .map((p) => `M${px(sx(p.fha!.fs))} ${px(sy(p.fha!.gain))}L${px(sx(p.sim!.fs))} ${px(sy(p.sim!.gain))}`).join('');
  const sims = points.filter((p) => p.sim).map((p) => link(p, `<path class="pt-sim" d="M${px(sx(p.sim!.fs))} ${px(sy(p.sim!.gain) - 4.5)}l4.5 4.5-4.5 4.5-4.5-4.5z" fill="${seriesColour(Math.max(p.load, 0))}"/>`));
  const ideals = points.filter((p) => p.ideal).map((p) => link(p, `<path class="pt-ideal" d="M${px(sx(p.ideal!.fs) - 4)} ${px(sy(p.ideal!.gain) - 4)}l8 8m0-8l-8 8" stroke="${seriesColour(Math.max(p.load, 0))}" stroke-width="1.5"/>`));
  const fhas = points.filter((p) => p.fha).map((p) => link(p, `<circle class="pt-fha" cx="${px(sx(p.fha!.fs))}" cy="${px(sy(p.fha!.gain))}" r="4" stroke="${seriesColour(Math.max(p.load, 0))}"/>`));
  return `${gaps ? `<path class="gap" d="${gaps}"/>` : ''}${sims.join('')}${ideals.join('')}${fhas.join('')}${benchMarkers(points, sx, sy)}`;
}

/** Bench points (`run --measured`) as triangles on top, linked to their row in the measured-points table. */
function benchMarkers(points: GainPoint[], sx: Scale, sy: Scale): string {
  return points.filter((p) => p.measured).map((p) => `<a href="#${benchAnchor(p.id)}" class="op"><title>${esc(tooltip(p))}</title>`
    + `<path class="pt-meas" d="${triangle(sx(p.measured!.fs), sy(p.measured!.gain))}" fill="${seriesColour(Math.max(p.load, 0))}"/></a>`).join('');
}

/** An upward triangle centred on (x, y), 10 px wide: the bench marker's shape. */
function triangle(x: number, y: number): string {
  return `M${px(x)} ${px(y - 5.5)}l5 9h-10z`;
}

function tooltip(p: GainPoint): string {
  const fha = p.fha ? `FHA ${kHz(p.fha.fs)} kHz, M ${num(p.fha.gain)}` : 'FHA: no operating point';
  const sim = p.sim ? `sim ${kHz(p.sim.fs)} kHz, M ${num(p.sim.gain)}` : 'sim: none';
  const gap = p.fha && p.sim ? ` (fs ${pct((p.sim.fs - p.fha.fs) / p.fha.fs)}, M ${pct((p.sim.gain - p.fha.gain) / p.fha.gain)})` : '';
  const ideal = p.ideal ? `; ideal model ${kHz(p.ideal.fs)} kHz, M ${num(p.ideal.gain)}` : '';
  const bench = p.bench ? `; bench Vout ${num(p.bench.vout)} V${p.measured ? ` (M ${num(p.measured.gain)})` : ''}${p.bench.simGap !== null ? `, ${pct(p.bench.simGap)} against sim` : ''}` : '';
  return `${p.id}: ${fha}; ${sim}${gap}${ideal}${bench}`;
}

/** Capacitive region: left of fp, and below the zero-phase locus down to fr (docs/method.md#zero-phase). */
function capacitiveRegion(d: GainFigureData, sx: Scale, sy: Scale, h: number): string {
  if (!d.boundary || d.fr === null) return '';
  const b = linePath(d.boundary.fs, d.boundary.gain, sx, sy).replace(/^M/, 'L');
  return `<path class="capacitive" d="M${px(sx(d.fsAxis.d0))} -5000${b}L${px(sx(d.fr))} ${px(sy(1))}L${px(sx(d.fr))} ${h + 5}L${px(sx(d.fsAxis.d0))} ${h + 5}Z"/>`
    + `<text class="region" x="6" y="${h - 6}">capacitive: ZVS lost</text>`;
}

function vline(x: number, h: number, label: string): string {
  return `<path class="marker" d="M${px(x)} 0v${h}"/><text class="marker" x="${px(x + 3)}" y="11">${esc(label)}</text>`;
}

/** Load labels at the right-hand ends of the curves, nudged apart so they never overlap. */
function curveLabels(d: GainFigureData, p: GainPanel, sy: Scale, w: number): string {
  const labels = p.curves.map((c) => ({ c, y: c.gain[c.gain.length - 1] }))
    .filter((l): l is { c: GainPanel['curves'][number]; y: number } => typeof l.y === 'number' && l.y > d.gainAxis.d0 && l.y < d.gainAxis.d1)
    .map((l) => ({ c: l.c, y: sy(l.y) + 12 })).sort((a, b) => a.y - b.y);
  for (let i = 1; i < labels.length; i++) labels[i]!.y = Math.max(labels[i]!.y, labels[i - 1]!.y + 11);
  const bottom = sy(d.gainAxis.d0) - 3;
  for (let i = labels.length - 1; i >= 0; i--) labels[i]!.y = Math.min(labels[i]!.y, i === labels.length - 1 ? bottom : labels[i + 1]!.y - 11);
  return labels.map(({ c, y }) => `<text class="curve-label" x="${w - 3}" y="${px(y)}" text-anchor="end" style="fill:${seriesColour(c.load)}">${esc(d.loads[c.load]!.label)}</text>`).join('');
}

/** The controller's frequency window as a shaded band with dashed edges (open side to the plot edge). */
function frequencyWindow(win: { min?: number; max?: number } | undefined, sx: Scale, h: number, w: number): string {
  if (!win) return '';
  const x0 = win.min !== undefined ? Math.max(0, sx(win.min)) : 0;
  const x1 = win.max !== undefined ? Math.min(w, sx(win.max)) : w;
  if (!(x1 > x0)) return '';
  const edge = (v: number | undefined, label: string) => (v === undefined || sx(v) < 0 || sx(v) > w ? ''
    : `<path class="fedge" d="M${px(sx(v))} 0v${h}"/><text class="fedge" x="${px(sx(v) + 3)}" y="${h - 16}">${esc(label)}</text>`);
  return `<rect class="fwindow" x="${px(x0)}" y="0" width="${px(x1 - x0)}" height="${h}"/>${edge(win.min, 'fs min')}${edge(win.max, 'fs max')}`;
}

function panelSvg(d: GainFigureData, p: GainPanel, win?: { min?: number; max?: number }): string {
  const w = W - M.l - M.r;
  const h = H - M.t - M.b;
  const sx = linearScale(d.fsAxis.d0, d.fsAxis.d1, 0, w);
  const sy = linearScale(d.gainAxis.d0, d.gainAxis.d1, h, 0);
  const inner: string[] = [frequencyWindow(win, sx, h, w), capacitiveRegion(d, sx, sy, h)];
  for (const c of p.curves) {
    if (!c.band) continue;
    const upper = linePath(d.grid, c.band.hi, sx, sy);
    const lower = linePath([...d.grid].reverse(), [...c.band.lo].reverse(), sx, sy).replace(/^M/, 'L');
    inner.push(`<path class="band" d="${upper}${lower}Z" fill="${seriesColour(c.load)}"/>`);
  }
  if (d.boundary) inner.push(`<path class="boundary" d="${linePath(d.boundary.fs, d.boundary.gain, sx, sy)}"/>`);
  if (d.fr !== null) inner.push(vline(sx(d.fr), h, 'fr'));
  if (d.fp !== null && d.fp > d.fsAxis.d0) inner.push(vline(sx(d.fp), h, 'fp'));
  if (p.target !== null) {
    inner.push(`<path class="target" d="M0 ${px(sy(p.target))}h${w}"/>`);
  }
  for (const c of p.curves) {
    const dash = seriesDash(c.load);
    inner.push(`<path class="curve" data-series="${esc(d.loads[c.load]!.label)}" d="${linePath(d.grid, c.gain, sx, sy)}" stroke="${seriesColour(c.load)}"${dash ? ` stroke-dasharray="${dash}"` : ''}/>`);
  }
  inner.push(curveLabels(d, p, sy, w));
  inner.push(pointLayers(p.points, sx, sy));
  const y2 = p.vout ? voutTicks(p.vout, d.gainAxis.d0, d.gainAxis.d1) : undefined;
  const fr = frame({
    x: M.l, y: M.t, w, h,
    xAxis: { scale: sx, ticks: d.fsAxis.ticks, format: kHz, label: 'switching frequency fs, kHz' },
    yAxis: { scale: sy, ticks: d.gainAxis.ticks, format: (v) => num(v, 3), label: 'tank gain M' },
    ...(y2 ? { y2: { ticks: y2, label: 'Vout, V (at this Vin)' } } : {}),
  });
  const title = `Vin ${num(p.vin)} V`;
  return `<svg class="plot gain" data-plot="gain" data-series="${p.curves.length}" data-points="${p.points.length}" data-measured="${p.points.filter((x) => x.measured).length}" viewBox="0 0 ${W} ${H}" role="img" aria-label="${esc(`Gain against switching frequency at ${title}`)}">`
    + `<text class="title" x="${M.l}" y="16">${esc(title)}</text>${fr}`
    + `<svg x="${M.l}" y="${M.t}" width="${w}" height="${h}">${inner.join('')}</svg></svg>`;
}

/** Output-voltage ticks placed at the gains that give them: Vout = M perGain - drop (FHA, exact at this Vin). */
function voutTicks(v: { perGain: number; drop: number }, g0: number, g1: number): { at: number; text: string }[] {
  const lo = g0 * v.perGain - v.drop;
  const hi = g1 * v.perGain - v.drop;
  return ticksIn(lo, hi, niceStep(lo, hi, 5)).map((vo) => ({ at: (vo + v.drop) / v.perGain, text: num(vo, 4) }));
}

function legend(d: GainFigureData): string {
  const line = (attrs: string) => `<svg class="sw" viewBox="0 0 28 10" aria-hidden="true"><path d="M1 5h26" ${attrs}/></svg>`;
  const dash = (i: number) => (seriesDash(i) ? ` stroke-dasharray="${seriesDash(i)}"` : '');
  const pts = d.panels.flatMap((p) => p.points);
  const items = [
    ...d.loads.map((l, i) => `${d.hasDesign ? line(`stroke="${seriesColour(i)}"${dash(i)}`)
      : `<svg class="sw" viewBox="0 0 12 12" aria-hidden="true"><rect x="2" y="2" width="8" height="8" fill="${seriesColour(i)}"/></svg>`}load ${esc(l.label)}`),
    pts.some((p) => p.fha) ? '<svg class="sw" viewBox="0 0 12 12" aria-hidden="true"><circle cx="6" cy="6" r="4" class="pt-fha" stroke="#333"/></svg>FHA operating point' : '',
    pts.some((p) => p.sim) ? '<svg class="sw" viewBox="0 0 12 12" aria-hidden="true"><path d="M6 1.5l4.5 4.5-4.5 4.5-4.5-4.5z" fill="#333"/></svg>simulated operating point (thin line: the gap to FHA)' : '',
    pts.some((p) => p.ideal) ? '<svg class="sw" viewBox="0 0 12 12" aria-hidden="true"><path d="M2 2l8 8m0-8l-8 8" stroke="#333" stroke-width="1.5"/></svg>ideal time-domain model' : '',
    pts.some((p) => p.measured) ? `<svg class="sw" viewBox="0 0 12 12" aria-hidden="true"><path class="pt-meas" d="${triangle(6, 6.5)}" fill="#333"/></svg>measured on the bench (gain of the measured Vout)` : '',
    d.panels.some((p) => p.target !== null) ? `${line('stroke="#777" stroke-dasharray="1 3"')}gain the Vout set point needs` : '',
    d.hasDesign ? `${line('class="boundary"')}zero-phase boundary` : '',
  ];
  return `<p class="legend">${items.filter(Boolean).map((x) => `<span>${x}</span>`).join('')}</p>`;
}

/** The whole section body: caption, panels and legend. */
export function renderGainSection(results: Results, design?: Design): string {
  const d = gainFigureData(results, design);
  if (d.panels.length === 0) return '<p>No corners to plot.</p>';
  const note = d.hasDesign
    ? '<p class="caption">Tank gain M = n (Vout + V<sub>F</sub>) / V<sub>in,eff</sub> against switching frequency, one panel per input voltage. Curves: FHA gain for each load with the nominal tank, Q from R<sub>ac</sub> at the output set point (rectifier drop included); shaded bands: spread over the tank tolerance sets. Grey area: capacitive tank input (below the zero-phase boundary, or below fp), where ZVS is lost. Each point links to its table row; hover for values.</p>'
    : '<p class="caption notice">The design file was not available, so this figure shows only the FHA and simulated operating points (and fr from the results): the FHA gain curves and the zero-phase boundary need the design. Re-run the report with the design file to draw them.</p>';
  const benchNote = !d.hasDesign && results.corners.some((c) => c.measured)
    ? '<p class="caption notice">The measured points are not drawn: their gain needs the turns ratio and rectifier drop from the design file.</p>' : '';
  const win = design?.limits?.frequency;
  const winNote = win ? `<p class="legend"><span><svg class="sw" viewBox="0 0 28 10" aria-hidden="true"><rect x="1" y="1" width="26" height="8" class="fwindow"/></svg>the controller's frequency window (limits.frequency${win.min !== undefined ? `, min ${esc(kHz(win.min))} kHz` : ''}${win.max !== undefined ? `, max ${esc(kHz(win.max))} kHz` : ''})</span></p>` : '';
  return `${note}${benchNote}<div class="panels">${d.panels.map((p) => panelSvg(d, p, win)).join('')}</div>${legend(d)}${winNote}`;
}
