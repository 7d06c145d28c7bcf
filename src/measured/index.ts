export { parseMeasured, MAX_ROWS } from './parse.js';
export { COLUMNS, splitHeader, type ColumnSpec } from './columns.js';
export type { MeasuredPoint, MeasuredProblem, MeasuredParse } from './types.js';
