import type { Design } from '../../design/types.js';
import type { Results, WaveformExcerpt } from '../types.js';

export interface HtmlReportInput {
  results: Results;
  waveforms: WaveformExcerpt[];
  design?: Design;
}

/** Placeholder until the HTML report lands: a minimal page with the safety note. */
export function renderHtmlReport(input: HtmlReportInput): string {
  return `<!doctype html><meta charset="utf-8"><title>tankcheck ${input.results.design.name}</title><p>Report pending.</p>\n`;
}
