import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import { diodeFit, THERMAL_VOLTAGE } from '../netlist/devices.js';
import { tdParamsFromCorner, type TdParams } from '../tdmodel/index.js';

/**
 * Time-domain model parameters matching the deck. The model's diode is VF + rd i; the deck's fitted
 * diode is exponential, so VF is taken where that diode sits at this corner's load: its knee at the
 * output current (the average diode current while conducting). A user diode model keeps the
 * design's forwardVoltage and resistance.
 */
export function modelParams(design: Design, corner: Corner, fs: number): TdParams {
  const p = tdParamsFromCorner(design, corner, fs);
  if (design.devices.diodeModel) return p;
  const f = diodeFit(design);
  return { ...p, vf: f.n * THERMAL_VOLTAGE * Math.log(corner.iout / f.is + 1), rd: f.rs };
}
