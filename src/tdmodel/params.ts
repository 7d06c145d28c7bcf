import type { Design } from '../design/types.js';
import type { Corner } from '../corners/types.js';
import type { TdParams } from './types.js';

/** TdParams of one corner of a design at switching frequency fs (Hz). */
export function tdParamsFromCorner(design: Design, corner: Pick<Corner, 'vin' | 'lr' | 'cr' | 'lm' | 'turnsRatio'>, fs: number): TdParams {
  return {
    inverter: design.topology.inverter,
    rectifier: design.topology.rectifier,
    vin: corner.vin,
    fs,
    lr: corner.lr,
    cr: corner.cr,
    lm: corner.lm,
    n: corner.turnsRatio,
    coss: design.switches.coss,
    deadTime: design.switches.deadTime,
    vf: design.rectifier.forwardVoltage,
    rd: design.rectifier.resistance,
    rdsOn: design.switches.rdsOn,
  };
}
