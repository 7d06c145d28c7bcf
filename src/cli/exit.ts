import type { Results } from '../results/types.js';

/** Exit codes, one table (README "Exit codes"). */
export const EXIT = {
  ok: 0,
  diverged: 1,
  invalid: 2,
  failed: 3,
  engineUnavailable: 4,
  /** An unexpected internal error (a bug). */
  internal: 70,
  interrupted: 130,
} as const;

/** Exit code of a finished study: failures outrank divergences and baseline regressions. */
export function exitCodeFor(results: Results): number {
  if (results.incomplete) return EXIT.interrupted;
  if (results.summary.failed > 0) return EXIT.failed;
  if (results.summary.diverged > 0 || results.summary.notSettled > 0 || results.baseline?.regressed) return EXIT.diverged;
  return EXIT.ok;
}

/** A usage or input problem that the CLI reports with exit code 2. */
export class UsageError extends Error {
  override name = 'UsageError';
}
