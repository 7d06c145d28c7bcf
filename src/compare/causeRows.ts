import type { SimMetrics } from '../measure/types.js';
import type { ComparisonRow } from './types.js';
import { classifyCause } from './cause.js';

/** Rows whose `?` flag (unexpectedSign) comes from the ideal model when there is one. */
const GAIN_LIKE = new Set(['gain', 'vout', 'fs']);

/**
 * Adds the ideal model's value to every row (null when the corner has no ideal metrics) and a
 * cause to every diverged row, its note appended to the reason. The `?` flag on gain, vout and
 * fs then means "the simulation contradicts the ideal model" (cause 'unexplained'). Without ideal
 * metrics the flag keeps FHA's sign rule, except that a gain rise in a mode with a rectifier-off
 * (O) interval is never flagged: Lm joining the resonance raises the gain at light load on
 * either side of fr.
 */
export function applyCauses(rows: ComparisonRow[], sim: SimMetrics, ideal: SimMetrics | null, deadTime: number): void {
  for (const r of rows) {
    const iv = ideal ? (ideal as unknown as Record<string, number | string | boolean>)[r.metric] : null;
    r.ideal = iv === undefined ? null : iv;
    if (r.verdict !== 'diverged') continue;
    const v = classifyCause(r.metric, r.sim, r.ideal, r.tolerance, { sim, ideal, deadTime });
    r.cause = v.cause;
    if (GAIN_LIKE.has(r.metric)) {
      const suspect = ideal ? v.cause === 'unexplained' : r.unexpectedSign === true && !(r.error !== null && r.error > 0 && sim.mode.includes('O'));
      // FHA's fixed sign rule called this suspect, the ideal model (or the mode) says otherwise: drop that wording.
      if (r.unexpectedSign && !suspect) r.reason = `FHA's rule of thumb for the sign of its error (below fr the real gain is higher, above fr lower) does not hold at this corner (mode ${sim.mode})`;
      if (suspect) r.unexpectedSign = true;
      else delete r.unexpectedSign;
    }
    r.reason = r.reason ? `${r.reason}. ${capitalise(v.note)}` : capitalise(v.note);
  }
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
