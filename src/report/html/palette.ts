import type { CornerStatus } from '../../results/types.js';

/**
 * Colours after the Okabe-Ito palette (distinct under the common colour-vision deficiencies), each
 * series also told apart by dash pattern or marker and by a text label, never by colour alone.
 */
export const SERIES_COLOURS = ['#0072B2', '#E69F00', '#009E73', '#CC79A7', '#56B4E9', '#D55E00', '#000000', '#8C6D00'];

/** Dash patterns that go with SERIES_COLOURS (index modulo length). */
export const SERIES_DASHES = ['', '6 3', '2 2', '8 3 2 3', '1 3', '10 4'];

export function seriesColour(i: number): string {
  return SERIES_COLOURS[i % SERIES_COLOURS.length]!;
}

export function seriesDash(i: number): string {
  return SERIES_DASHES[i % SERIES_DASHES.length]!;
}

export interface StatusStyle {
  /** Symbol shown before the label so the verdict reads without colour. */
  symbol: string;
  label: string;
}

/** Display of each corner status; CSS classes are `st-<status>`. */
export const STATUS_STYLE: Record<CornerStatus, StatusStyle> = {
  ok: { symbol: '✓', label: 'ok' },
  diverged: { symbol: '✗', label: 'diverged' },
  failed: { symbol: '⊘', label: 'failed' },
  'not-settled': { symbol: '≈', label: 'not settled' },
  predicted: { symbol: '○', label: 'FHA only' },
  unreachable: { symbol: '∅', label: 'no FHA solution' },
  'outside-limits': { symbol: '!', label: 'outside limits' },
  screened: { symbol: '·', label: 'screened only' },
};

/** Statuses in the order the report lists them. */
export const STATUS_ORDER: CornerStatus[] = ['ok', 'diverged', 'outside-limits', 'failed', 'not-settled', 'predicted', 'unreachable'];

/** Known status or null (a results file may carry anything). */
export function knownStatus(s: unknown): CornerStatus | null {
  return typeof s === 'string' && (STATUS_ORDER as string[]).includes(s) ? (s as CornerStatus) : null;
}

/** "✗ diverged" (escaped by the caller's context: symbols and labels are constants). */
export function statusText(s: unknown): string {
  const k = knownStatus(s);
  return k ? `${STATUS_STYLE[k].symbol} ${STATUS_STYLE[k].label}` : `? ${String(s)}`;
}
