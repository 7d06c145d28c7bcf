/**
 * Limits in the report: the "FHA missed this" list (checks where FHA and simulation disagree) and
 * one stress figure per numeric limit (each corner's FHA, ideal and simulated value against the
 * bound, with the rating itself when derated). Pure.
 */
import type { Design } from '../../design/types.js';
import type { CornerResult, Results } from '../../results/types.js';
import type { LimitCheck } from '../../limits/types.js';
import { describeCheck, LIMIT_UNIT, showBound, showValue } from '../../limits/describe.js';
import { usage } from '../../limits/evaluate.js';
import { esc, rowAnchor } from './escape.js';
import { num } from './format.js';
import { frame, linearScale, niceDomain, px } from './svg.js';

const flips = (results: Results) => results.corners.flatMap((c) => (c.checks ?? []).filter((k) => k.flip).map((k) => ({ c, k })));

/** The list at the top of the report: checks FHA puts within and the simulation outside (and the reverse, after). */
export function renderMissed(results: Results): string {
  const all = flips(results);
  if (!results.corners.some((c) => c.checks?.some((k) => k.sim))) return '';
  const item = ({ c, k }: { c: CornerResult; k: LimitCheck }) => `<li><a href="#${rowAnchor(c.id)}">${esc(c.id)}</a> ${esc(describeCheck(k))}</li>`;
  const missed = all.filter((x) => x.k.fha.within);
  const over = all.filter((x) => !x.k.fha.within);
  const head = missed.length
    ? `<div class="missed" role="alert"><h3>⚠ FHA missed this: ${missed.length} limit check(s) within by FHA, outside in simulation</h3><ul>${missed.map(item).join('')}</ul></div>`
    : '<p class="missed-none">✓ FHA missed nothing: no limit check is within by FHA and outside in simulation.</p>';
  const rev = over.length ? `<details><summary>${over.length} check(s) outside by FHA but within in simulation</summary><ul>${over.map(item).join('')}</ul></details>` : '';
  return `${head}${rev}`;
}

/** Limit verdict of one corner for the corner map: symbol and text. */
export function limitText(c: CornerResult): string {
  const checks = c.checks ?? [];
  if (checks.length === 0) return '';
  const sim = checks.some((k) => k.sim);
  const out = checks.filter((k) => (sim ? k.sim?.within : k.fha.within) === false).map((k) => k.limit);
  const flip = checks.some((k) => k.flip && k.fha.within) ? ' · FHA missed' : '';
  return out.length ? `! ${sim ? '' : 'FHA: '}outside ${out.join(', ')}${flip}` : `✓ ${sim ? '' : 'FHA: '}within limits${flip}`;
}

/** Corners per stress figure at most: a larger study shows those closest to (or beyond) the bound. */
export const STRESS_ROWS_MAX = 40;

const W = 460;
const ROW = 16;
const M = { l: 170, r: 16, t: 22, b: 36 };

/** One stress figure: corners down, value across, bound (and rating) as vertical lines. */
function stressSvg(limit: LimitCheck['limit'], rows: { c: CornerResult; k: LimitCheck }[], rating: number | null): string {
  const bound = rows[0]!.k.bound as number;
  const vals = rows.flatMap(({ k }) => [k.fha, k.ideal, k.sim].map((s) => (typeof s?.value === 'number' ? s.value : null))).filter((v): v is number => v !== null);
  const dom = niceDomain(Math.min(0, ...vals), Math.max(bound, rating ?? 0, ...vals) * 1.05, 5);
  const w = W - M.l - M.r;
  const h = rows.length * ROW;
  const sx = linearScale(dom.d0, dom.d1, 0, w);
  const unit = LIMIT_UNIT[limit] === 'Hz' ? 'kHz' : LIMIT_UNIT[limit];
  const div = unit === 'kHz' ? 1e3 : 1;
  const fr = frame({ x: M.l, y: M.t, w, h, xAxis: { scale: sx, ticks: dom.ticks, format: (v) => num(v, 4, div), label: `${limit}, ${unit}` },
    yAxis: { scale: linearScale(0, 1, h, 0), ticks: [], format: () => '' } });
  // labels sit on the side of the line with more room, so none is cut at the plot edge
  const label = (x: number, y: number, cls: string, text: string) =>
    `<text class="${cls}" x="${px(x > w / 2 ? x - 3 : x + 3)}" y="${y}"${x > w / 2 ? ' text-anchor="end"' : ''}>${esc(text)}</text>`;
  const inner: string[] = [`<path class="bound" d="M${px(sx(bound))} 0v${h}"/>${label(sx(bound), 10, 'bound', `bound ${showBound(rows[0]!.k)}`)}`];
  if (rating !== null && rating !== bound) inner.push(`<path class="rating" d="M${px(sx(rating))} 0v${h}"/>${label(sx(rating), h - 3, 'rating', `rating ${showValue(rows[0]!.k, rating)}`)}`);
  const labels: string[] = [];
  rows.forEach(({ c, k }, i) => {
    const y = i * ROW + ROW / 2;
    const at = (v: unknown) => (typeof v === 'number' ? px(sx(v)) : null);
    const tip = esc(`${c.id} ${describeCheck(k)}`);
    const f = at(k.fha.value);
    const d = at(k.ideal?.value);
    const s = at(k.sim?.value);
    const marks = [
      d !== null ? `<path class="pt-ideal" d="M${d} ${px(y - 4)}v8M${px(Number(d) - 4)} ${px(y)}h8"/>` : '',
      s !== null ? `<path class="pt-sim${k.sim?.within === false ? ' out' : ''}" d="M${s} ${px(y - 4.5)}l4.5 4.5-4.5 4.5-4.5-4.5z"/>` : '',
      f !== null ? `<circle class="pt-fha" cx="${f}" cy="${px(y)}" r="4"/>` : '',
    ];
    inner.push(`<a href="#${rowAnchor(c.id)}"><title>${tip}</title>${marks.join('')}</a>`);
    const mark = k.flip ? (k.fha.within ? ' ⚠' : ' ↺') : k.sim?.within === false ? ' !' : '';
    labels.push(`<text class="row" x="${M.l - 6}" y="${px(M.t + y + 4)}" text-anchor="end">${esc(c.id)}${mark}</text>`);
  });
  const H = M.t + h + M.b;
  return `<svg class="plot stress" data-plot="stress" data-limit="${esc(limit)}" viewBox="0 0 ${W} ${H}" role="img" aria-label="${esc(`${limit} at every corner against its bound`)}">`
    + `<text class="title" x="${M.l}" y="14">${esc(limit)}</text>${fr}${labels.join('')}<svg x="${M.l}" y="${M.t}" width="${w}" height="${h}">${inner.join('')}</svg></svg>`;
}

/** Section body: one stress figure per numeric limit, with a key. */
export function renderLimits(results: Results, design?: Design): string {
  const withChecks = results.corners.filter((c) => c.checks?.length);
  const limits = [...new Set(withChecks.flatMap((c) => c.checks!.filter((k) => typeof k.bound === 'number').map((k) => k.limit)))];
  const missingSection = design && !design.limits ? '<p class="caption">The design has no <code>limits</code> section; only the region (capacitive operation) is checked.</p>' : '';
  if (limits.length === 0) return `${missingSection}<p>No numeric limits to show.</p>`;
  const derating = design?.limits?.derating ?? 1;
  const figs = limits.map((l) => {
    const all = withChecks.flatMap((c) => c.checks!.filter((k) => k.limit === l).map((k) => ({ c, k })));
    const use = (x: { k: LimitCheck }) => usage(x.k, x.k.sim ?? x.k.fha) ?? -1;
    const rows = all.length > STRESS_ROWS_MAX ? [...all].sort((p, q) => use(q) - use(p)).slice(0, STRESS_ROWS_MAX) : all;
    const rating = l === 'frequency.min' || l === 'frequency.max' || l === 'zvsMargin' || derating === 1 ? null : (rows[0]!.k.bound as number) / derating;
    const note = rows.length < all.length ? `<p class="caption">${l}: the ${rows.length} of ${all.length} corners closest to the bound, closest first.</p>` : '';
    return `<div>${stressSvg(l, rows, rating)}${note}</div>`;
  });
  const key = '<p class="legend"><span>○ FHA</span><span>+ ideal model</span><span>◆ simulation (outlined red when outside)</span><span>solid line: the bound (rating × derating, or the window edge, or (1 + zvsMargin) × I<sub>zvs</sub>)</span><span>dashed line: the rating itself</span><span>⚠ FHA within, simulation outside; ↺ the reverse; ! outside</span></p>';
  return `<p class="caption">Every numeric limit at every corner: the value FHA, the ideal time-domain model and the simulation give, against the bound. Hover a mark for the values; marks link to the table rows.</p>${key}<div class="panels">${figs.join('')}</div>`;
}
