import type { FhaResult } from '../fha/types.js';
import type { SimMetrics } from '../measure/types.js';

/** Where a corner sits relative to resonance, the key to how FHA errs (docs/method.md#fha-limits). */
export type Zone = 'near' | 'below' | 'above' | 'near-fp';

/**
 * Zone by the simulated frequency: within 5 % of fr is "near"; below 1.2 fp (close to the no-load
 * pole) FHA may even over-predict gain (docs/method.md#near-fp).
 */
export function zoneOf(fs: number, fr: number, fp: number): Zone {
  const fn = fs / fr;
  if (fn >= 0.95 && fn <= 1.05) return 'near';
  if (fn > 1.05) return 'above';
  return fs < 1.2 * fp ? 'near-fp' : 'below';
}

/** Gain losses that FHA leaves out (dead time, Rds(on), diode resistance) may lower the simulated gain by this much. */
export const LOSS_ALLOWANCE = 0.02;

export interface Explanation {
  reason: string;
  unexpectedSign: boolean;
}

/** Why the simulated gain (or output voltage) differs from FHA, and whether the sign is plausible. */
export function explainGain(zone: Zone, err: number, mode: string): Explanation {
  switch (zone) {
    case 'below':
      return err >= -LOSS_ALLOWANCE
        ? { reason: `below resonance (mode ${mode}): Lm joins the resonance while the rectifier is off, so FHA under-predicts gain (${doc('below-resonance')})`, unexpectedSign: false }
        : { reason: `below resonance the real gain should exceed FHA, yet simulation is ${pct(err)} lower: suspect the model (turns ratio, bridge factor, drops, losses) rather than FHA (${doc('below-resonance')})`, unexpectedSign: true };
    case 'above':
      return err <= LOSS_ALLOWANCE / 4
        ? { reason: `above resonance (mode ${mode}): the switching edge cuts the secondary current, so FHA over-predicts gain (${doc('above-resonance')})`, unexpectedSign: false }
        : { reason: `above resonance the real gain should fall below FHA, yet simulation is ${pct(err)} higher: suspect the model rather than FHA (${doc('above-resonance')})`, unexpectedSign: true };
    case 'near-fp':
      return { reason: `close to the no-load pole fp (mode ${mode}): FHA can err either way here (${doc('near-fp')})`, unexpectedSign: false };
    case 'near':
      return { reason: `within 5 % of resonance FHA should hold; a gap this size points at the model (units, turns ratio, half-bridge factor, drops, dead time) (${doc('near-resonance')})`, unexpectedSign: true };
  }
}

/**
 * Regulated mode: the frequency that meets the target moves opposite to the gain error (gain
 * falls with frequency on the inductive branch): a higher simulated gain needs a higher frequency.
 */
export function explainFrequency(zone: Zone, err: number, mode: string): Explanation {
  const g = explainGain(zone, err, mode);
  if (zone === 'below') return { reason: `${g.reason}; more gain means a higher frequency meets the target`, unexpectedSign: err < -LOSS_ALLOWANCE };
  if (zone === 'above') return { reason: `${g.reason}; less gain means a lower frequency meets the target`, unexpectedSign: err > LOSS_ALLOWANCE };
  return g;
}

export function explainCurrent(metric: string, zone: Zone, fha: FhaResult, sim: SimMetrics): string {
  if (metric === 'magnetizingCurrentPeak' || metric === 'tankCurrentRms' || metric === 'tankCurrentPeak' || metric === 'switchCurrentRms')
    return `FHA takes the magnetizing current as a sinusoid; the real one is nearly a triangle, up to pi^2/8 = 1.23 x FHA's peak${zone === 'below' ? `, more with the ${sim.mode} intervals below resonance` : ''} (${doc('magnetizing-current')})`;
  if (metric === 'switchTurnOffCurrent')
    return zone === 'above' || zone === 'near'
      ? `the turn-off current is the magnetizing peak plus the load share at the edge; FHA uses a phase-shifted sinusoid (${doc('turn-off-current')})`
      : `below resonance the switch turns off on the magnetizing current at the end of the O interval, which FHA misses (${doc('turn-off-current')})`;
  if (metric.startsWith('diodeCurrent'))
    return `the diode current is a half-sine minus the magnetizing ramp, not a pure half-sine; mode ${sim.mode} (${doc('diode-currents')})`;
  if (metric === 'outputRippleCurrentRms')
    return zone === 'below' ? `gaps in rectifier conduction below resonance raise the capacitor ripple current (${doc('diode-currents')})` : `the rectified current is not a pure half-sine (${doc('diode-currents')})`;
  void fha;
  return `FHA stress estimates assume sinusoidal currents (${doc('stresses')})`;
}

export function explainStatus(metric: 'zvs' | 'zcs' | 'region', zone: Zone, fha: FhaResult, sim: SimMetrics): string {
  if (metric === 'zvs')
    return sim.zvs
      ? `simulation keeps ZVS where FHA expects to lose it: the real turn-off current exceeds FHA's (${doc('region-boundary')})`
      : `simulation loses ZVS (worst edge at ${pct(sim.zvsWorstVoltage)} of Vin): the turn-off current does not swing the bridge node within the dead time${sim.region === 'capacitive' ? ', the tank is capacitive' : ''} (${doc('zvs')})`;
  if (metric === 'zcs')
    return zone === 'near'
      ? `at resonance the diode current reaches zero exactly at the switching edge, so the verdict is marginal (${doc('zcs')})`
      : `the diode commutation differs from the FHA expectation (fs ${fha.fs !== null && sim.fs > fha.fs ? 'higher' : 'lower'} in simulation; ${doc('zcs')})`;
  return `FHA places the zero-phase boundary from the sinusoidal input impedance; the real one moves with the interval sequence (${doc('region-boundary')})`;
}

/** Where a reason's explanation is written out: a section of docs/method.md (its anchors are stable). */
export function doc(section: string): string {
  return `docs/method.md#${section}`;
}

function pct(x: number): string {
  return `${(x * 100).toFixed(1)} %`;
}
