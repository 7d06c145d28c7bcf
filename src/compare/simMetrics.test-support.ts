import type { FhaResult } from '../fha/types.js';
import type { SimMetrics } from '../measure/types.js';

/**
 * Synthetic simulated metrics equal to a corner's FHA values, then overridden: plumbing for tests
 * of the comparison and its causes (invented numbers, not a check of the physics).
 */
export function simLike(fha: FhaResult, over: Partial<SimMetrics> = {}): SimMetrics {
  const base: SimMetrics = {
    fs: fha.fs!, gain: fha.gain!, vout: fha.vout!, voutRipple: 0.1, iout: fha.iout!, pout: fha.vout! * fha.iout!,
    tankCurrentRms: fha.tankCurrentRms!, tankCurrentPeak: fha.tankCurrentPeak!, magnetizingCurrentPeak: fha.magnetizingCurrentPeak!,
    crVoltagePeak: fha.crVoltagePeak!, crVoltageMin: fha.crVoltageMin!, switchCurrentRms: fha.switchCurrentRms!,
    switchTurnOffCurrent: fha.switchTurnOffCurrent!, diodeCurrentAvg: fha.diodeCurrentAvg!, diodeCurrentPeak: fha.diodeCurrentPeak!,
    diodeCurrentRms: fha.diodeCurrentRms!, diodeReverseVoltage: fha.diodeReverseVoltage!, diodeReverseCurrent: 0,
    outputRippleCurrentRms: fha.outputRippleCurrentRms!, zvs: true, zvsState: 'zvs', zvsWorstVoltage: 0, zvsMarginTime: 1e-7,
    zcs: true, zcsRatio: 0, region: 'inductive', mode: 'PO',
  };
  return { ...base, ...over };
}
