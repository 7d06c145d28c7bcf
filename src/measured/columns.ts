import type { UnitKind } from '../units/index.js';

/** How one column of a measured-points file is read. */
export interface ColumnSpec {
  /** Header name (case sensitive, as in the design file's style). */
  name: string;
  /** Quantity kind; 'load' takes the design file's load notation; 'text' is kept as written. */
  kind: Exclude<UnitKind, 'ratio' | 'number'> | 'load' | 'text';
  required: boolean;
}

/** The columns a measured-points file may hold: four required, the rest optional. */
export const COLUMNS: readonly ColumnSpec[] = [
  { name: 'vin', kind: 'volt', required: true },
  { name: 'load', kind: 'load', required: true },
  { name: 'fs', kind: 'hertz', required: true },
  { name: 'vout', kind: 'volt', required: true },
  { name: 'iin', kind: 'ampere', required: false },
  { name: 'pin', kind: 'watt', required: false },
  { name: 'tankCurrentRms', kind: 'ampere', required: false },
  { name: 'crVoltagePeak', kind: 'volt', required: false },
  { name: 'switchTurnOffCurrent', kind: 'ampere', required: false },
  { name: 'note', kind: 'text', required: false },
];

/** Units a header may carry in brackets for a load column (`load [%]`, `load [ohm]`, ...). */
export const LOAD_HEADER_UNITS = ['%', 'ohm', 'A', 'W'] as const;

/** `vin [V]` -> { name: 'vin', unit: 'V' }; `vin` -> { name: 'vin' }. Spaces around are ignored. */
export function splitHeader(cell: string): { name: string; unit?: string } {
  const m = /^\s*([^[\]]*?)\s*(?:\[\s*([^\]]*?)\s*\])?\s*$/.exec(cell);
  if (!m) return { name: cell.trim() };
  return m[2] === undefined ? { name: m[1] } : { name: m[1], unit: m[2] };
}
