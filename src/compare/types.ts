import type { DivergenceCause } from './cause.js';

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
  /**
   * True when the simulation contradicts the ideal time-domain model (gain, vout, fs: cause
   * 'unexplained'); without an ideal value, when the error has the sign FHA theory rules out.
   */
  unexpectedSign?: boolean;
  /** The ideal time-domain model's value of the metric, when the corner has one. */
  ideal?: number | string | boolean | null;
  /** Diverged rows: why FHA and simulation differ (see cause.ts). */
  cause?: DivergenceCause;
}

/** A comparison row beyond tolerance, with its reason (results.json `divergences`). */
export type Divergence = Pick<ComparisonRow, 'metric' | 'fha' | 'sim' | 'error' | 'tolerance' | 'unexpectedSign' | 'ideal' | 'cause'> & { reason: string };
