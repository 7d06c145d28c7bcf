/**
 * Time-domain steady-state model of the LLC converter (pure, no I/O): exact piecewise-linear
 * integration with event location, Newton shooting for the half-wave-symmetric periodic state,
 * and solvers for a held output, a resistive load and the frequency for a target output.
 */
export type {
  TdParams, RectMode, Segment, SeedState, PowerBalance, HeldOutputResult, SteadyStateResult, FrequencyResult,
} from './types.js';
export { solveHeldOutput, type HeldOptions } from './held.js';
export { solveSteadyState, fhaVo, type SteadyOptions } from './steady.js';
export { solveFrequency, type FrequencyOptions } from './frequency.js';
export { tdParamsFromCorner } from './params.js';
