/**
 * The retry ladder for convergence failures (they fail within milliseconds, so retrying is cheap):
 * its one policy, RETRY_LADDER, and runWithRetries, which does the runs. The deck rewrites each rung
 * applies live in src/netlist/rewrite.ts.
 */
import type { Attempt, SimEngine, SimJob, SimResult } from './types.js';
import { addRshunt, switchIntegrationMethod, zeroStart } from '../netlist/rewrite.js';

/** One rung: a label for reports and a rewrite of the deck as configured. */
export interface RetryRung {
  label: string;
  transform(deck: string): string;
}

/** Label of the last rung; a run that needed it starts a new trajectory (earlier settling history no longer applies). */
export const ZERO_START_LABEL = 'zero-state start';

/**
 * The ladder after 'as configured', in order: a stronger shunt conductance (system ngspice only: the
 * wasm build ignores the option, so the deck's own 1 Gohm node shunts stay the portable path), the
 * other integration method, then a start from rest. Each rung rewrites the original deck.
 */
export const RETRY_LADDER: readonly RetryRung[] = [
  { label: 'rshunt=1e7', transform: (d) => addRshunt(d, 1e7) },
  { label: 'other integration method', transform: switchIntegrationMethod },
  { label: ZERO_START_LABEL, transform: zeroStart },
];

function attemptOf(label: string, r: SimResult): Attempt {
  const a: Attempt = { label, outcome: r.failure?.kind ?? 'ok', wallMs: r.wallMs };
  if (r.failure) a.message = r.failure.message;
  return a;
}

/**
 * Runs the job as configured; after a convergence failure tries each rung in order (each rewrites the
 * original deck) until one run does not fail on convergence. Returns the last result with every try
 * listed in `attempts`; a convergence failure that survived the rungs says which were tried.
 * @param rungs default RETRY_LADDER (other ladders are for tests)
 */
export async function runWithRetries(
  engine: SimEngine,
  job: SimJob,
  rungs: readonly RetryRung[] = RETRY_LADDER,
): Promise<SimResult & { attempts: Attempt[] }> {
  let result = await engine.run(job);
  const attempts = [attemptOf('as configured', result)];
  for (const rung of rungs) {
    if (result.failure?.kind !== 'convergence' || job.signal?.aborted) break;
    result = await engine.run({ ...job, deck: rung.transform(job.deck) });
    attempts.push(attemptOf(rung.label, result));
  }
  if (result.failure?.kind === 'convergence' && attempts.length > 1) {
    const tried = attempts.map((a) => a.label).join(', ');
    result = { ...result, failure: { ...result.failure, message: `${result.failure.message} (after ${attempts.length} attempts: ${tried})` } };
  }
  return { ...result, attempts };
}
