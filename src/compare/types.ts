/** One metric compared between FHA and simulation. */
export interface ComparisonRow {
  metric: string;
  fha: number | string | boolean | null;
  sim: number | string | boolean | null;
  /** (sim - fha) / |fha| for numbers; null for status metrics. */
  error: number | null;
  tolerance: number | null;
  verdict: 'ok' | 'diverged' | 'info';
  reason?: string;
  /** True when the error has the sign FHA theory rules out: suspect the model, not FHA. */
  unexpectedSign?: boolean;
}

/** A comparison row beyond tolerance, with its reason (results.json `divergences`). */
export type Divergence = Pick<ComparisonRow, 'metric' | 'fha' | 'sim' | 'error' | 'tolerance' | 'unexpectedSign'> & { reason: string };
