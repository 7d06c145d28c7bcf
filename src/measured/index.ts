export { parseMeasured, MAX_ROWS } from './parse.js';
export { COLUMNS, splitHeader, type ColumnSpec } from './columns.js';
export type { MeasuredPoint, MeasuredProblem, MeasuredParse, MeasuredReport, MeasuredSummary } from './types.js';
export { measuredCorners, measuredLoad } from './corners.js';
export { attachMeasured, measuredReport } from './attach.js';
export { gapHint, measuredEfficiency, measuredErrors, MEASURED_METRICS, type GapHint, type MeasuredErrors } from './compare.js';
