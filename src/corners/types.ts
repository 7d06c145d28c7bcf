/** Which side of its tolerance band each tank element takes in a corner. */
export type TolSide = -1 | 0 | 1;

/** One operating point to predict and simulate. SI units throughout. */
export interface Corner {
  /** Stable id derived from the parameter values, safe as a file name: [a-z0-9_.-]. */
  id: string;
  vin: number;
  /** Load resistance in ohm (loads in %, W or A are converted at output.voltage). */
  load: number;
  /** Load label as written, e.g. "100%", "12 ohm". */
  loadLabel: string;
  /** Output current and power at output.voltage with this load. */
  iout: number;
  pout: number;
  /** Fixed switching frequency in Hz, or null when regulating. */
  fs: number | null;
  lr: number;
  cr: number;
  lm: number;
  /**
   * Ratio of the equivalent ideal transformer (all leakage on the primary), the one every model
   * uses: tank.turnsRatio for a discrete tank, k Np/Ns for an integrated one.
   */
  turnsRatio: number;
  /** Integrated tank only: the winding ratio Np/Ns as entered (turnsRatio / k). */
  windingRatio?: number;
  tolerance: { lr: TolSide; cr: TolSide; lm: TolSide };
  /** Monte Carlo sample number (tolerances.corners: random), 0-based; absent otherwise. */
  sample?: number;
  /** Each element's relative deviation from nominal in this sample (value = nominal x (1 + d)). */
  deviation?: { lr: number; cr: number; lm: number; turnsRatio: number };
}
