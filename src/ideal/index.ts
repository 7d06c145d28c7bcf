/**
 * The ideal column: the exact periodic steady state of the idealised converter (tdmodel) measured
 * like a simulation, per corner (results.json `ideal`, `idealReason`). Pure.
 */
import type { IdealMetrics, IdealOutcome } from './metrics.js';
import type { CornerResult } from '../results/types.js';

export { idealCorner, measureState, IDEAL_FN_RANGE, SCREENING_POINTS, type IdealMetrics, type IdealOutcome, type IdealOptions } from './metrics.js';
export { modelParams } from './params.js';
export { idealWaveforms } from './waveforms.js';

/** The results.json fields of an outcome: `ideal`, plus `idealReason` when it is null. */
export function idealFields(o: IdealOutcome): { ideal: IdealMetrics | null; idealReason?: string } {
  return o.ideal ? { ideal: o.ideal } : { ideal: null, idealReason: o.reason };
}

/** The corner result with the outcome's `ideal` (and `idealReason`) placed after `fha`, replacing any earlier ones. */
export function withIdeal(r: CornerResult, o: IdealOutcome): CornerResult {
  const { id, inputs, fha, ideal: _ideal, idealReason: _reason, ...rest } = r;
  return { id, inputs, fha, ...idealFields(o), ...rest };
}
