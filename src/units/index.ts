export { parseQuantity, type ParseResult } from './parse.js';
export { parseLoad } from './parseLoad.js';
export type { LoadSpec } from './load.js';
export { formatSi, formatSpice, formatSpiceEng, type FormatSiOptions } from './format.js';
export { eng, finite, idNumber, num, pct, pctAbs, plain, sig } from './display.js';
export {
  KIND_EXAMPLE,
  KIND_NOUN,
  PREFIXES,
  UNIT_SPELLINGS,
  UNIT_SYMBOL,
  loadPattern,
  quantityPattern,
  type PhysicalKind,
  type Prefix,
  type UnitKind,
} from './table.js';
