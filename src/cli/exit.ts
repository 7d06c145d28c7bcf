import { constants } from 'node:os';
import type { Results } from '../results/types.js';
import { runFailures, type FailOn } from '../results/gate.js';

/** Exit codes, one table (README "Exit codes", `--help`). */
export const EXIT = {
  ok: 0,
  diverged: 1,
  invalid: 2,
  failed: 3,
  engineUnavailable: 4,
  /** An unexpected internal error (a bug). */
  internal: 70,
  /** 128 + the signal number, the shell's convention for a process ended by a signal. */
  hangup: 129,
  interrupted: 130,
  terminated: 143,
} as const;

/** The one exit-code table: README "Exit codes", `tankcheck --help` and `tankcheck run --help` show it. */
export const EXIT_TABLE: readonly { code: number; meaning: string }[] = [
  { code: EXIT.ok, meaning: 'every simulated corner settled and is within limits; no unexplained divergence; no baseline regression' },
  { code: EXIT.diverged, meaning: 'a limit outside in simulation, an unexplained divergence (any divergence with --fail-on divergence), a corner not settled, a regulated target the simulation cannot reach, a measured point the simulation misses (run --measured), or a baseline regression' },
  { code: EXIT.invalid, meaning: 'bad input: design file problems (file:line:col), bad options, a bad results or baseline file (with the field path), an output path that cannot be written, --only matching no corner; nothing written' },
  { code: EXIT.failed, meaning: 'at least one corner failed to simulate (the others are still reported)' },
  { code: EXIT.engineUnavailable, meaning: 'the simulation engine could not be started' },
  { code: EXIT.internal, meaning: 'internal error (a bug; please report it)' },
  { code: EXIT.hangup, meaning: 'SIGHUP (terminal closed): stopped as for 130' },
  { code: EXIT.interrupted, meaning: 'SIGINT (Ctrl-C): simulators stopped, finished corners written (and cached, so a rerun resumes), results marked incomplete; a second signal stops at once' },
  { code: EXIT.terminated, meaning: 'SIGTERM: stopped as for 130' },
];

/** The exit-code table as plain text lines (for --help). */
export function renderExitTable(): string {
  return EXIT_TABLE.map((e) => `  ${String(e.code).padStart(3)}  ${e.meaning}`).join('\n');
}

/** Exit code for a process stopped by `sig`: 128 + its number (SIGHUP 129, SIGINT 130, SIGTERM 143), the shell's convention. */
export function signalExit(sig: NodeJS.Signals): number {
  return 128 + (constants.signals[sig] ?? 2);
}

/**
 * Exit code of a finished study: interruption (128 + the signal that stopped it, SIGINT when not
 * given), then failed corners, then the run's checks (results/gate.ts `runFailures`: limits outside
 * in simulation, unexplained divergences, or any divergence with failOn 'divergence', corners not
 * settled, baseline regression).
 */
export function exitCodeFor(results: Results, failOn: FailOn = 'default', stoppedBy?: NodeJS.Signals): number {
  if (results.incomplete) return signalExit(stoppedBy ?? 'SIGINT');
  if (results.summary.failed > 0) return EXIT.failed;
  return runFailures(results, failOn).length > 0 ? EXIT.diverged : EXIT.ok;
}

/** A usage or input problem that the CLI reports with exit code 2. */
export class UsageError extends Error {
  override name = 'UsageError';
}
