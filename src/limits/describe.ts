import { formatSi } from '../units/index.js';
import type { CheckSide, LimitCheck, LimitName } from './types.js';
import { usage } from './evaluate.js';

/** Unit symbol of each check's value and bound ('' for states). */
export const LIMIT_UNIT: Record<LimitName, string> = {
  region: '', 'frequency.min': 'Hz', 'frequency.max': 'Hz', zvs: '', zvsMargin: 'A', crVoltage: 'V', tankCurrentRms: 'A',
  switchCurrentRms: 'A', diodeReverseVoltage: 'V', diodeCurrentRms: 'A', outputRippleCurrentRms: 'A',
};

/** A check's value or bound for people: `412.3 V`, `inductive`, `ZVS` / `no ZVS`, `-` without a value. */
export function showValue(c: Pick<LimitCheck, 'limit'>, v: CheckSide['value'] | LimitCheck['bound']): string {
  if (v === null) return '-';
  if (typeof v === 'number') return formatSi(v, LIMIT_UNIT[c.limit]);
  if (typeof v === 'boolean') return c.limit === 'zvs' ? (v ? 'ZVS' : 'no ZVS') : String(v);
  return v;
}

/** The bound as a condition: `<= 360 V`, `>= 702 mA`, `inductive`, `ZVS`. */
export function showBound(c: Pick<LimitCheck, 'limit' | 'kind' | 'bound'>): string {
  const b = showValue(c, c.bound);
  return c.kind === 'max' ? `<= ${b}` : c.kind === 'min' ? `>= ${b}` : b;
}

/** Usage of a bound as a percentage, `92%`; '' for states and missing values. */
export function showUsage(c: LimitCheck, s: CheckSide | null): string {
  const u = usage(c, s);
  if (u === null || c.kind === 'state') return '';
  return Number.isFinite(u) ? `${Math.round(u * 100)}%` : '>1000%';
}

/** One line about a check, e.g. `crVoltage: sim 412 V, FHA 350 V, bound <= 360 V (FHA missed this)`. */
export function describeCheck(c: LimitCheck): string {
  const part = (name: string, s: CheckSide | null): string =>
    s ? `${name} ${showValue(c, s.value)}${s.within === null ? '' : s.within ? ' within' : ' OUTSIDE'}` : '';
  const parts = [part('sim', c.sim), part('ideal', c.ideal), part('FHA', c.fha)].filter(Boolean).join(', ');
  const flip = c.flip ? (c.fha.within ? ' (FHA missed this)' : ' (FHA flagged it, simulation is within)') : '';
  return `${c.limit}: ${parts}; bound ${showBound(c)}${flip}`;
}
