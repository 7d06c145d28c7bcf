export { reducedRankExtrapolation } from './extrapolate.js';
export { extrapolateSeed, MAX_EXTRAPOLATION_STEP, EXTRAPOLATION_STATES, type StateScales } from './seed.js';
export { windowSettle, type WindowSettle } from './settle.js';
