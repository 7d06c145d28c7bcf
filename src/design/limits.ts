import type { DesignLimits } from './types.js';
import { FREQUENCY_WINDOW_FIELDS, LIMIT_FIELDS } from './fields.js';
import type { Entry, Reader } from './reader.js';
import { readField } from './sections.js';
import { readQuantity } from './values.js';
import { formatSi } from '../units/index.js';

/** Keys of the `limits` section, in the order the documentation lists them. */
export const LIMIT_KEYS = ['frequency', ...Object.keys(LIMIT_FIELDS)] as const;

/** Read `limits.frequency: {min, max}`: either may be left out, not both; min must be below max. */
function readWindow(r: Reader, e: Entry): DesignLimits['frequency'] | undefined {
  const map = r.map(e.node, 'limits.frequency', e.loc, ['min', 'max'], 'a mapping with keys min, max such as "{ min: 60 kHz, max: 150 kHz }"');
  if (!map) return undefined;
  if (map.size === 0) {
    r.problem('error', 'missing', 'limits.frequency', e.loc, 'give min, max or both, such as "{ min: 60 kHz, max: 150 kHz }"', { expected: 'min, max' });
    return undefined;
  }
  const out: NonNullable<DesignLimits['frequency']> = {};
  for (const key of ['min', 'max'] as const) {
    const v = map.get(key);
    if (!v) continue;
    const value = readQuantity(r, v, `limits.frequency.${key}`, FREQUENCY_WINDOW_FIELDS[key]);
    if (value === undefined) return undefined;
    out[key] = value;
  }
  if (out.min !== undefined && out.max !== undefined && !(out.min < out.max)) {
    const at = map.get('max')!.loc;
    r.problem('error', 'range', 'limits.frequency.max', at,
      `the window is empty: max (${formatSi(out.max, 'Hz')}) must be above min (${formatSi(out.min, 'Hz')})`,
      { expected: `above ${formatSi(out.min, 'Hz')}`, received: formatSi(out.max, 'Hz') });
    return undefined;
  }
  return out;
}

/**
 * Read the optional `limits` section. Returns undefined when the file has none (no limit set),
 * and also when the section has problems (they are reported; the parse then fails).
 */
export function readLimits(r: Reader, root: Map<string, Entry>): DesignLimits | undefined {
  const e = root.get('limits');
  if (!e) return undefined;
  const map = r.map(e.node, 'limits', e.loc, LIMIT_KEYS, `a mapping with keys ${LIMIT_KEYS.join(', ')}`);
  if (!map) return undefined;
  let ok = true;
  const out: Record<string, unknown> = {};
  const window = map.get('frequency');
  if (window) {
    out.frequency = readWindow(r, window);
    ok &&= out.frequency !== undefined;
  }
  for (const [key, spec] of Object.entries(LIMIT_FIELDS)) {
    if (!map.has(key) && spec.default === undefined) continue;
    const value = readField(r, map, key, spec, `limits.${key}`, e);
    if (value === undefined) ok = false;
    else out[key] = value;
  }
  return ok ? (out as unknown as DesignLimits) : undefined;
}
