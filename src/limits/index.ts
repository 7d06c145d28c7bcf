export type * from './types.js';
export { evaluateLimits, limitRules, outsideInSimulation, usage, withinBound, worstCheck, zvsCurrent, type MetricSource } from './evaluate.js';
