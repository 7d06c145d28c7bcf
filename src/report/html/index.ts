/**
 * The self-contained HTML report: one string with inline styles, inline SVG plots and a few lines
 * of inline script; no external resource of any kind (a Content-Security-Policy forbids loading one).
 */
import type { Design } from '../../design/types.js';
import type { Results, WaveformExcerpt } from '../../results/types.js';
import { renderCornerMap } from './cornerMap.js';
import { renderLimits, renderMissed } from './limits.js';
import { esc } from './escape.js';
import { renderGainSection } from './gainPlot.js';
import { renderMeasuredSection } from './measured.js';
import { renderMethod } from './method.js';
import { SCRIPT } from './script.js';
import { CSS } from './style.js';
import { renderSummary } from './summary.js';
import { renderStatisticsSection } from './statistics.js';
import { renderTable } from './table.js';
import { renderWaveforms, waveformCorners } from './waveforms.js';

export interface HtmlReportInput {
  results: Results;
  /** Waveform excerpts (waveforms.json); corners without one get a note instead of a figure. */
  waveforms: WaveformExcerpt[];
  /** The design, when known: needed for the FHA gain curves and the zero-phase boundary. */
  design?: Design;
}

/** Section ids and titles, in page order. */
export const SECTIONS = [
  ['summary', 'Summary'],
  ['statistics', 'Monte Carlo: yield and sensitivity'],
  ['gain', 'Gain against switching frequency'],
  ['measured', 'Bench measurements against the models'],
  ['map', 'Corner map'],
  ['limits', 'Limits and stresses'],
  ['table', 'FHA and simulation side by side'],
  ['waves', 'Waveforms'],
  ['method', 'Method and limits'],
] as const;

const CSP = "default-src 'none'; style-src 'unsafe-inline'; script-src 'unsafe-inline'; img-src data:";

/**
 * Render the report page. Pure: the same input gives the same bytes (no clock, no random ids).
 * Every string taken from the results or the design is HTML-escaped.
 */
export function renderHtmlReport(input: HtmlReportInput): string {
  const { results, waveforms, design } = input;
  const waveIds = new Set(waveformCorners(results).filter((c) => waveforms.some((w) => w.id === c.id)).map((c) => c.id));
  const bodies: Record<(typeof SECTIONS)[number][0], string> = {
    summary: `${renderMissed(results)}${renderSummary(results)}`,
    statistics: renderStatisticsSection(results),
    gain: renderGainSection(results, design),
    measured: renderMeasuredSection(results),
    map: renderCornerMap(results, design),
    limits: renderLimits(results, design),
    table: renderTable(results, waveIds),
    waves: renderWaveforms(results, waveforms),
    method: renderMethod(),
  };
  // the Monte Carlo section only for Monte Carlo runs, the bench section only with measured points
  const shown = SECTIONS.filter(([id]) => (id !== 'statistics' || results.statistics) && (id !== 'measured' || bodies.measured));
  const nav = shown.map(([id, title]) => `<a href="#${id}">${title}</a>`).join('');
  const sections = shown.map(([id, title]) => `<section id="${id}"><h2>${title}</h2>\n${bodies[id]}\n</section>`).join('\n');
  const name = esc(results.design?.name ?? '');
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${CSP}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>tankcheck report: ${name}</title>
<style>${CSS}</style>
</head>
<body>
<header><h1>LLC corner check: ${name}</h1><nav>${nav}</nav></header>
${sections}
<footer>Written by ${esc(results.tool?.name ?? 'tankcheck')} ${esc(results.tool?.version ?? '')}. FHA predictions against SPICE simulation; see Method and limits.</footer>
<script>${SCRIPT}</script>
</body>
</html>
`;
}
