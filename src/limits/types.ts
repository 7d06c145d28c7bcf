/**
 * Checks of a corner against the design's `limits` (results.json `checks`). Values are SI (Hz, A, V).
 */

/** Names of the checks, after the design keys (`frequency.min`/`.max` for the window; `region` is always checked). */
export type LimitName =
  | 'region'
  | 'frequency.min'
  | 'frequency.max'
  | 'zvs'
  | 'zvsMargin'
  | 'crVoltage'
  | 'tankCurrentRms'
  | 'switchCurrentRms'
  | 'diodeReverseVoltage'
  | 'diodeCurrentRms'
  | 'outputRippleCurrentRms';

/** One model's verdict on a check: the value it gives, and whether that value is within the bound (null: no value). */
export interface CheckSide {
  value: number | boolean | string | null;
  within: boolean | null;
}

/** One limit checked at one corner on FHA, the ideal model and the simulation. */
export interface LimitCheck {
  limit: LimitName;
  /**
   * The bound the value is held to: for an upper limit (`kind` 'max') rating x derating;
   * for a lower limit ('min') the window's min, or (1 + zvsMargin) x 2 Coss Vin / deadTime in A;
   * for a state ('state') the required state: 'inductive' or true (ZVS).
   */
  bound: number | string | boolean;
  kind: 'max' | 'min' | 'state';
  fha: CheckSide;
  /** null when the corner has no ideal-model column. */
  ideal: CheckSide | null;
  /** null when the corner was not simulated (or the simulation failed). */
  sim: CheckSide | null;
  /** FHA says within and the simulation says outside, or the reverse. */
  flip: boolean;
}
