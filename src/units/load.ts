/**
 * One load entry as written in a design, after parsing: a share of rated power, or an absolute
 * resistance, current or power. SI units; `percent` is a ratio of ratedPower (50 % = 0.5).
 * Lives in units/ because the load parser (parseLoad) produces it; design/ re-exports it.
 */
export type LoadSpec =
  | { kind: 'percent'; value: number } // ratio of ratedPower (50 % = 0.5)
  | { kind: 'ohm'; value: number }
  | { kind: 'ampere'; value: number }
  | { kind: 'watt'; value: number };
