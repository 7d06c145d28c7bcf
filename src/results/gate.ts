import type { CornerResult, Divergence, Results } from './types.js';

/**
 * What makes a run fail (exit code 1). 'default': a limit outside in simulation, an unexplained
 * divergence, a corner not settled, a measured point the simulation misses, a baseline regression. 'divergence': as before limits existed,
 * any divergence beyond tolerance as well (`--fail-on divergence`).
 */
export type FailOn = 'default' | 'divergence';

/**
 * A divergence counts against the run by default only when nothing explains it: its `cause` is
 * 'unexplained', or it has no cause (results without the ideal-model classification).
 */
export function isUnexplained(d: Divergence): boolean {
  return d.cause === undefined || d.cause === 'unexplained';
}

/** The divergences of a corner that fail the run under `failOn`. */
export function failingDivergences(c: CornerResult, failOn: FailOn = 'default'): Divergence[] {
  return failOn === 'divergence' ? c.divergences : c.divergences.filter(isUnexplained);
}

/** Why one corner fails the run under `failOn` (empty when it passes); a failed simulation is not counted here (exit 3). */
export function cornerFailures(c: CornerResult, failOn: FailOn = 'default'): string[] {
  const out: string[] = [];
  if (c.status === 'not-settled') out.push('not settled');
  // simulated and out of reach: a design verdict (FHA-only results carry no sim and do not count)
  if (c.status === 'unreachable' && c.sim) out.push(`unreachable: ${c.failure?.message ?? 'target above the simulated peak gain'}`);
  const outside = (c.checks ?? []).filter((x) => x.sim?.within === false).map((x) => x.limit);
  if (outside.length && c.status !== 'failed') out.push(`outside limits in simulation: ${outside.join(', ')}`);
  const div = c.status === 'failed' ? [] : failingDivergences(c, failOn);
  if (div.length) out.push(`${failOn === 'divergence' ? '' : 'unexplained '}divergence: ${div.map((d) => d.metric).join(', ')}`);
  if (c.measured?.within === false) out.push(`simulation misses the measured point (line ${c.measured.line}) by more than ${(c.measured.tolerance * 100).toFixed(1)} %`);
  return out;
}

/** One line per reason the run fails under `failOn` (empty: it passes); failed corners and interruption are separate exit codes. */
export function runFailures(results: Results, failOn: FailOn = 'default'): string[] {
  const lines = results.corners.flatMap((c) => cornerFailures(c, failOn).map((why) => `${c.id}: ${why}`));
  if (results.baseline?.regressed) lines.push(`baseline ${results.baseline.file}: regressed`);
  return lines;
}
