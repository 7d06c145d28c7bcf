import type { Results } from '../results/types.js';
import { runFailures, type FailOn } from '../results/gate.js';

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

/** The one exit-code table: README "Exit codes" and `tankcheck run --help` show it. */
export const EXIT_TABLE: readonly { code: number; meaning: string }[] = [
  { code: EXIT.ok, meaning: 'every simulated corner settled and is within limits; no unexplained divergence; no baseline regression' },
  { code: EXIT.diverged, meaning: 'a limit outside in simulation, an unexplained divergence (any divergence with --fail-on divergence), a corner not settled, a regulated target the simulation cannot reach, a measured point the simulation misses (run --measured), or a baseline regression' },
  { code: EXIT.invalid, meaning: 'bad input: design file problems (file:line:col), bad options, unreadable baseline; nothing written' },
  { code: EXIT.failed, meaning: 'at least one corner failed to simulate (the others are still reported)' },
  { code: EXIT.engineUnavailable, meaning: 'the simulation engine could not be started' },
  { code: EXIT.internal, meaning: 'internal error (a bug; please report it)' },
  { code: EXIT.interrupted, meaning: 'interrupted; finished corners are written, the results are marked incomplete' },
];

/** The exit-code table as plain text lines (for --help). */
export function renderExitTable(): string {
  return EXIT_TABLE.map((e) => `  ${String(e.code).padStart(3)}  ${e.meaning}`).join('\n');
}

/**
 * Exit code of a finished study: interruption, then failed corners, then the run's checks
 * (results/gate.ts `runFailures`: limits outside in simulation, unexplained divergences, or any
 * divergence with failOn 'divergence', corners not settled or unreachable in simulation, baseline regression).
 */
export function exitCodeFor(results: Results, failOn: FailOn = 'default'): number {
  if (results.incomplete) return EXIT.interrupted;
  if (results.summary.failed > 0) return EXIT.failed;
  return runFailures(results, failOn).length > 0 ? EXIT.diverged : EXIT.ok;
}

/** A usage or input problem that the CLI reports with exit code 2. */
export class UsageError extends Error {
  override name = 'UsageError';
}
