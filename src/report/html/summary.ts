/** Summary section: identity of the run, counts by status, largest divergences, baseline. Pure. */
import type { Results } from '../../results/types.js';
import { esc, rowAnchor } from './escape.js';
import { pct, pctAbs } from './format.js';
import { STATUS_ORDER, STATUS_STYLE } from './palette.js';
import { METRIC_NAMES } from './table.js';

function counts(results: Results): string {
  const n = (s: string) => results.corners.filter((c) => c.status === s).length;
  const item = (s: (typeof STATUS_ORDER)[number]) =>
    `<li class="st-${s}${n(s) ? '' : ' none'}"><span class="big">${n(s)}</span> ${STATUS_STYLE[s].symbol} ${STATUS_STYLE[s].label}</li>`;
  return `<ul class="counts">${STATUS_ORDER.map((s) => item(s)).join('')}<li><span class="big">${results.corners.length}</span> corners in all</li></ul>`;
}

function worst(results: Results): string {
  const list = results.summary?.worst ?? [];
  if (list.length === 0) return '<p>No divergences.</p>';
  const rows = list.map((w) => {
    const ratio = w.error !== null && w.tolerance ? `${(Math.abs(w.error) / w.tolerance).toFixed(1)} ×` : 'status disagrees';
    return `<tr><td><a href="#${rowAnchor(w.id)}">${esc(w.id)}</a></td><td>${esc(METRIC_NAMES[w.metric] ?? w.metric)}</td>`
      + `<td class="num">${esc(pct(w.error))}</td><td class="num">${esc(pctAbs(w.tolerance))}</td><td class="num">${esc(ratio)}</td></tr>`;
  });
  return `<table class="worst"><caption>Largest divergences (error over tolerance)</caption><thead><tr><th scope="col">corner</th><th scope="col">metric</th><th scope="col">error</th><th scope="col">tolerance</th><th scope="col">error / tolerance</th></tr></thead><tbody>${rows.join('')}</tbody></table>`;
}

function baseline(results: Results): string {
  const b = results.baseline;
  if (!b) return '';
  const verdict = b.regressed ? '<strong>✗ regressed</strong>' : '✓ no regression';
  return `<p class="baseline">Against baseline <code>${esc(b.file)}</code>: ${verdict}; ${b.statusChanges.length} status change(s), ${b.moved.length} metric(s) moved beyond the baseline tolerance, ${b.added.length} corner(s) added, ${b.removed.length} removed, ${b.checksOutside?.length ?? 0} limit check(s) went from within to outside.</p>`;
}

/** Section body. */
export function renderSummary(results: Results): string {
  const banner = results.incomplete
    ? '<p class="banner" role="alert"><strong>⚠ Incomplete run.</strong> The study was interrupted: corners without a simulation are FHA-only, and the counts below cover what finished.</p>' : '';
  const engine = results.engine ? `${results.engine.version} (engine: ${results.engine.name})` : 'none (FHA only)';
  const facts = [
    ['Design', `${esc(results.design.name)}${results.design.file ? ` <small>(<code>${esc(results.design.file)}</code>)</small>` : ''}`],
    ['Simulator', esc(engine)],
    ['Tool', `${esc(results.tool?.name ?? 'tankcheck')} ${esc(results.tool?.version ?? '')}`],
    ['Operating points simulated', esc(results.summary?.simulations ?? '')],
  ].map(([k, v]) => `<dt>${k}</dt><dd>${v}</dd>`).join('');
  return `${banner}<dl class="facts">${facts}</dl>${counts(results)}${worst(results)}${baseline(results)}`;
}
