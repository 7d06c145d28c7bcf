import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { FhaResult } from '../fha/types.js';
import type { CornerResult, Divergence, SimSummary } from '../results/types.js';
import { cornerInputs } from '../results/build.js';

/**
 * A regulated corner whose target output lies above the simulated peak gain: status `unreachable`
 * (a design verdict, not a tool failure), `sim` measured at the closest point (`sim.closest`), the
 * reason in `failure`. When FHA found a frequency for the target, FHA and simulation disagree on
 * reachability: that is a status divergence on `fs`.
 */
export function unreachableResult(design: Design, corner: Corner, fha: FhaResult, sim: SimSummary & { closest: NonNullable<SimSummary['closest']> }): CornerResult {
  const c = sim.closest;
  const message = `${design.output.voltage} V is above what the simulated converter delivers: the highest output found is ` +
    `${c.vout.toPrecision(5)} V at ${(c.fs / 1e3).toPrecision(5)} kHz (${c.region} region) in ${sim.simulations} operating points`;
  const divergences: Divergence[] = fha.fs === null ? [] : [{
    metric: 'fs', fha: fha.fs, sim: null, error: null, tolerance: null,
    reason: `FHA regulates at ${(fha.fs / 1e3).toPrecision(5)} kHz, but the simulation cannot reach ${design.output.voltage} V at any frequency: FHA over-predicts the peak gain here`,
  }];
  return { id: corner.id, inputs: cornerInputs(corner), fha, sim, comparison: divergences.map((d) => ({ ...d, verdict: 'diverged' as const })),
    divergences, status: 'unreachable', failure: { kind: 'unreachable', message } };
}
