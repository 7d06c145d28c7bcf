/**
 * Time-domain steady-state model of the LLC converter (pure: no I/O, no clock).
 *
 * Circuit, primary-referred: DC input Vin; half bridge (node 0..Vin, Cr blocks Vin/2) or full
 * bridge (+-Vin); series Lr and Cr; Lm across an ideal n:1 transformer (center-tapped: Ns is one
 * half winding); diodes of VF + rd i (one in the path center-tapped, two full-bridge); output
 * held at a DC voltage. Switches of rdsOn (one in the path HB, two FB; body diodes the same);
 * dead time with the node swung by the tank current through 2 Coss per leg and clamped at the
 * rails; a gate edge with the node off its rail forces it there (hard switching).
 *
 * Conventions (shared with the SPICE deck): t = 0 is the turn-off of the low-side switch (FB:
 * S2-S3), the start of the dead time; the high side (S1-S4) conducts [td, T/2), the low side
 * [T/2 + td, T). Tank current positive from the bridge node (FB: leg A) into Lr; Cr voltage
 * bridge side minus transformer side; i_m and i_sec = i_r - i_m referred to the primary with
 * the same sign (i_sec > 0 in P). Mode labels cover the half period from the high-side turn-on.
 *
 * Method: exact piecewise-linear integration (Taylor series summed to rounding error in steps
 * of at most 1 rad of the fastest natural frequency) with event location at every rectifier
 * and bridge transition; the half-wave-symmetric periodic state by Newton shooting with a
 * finite-difference Jacobian (fixed-point fallback); the load and frequency by outer solves.
 */
export type {
  TdParams, RectMode, Segment, SeedState, PowerBalance, HeldOutputResult, SteadyStateResult, FrequencyResult,
} from './types.js';
export { solveHeldOutput, type HeldOptions } from './held.js';
export { solveSteadyState, fhaVo, type SteadyOptions } from './periodic.js';
export { solveFrequency, type FrequencyOptions } from './frequency.js';
export { tdParamsFromCorner } from './params.js';
export { modeLabel } from './result.js';
