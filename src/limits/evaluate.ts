import type { Design, DesignLimits } from '../design/types.js';
import type { CheckSide, LimitCheck, LimitName } from './types.js';

/** Any model's metrics read by name (FHA, the ideal model and simulation share the metric names). */
export type MetricSource = object;

/**
 * Current that swings one bridge leg's node over the full input voltage within the dead time, A:
 * I_zvs = 2 Coss Vin / deadTime (common practice: both output capacitances of the leg are charged
 * and discharged together). The same per leg for a half- and a full-bridge (each full-bridge leg
 * has its own two switches and carries the same tank current).
 */
export function zvsCurrent(design: Pick<Design, 'switches'>, vin: number): number {
  return (2 * design.switches.coss * vin) / design.switches.deadTime;
}

const num = (m: MetricSource | null | undefined, key: string): number | null => {
  const v = (m as Record<string, unknown> | null | undefined)?.[key];
  return typeof v === 'number' && Number.isFinite(v) ? v : null;
};

/** Peak voltage across Cr: the larger of its highest value and minus its lowest. */
function crPeak(m: MetricSource | null | undefined): number | null {
  const hi = num(m, 'crVoltagePeak');
  const lo = num(m, 'crVoltageMin');
  if (hi === null && lo === null) return null;
  return Math.max(hi === null ? 0 : Math.abs(hi), lo === null ? 0 : Math.abs(lo));
}

interface Rule {
  limit: LimitName;
  kind: LimitCheck['kind'];
  bound: number | string | boolean;
  read: (m: MetricSource | null | undefined) => number | boolean | string | null;
}

const RATINGS = ['crVoltage', 'tankCurrentRms', 'switchCurrentRms', 'diodeReverseVoltage', 'diodeCurrentRms', 'outputRippleCurrentRms'] as const;

/** The rules a design's limits set at one corner (input voltage `vin`), in a fixed order. */
export function limitRules(design: Pick<Design, 'switches' | 'limits'>, vin: number): Rule[] {
  const l: DesignLimits | undefined = design.limits;
  const rules: Rule[] = [{
    limit: 'region', kind: 'state', bound: 'inductive',
    read: (m) => { const v = (m as Record<string, unknown> | null | undefined)?.region; return typeof v === 'string' ? v : null; },
  }];
  if (l?.frequency?.min !== undefined) rules.push({ limit: 'frequency.min', kind: 'min', bound: l.frequency.min, read: (m) => num(m, 'fs') });
  if (l?.frequency?.max !== undefined) rules.push({ limit: 'frequency.max', kind: 'max', bound: l.frequency.max, read: (m) => num(m, 'fs') });
  if (l?.zvs === 'required') {
    rules.push({ limit: 'zvs', kind: 'state', bound: true,
      read: (m) => { const v = (m as Record<string, unknown> | null | undefined)?.zvs; return typeof v === 'boolean' ? v : null; } });
  }
  if (l?.zvsMargin !== undefined) {
    rules.push({ limit: 'zvsMargin', kind: 'min', bound: (1 + l.zvsMargin) * zvsCurrent(design, vin), read: (m) => num(m, 'switchTurnOffCurrent') });
  }
  for (const key of RATINGS) {
    const rating = l?.[key];
    if (rating === undefined) continue;
    rules.push({ limit: key, kind: 'max', bound: rating * (l?.derating ?? 1), read: key === 'crVoltage' ? crPeak : (m) => num(m, key) });
  }
  return rules;
}

/** Whether `value` satisfies a rule's bound; null when there is no value. */
export function withinBound(kind: LimitCheck['kind'], bound: number | string | boolean, value: number | boolean | string | null): boolean | null {
  if (value === null) return null;
  if (kind === 'state') return value === bound;
  if (typeof value !== 'number' || typeof bound !== 'number') return null;
  return kind === 'max' ? value <= bound : value >= bound;
}

const side = (rule: Rule, m: MetricSource | null | undefined): CheckSide => {
  const value = rule.read(m);
  return { value, within: withinBound(rule.kind, rule.bound, value) };
};

/**
 * Every limit of the design checked at one corner on FHA, the ideal model (when given) and the
 * simulation (when given). `region` is always checked: capacitive operation is always outside.
 * `flip` marks a check where FHA and the simulation disagree on within/outside.
 */
export function evaluateLimits(design: Pick<Design, 'switches' | 'limits'>, vin: number, fha: MetricSource,
  sim: MetricSource | null, ideal?: MetricSource | null): LimitCheck[] {
  return limitRules(design, vin).map((rule) => {
    const f = side(rule, fha);
    const s = sim ? side(rule, sim) : null;
    const flip = s !== null && f.within !== null && s.within !== null && f.within !== s.within;
    return { limit: rule.limit, bound: rule.bound, kind: rule.kind, fha: f, ideal: ideal ? side(rule, ideal) : null, sim: s, flip };
  });
}

/** True when any simulated check is outside its bound (the corner's status becomes `outside-limits`). */
export function outsideInSimulation(checks: readonly LimitCheck[] | undefined): boolean {
  return (checks ?? []).some((c) => c.sim?.within === false);
}

/**
 * How much of a bound a value uses: value / bound for an upper limit, bound / value for a lower
 * one, so that above 1 is outside either way; for a state 0 (met) or Infinity (not met). null without a value.
 */
export function usage(c: Pick<LimitCheck, 'kind' | 'bound'>, s: CheckSide | null): number | null {
  if (!s || s.value === null || s.within === null) return null;
  if (c.kind === 'state') return s.within ? 0 : Infinity;
  const v = s.value as number;
  const b = c.bound as number;
  if (c.kind === 'max') return b === 0 ? Infinity : v / b;
  return v <= 0 ? Infinity : b / v;
}

/** The check that uses most of its bound in simulation (FHA when not simulated), with that usage. */
export function worstCheck(checks: readonly LimitCheck[] | undefined): { check: LimitCheck; usage: number; source: 'sim' | 'fha' } | null {
  let best: { check: LimitCheck; usage: number; source: 'sim' | 'fha' } | null = null;
  for (const c of checks ?? []) {
    const source = c.sim ? 'sim' : 'fha';
    const u = usage(c, c.sim ?? c.fha);
    if (u === null || (c.kind === 'state' && u === 0)) continue;
    if (!best || u > best.usage) best = { check: c, usage: u, source };
  }
  return best;
}
