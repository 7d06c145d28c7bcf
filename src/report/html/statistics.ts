/**
 * Monte Carlo section of the HTML report: yield, histograms of the screened values against their
 * bounds (confirmed samples marked with a triangle, not by colour alone), sensitivity bars. Pure.
 */
import type { CornerResult, Results } from '../../results/types.js';
import type { MonteCarloStatistics } from '../../statistics/summary.js';
import { operatingPoint } from '../../statistics/corners.js';
import { esc } from './escape.js';
import { eng, pctAbs } from './format.js';
import { frame, linearScale, niceDomain, px } from './svg.js';

const W = 420;
const H = 170;
const M = { l: 46, r: 12, t: 10, b: 44 };
const BINS = 24;

/** One value per corner of a histogram, and whether the simulation confirmed that corner. */
interface Point { value: number; confirmed: boolean }

/** Screened value of a check: the ideal model's, or FHA's where the ideal model has none; relative: divided by the bound. */
function checkValue(c: CornerResult, limit: string, relative = false): number | null {
  const ch = c.checks?.find((x) => x.limit === limit);
  const v = ch ? (typeof ch.ideal?.value === 'number' ? ch.ideal.value : ch.fha.value) : null;
  if (typeof v !== 'number' || !Number.isFinite(v)) return null;
  if (!relative) return v;
  return typeof ch!.bound === 'number' && ch!.bound > 0 ? v / ch!.bound : null;
}

function boundOf(results: Results, limit: string): number | null {
  for (const c of results.corners) {
    const b = c.checks?.find((x) => x.limit === limit)?.bound;
    if (typeof b === 'number') return b;
  }
  return null;
}

/** An SVG histogram with vertical bound lines; confirmed corners as triangles under the axis. */
export function histogram(points: Point[], bounds: { at: number; label: string }[], unit: string, title: string, counted = 'corners'): string {
  if (points.length === 0) return '';
  const values = points.map((p) => p.value);
  const lo = Math.min(...values, ...bounds.map((b) => b.at));
  const hi = Math.max(...values, ...bounds.map((b) => b.at));
  const span = hi > lo ? hi - lo : Math.abs(hi) * 0.01 || 1;
  const dx = niceDomain(lo - 0.02 * span, hi + 0.02 * span, 5);
  const width = (dx.d1 - dx.d0) / BINS;
  const counts = new Array<number>(BINS).fill(0);
  for (const v of values) counts[Math.min(BINS - 1, Math.max(0, Math.floor((v - dx.d0) / width)))]!++;
  const dy = niceDomain(0, Math.max(...counts), 4);
  const pw = W - M.l - M.r;
  const ph = H - M.t - M.b;
  const sx = linearScale(dx.d0, dx.d1, 0, pw);
  const sy = linearScale(0, dy.d1, ph, 0);
  const bars = counts.map((n, i) => (n ? `<rect class="bar" x="${px(M.l + sx(dx.d0 + i * width))}" y="${px(M.t + sy(n))}" width="${px(Math.max(1, sx(dx.d0 + width) - sx(dx.d0) - 1))}" height="${px(ph - sy(n))}"><title>${n}</title></rect>` : '')).join('');
  const lines = bounds.map((b) => `<path class="bound" d="M${px(M.l + sx(b.at))} ${M.t}v${ph}"/><text class="bound-label" x="${px(M.l + sx(b.at) + 3)}" y="${M.t + 10}">${esc(b.label)}</text>`).join('');
  const marks = points.filter((p) => p.confirmed).map((p) => `<path class="confirmed" d="M${px(M.l + sx(p.value))} ${M.t + ph + 1}l-3 6h6z"/>`).join('');
  const axes = frame({ x: M.l, y: M.t, w: pw, h: ph, xAxis: { scale: sx, ticks: dx.ticks, format: (v) => eng(v, unit), label: title }, yAxis: { scale: sy, ticks: dy.ticks, format: (v) => String(v), label: counted } });
  return `<svg class="plot hist" viewBox="0 0 ${W} ${H}" role="img" aria-label="${esc(title)}">${axes}${bars}${lines}${marks}</svg>`;
}

function frequencyFigures(results: Results): string {
  const groups = new Map<string, Point[]>();
  for (const c of results.corners) {
    if (c.inputs.sample === undefined || c.inputs.fs !== null) continue;
    const ideal = c.ideal?.fs;
    const v = typeof ideal === 'number' ? ideal : c.fha.fs;
    if (v === null || v === undefined) continue;
    const k = operatingPoint(c);
    const list = groups.get(k) ?? [];
    list.push({ value: v, confirmed: c.sim !== null });
    groups.set(k, list);
  }
  const min = boundOf(results, 'frequency.min');
  const max = boundOf(results, 'frequency.max');
  const bounds = [...(min !== null ? [{ at: min, label: 'min' }] : []), ...(max !== null ? [{ at: max, label: 'max' }] : [])];
  return [...groups.entries()].map(([op, pts]) => `<figure>${histogram(pts, bounds, 'Hz', `required fs, ${op}`)}<figcaption>${esc(op)}: switching frequency that regulates the output (ideal model; FHA where it has none) against the controller window.</figcaption></figure>`).join('');
}

/** Per sample, the worst value of a limit over its operating points (max for upper limits, min for lower ones). */
function worstPerSample(results: Results, limit: string, lower: boolean, relative = false): Point[] {
  const by = new Map<number, Point>();
  for (const c of results.corners) {
    const k = c.inputs.sample;
    const v = k === undefined ? null : checkValue(c, limit, relative);
    if (k === undefined || v === null) continue;
    const prev = by.get(k);
    const worse = !prev || (lower ? v < prev.value : v > prev.value);
    by.set(k, { value: worse ? v : prev!.value, confirmed: (prev?.confirmed ?? false) || c.sim !== null });
  }
  return [...by.values()];
}

function sensitivityBars(s: MonteCarloStatistics): string {
  if (!s.sensitivity.length) return '<p>No limit with a numeric bound to rank the tolerances against.</p>';
  const rows = s.sensitivity.map((e) => {
    const bars = e.ranking.map((r) => {
      const w = Math.round(Math.abs(r.rho) * 120);
      return `<div class="sens"><span class="sens-name">${esc(r.parameter)}</span><span class="sens-bar" style="width:${w}px"></span><span class="num">${r.rho >= 0 ? '+' : ''}${r.rho.toFixed(2)}</span></div>`;
    }).join('');
    return `<tr><th scope="row">${esc(e.limit)}</th><td>${bars}</td></tr>`;
  }).join('');
  return `<table class="sensitivity"><thead><tr><th>limit</th><th>Spearman rank correlation with the worst usage (sign: the usage rises with the element)</th></tr></thead><tbody>${rows}</tbody></table>`;
}

/** The section body; empty when the results have no Monte Carlo statistics. */
export function renderStatisticsSection(results: Results): string {
  const s = results.statistics;
  if (!s) return '<p>Not a Monte Carlo run (tolerances.corners: random).</p>';
  const y = (name: string, e: MonteCarloStatistics['yield']['fha']) =>
    `<tr><th scope="row">${name}</th><td class="num">${pctAbs(e.value)}</td><td class="num">${pctAbs(e.low)} .. ${pctAbs(e.high)}</td><td class="num">${e.meets} of ${s.samples}${e.unknown ? ` (${e.unknown} without a value)` : ''}</td></tr>`;
  // the current ZVS needs grows with Vin: relative to it, one bound (1) fits every operating point
  const zvs = worstPerSample(results, 'zvsMargin', true, true);
  const cr = worstPerSample(results, 'crVoltage', false);
  const cb = boundOf(results, 'crVoltage');
  return [
    `<p>${s.samples} samples (seed ${s.seed}, ${esc(s.distribution)}) at ${s.operatingPoints.length} operating points, screened by FHA and the ideal model; ${s.confirmed.count} corners confirmed by simulation (marked &#9650; under the histograms), ${s.confirmed.outside} confirmed samples outside a limit.</p>`,
    `<table><thead><tr><th>yield from</th><th>share meeting every limit</th><th>95 % interval (Clopper-Pearson)</th><th>samples</th></tr></thead><tbody>${y('FHA', s.yield.fha)}${y('ideal model', s.yield.ideal)}</tbody></table>`,
    `<div class="hists">${frequencyFigures(results)}</div>`,
    `<div class="hists">${zvs.length ? `<figure>${histogram(zvs, [{ at: 1, label: 'needed' }], '', 'worst turn-off current / needed, per sample', 'samples')}<figcaption>Smallest switch turn-off current of each sample divided by the current ZVS needs with its margin (2 Coss Vin / dead time x (1 + zvsMargin)); below 1 is outside.</figcaption></figure>` : ''}${cr.length ? `<figure>${histogram(cr, cb !== null ? [{ at: cb, label: 'rating' }] : [], 'V', 'worst Cr peak per sample', 'samples')}<figcaption>Largest Cr peak voltage of each sample against its derated rating.</figcaption></figure>` : ''}</div>`,
    '<h3>Which tolerance drives each limit</h3>',
    sensitivityBars(s),
  ].join('\n');
}
