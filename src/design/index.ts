export type * from './types.js';
export { parseDesign, MAX_ALIAS_COUNT, ROOT_KEYS, type ParseDesignResult } from './parse.js';
export { loadDesign, loadDesignOrThrow, DesignError, MAX_FILE_BYTES } from './load.js';
export { filterModelText, type FilterResult } from './filterModel.js';
export { formatProblem, type Problem, type ProblemCode } from './problem.js';
export { designJsonSchema } from './jsonSchema.js';
export { decodeUtf8, firstInvalidUtf8, type DecodeResult } from './utf8.js';
