import type { Results, WaveformExcerpt } from '../results/types.js';

/**
 * results.json text: two-space indentation, keys in construction order, non-finite numbers as null.
 * Deterministic: the same results give the same bytes (no timestamps, no wall times).
 */
export function renderResultsJson(results: Results): string {
  return `${JSON.stringify(results, (_k, v) => (typeof v === 'number' && !Number.isFinite(v) ? null : v), 2)}\n`;
}

/** Companion file with the downsampled waveforms the report plots. */
export function renderWaveformsJson(waveforms: WaveformExcerpt[]): string {
  return `${JSON.stringify({ schema: 'tankcheck/waveforms@1', corners: waveforms })}\n`;
}
