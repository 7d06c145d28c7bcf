import type { Design } from './types.js';
import { COMPARE_METRIC_GROUP, COMPARE_STATUS_METRICS, SECTION_FIELDS, type CompareKey, type QuantitySpec } from './fields.js';
import type { Entry, Reader } from './reader.js';
import { expectedText, readQuantity } from './values.js';
import { quote } from './problem.js';

type Group = keyof typeof SECTION_FIELDS.compare;
const GROUPS = Object.keys(SECTION_FIELDS.compare) as Group[];
const METRICS = Object.keys(COMPARE_METRIC_GROUP).filter((m) => !(GROUPS as string[]).includes(m)) as CompareKey[];

/** Every key `compare` accepts: the groups, then each compared metric, then the status metrics. */
export const COMPARE_KEYS: readonly string[] = [...GROUPS, ...METRICS, ...COMPARE_STATUS_METRICS];

/** The tolerance spec a metric key takes: its group's limits, without the group default. */
export function metricSpec(key: CompareKey): QuantitySpec {
  const group = COMPARE_METRIC_GROUP[key as keyof typeof COMPARE_METRIC_GROUP];
  const { default: _d, ...spec } = SECTION_FIELDS.compare[group];
  return spec;
}

function readTolerance(r: Reader, e: Entry, path: string, spec: QuantitySpec): number | 'off' | undefined {
  if (r.text(e.node) === 'off') return 'off';
  if (r.text(e.node)?.toLowerCase() === 'off') {
    r.expected('value', path, e.loc, `${expectedText(spec)}, or "off"`, quote(r.text(e.node)!), 'did you mean "off"?');
    return undefined;
  }
  return readQuantity(r, e, path, spec);
}

/**
 * Read the optional `compare` section: group tolerances (default when absent), and tolerances for
 * single metrics by name. Any of them may be `off` (the metric is reported, never flagged); a group
 * written `off` turns off each of its metrics that has no setting of its own. The status metrics
 * (zvs, zcs, region) accept only `off`. Returns undefined when a problem was reported.
 */
export function readCompare(r: Reader, root: Map<string, Entry>): Design['compare'] | undefined {
  const defaults = Object.fromEntries(GROUPS.map((g) => [g, SECTION_FIELDS.compare[g].default])) as Record<Group, number>;
  const e = root.get('compare');
  if (!e) return defaults;
  const map = r.map(e.node, 'compare', e.loc, COMPARE_KEYS, `a mapping with keys such as ${GROUPS.join(', ')} or a metric name`);
  if (!map) return undefined;
  let ok = true;
  const out: Design['compare'] = { ...defaults };
  const metrics: Partial<Record<CompareKey, number | 'off'>> = {};
  const groupsOff: Group[] = [];
  for (const g of GROUPS) {
    const v = map.get(g);
    if (!v) continue;
    const t = readTolerance(r, v, `compare.${g}`, SECTION_FIELDS.compare[g]);
    if (t === undefined) ok = false;
    else if (t === 'off') groupsOff.push(g);
    else out[g] = t;
  }
  for (const key of [...METRICS, ...COMPARE_STATUS_METRICS]) {
    const v = map.get(key);
    if (!v) continue;
    if ((COMPARE_STATUS_METRICS as readonly string[]).includes(key)) {
      if (r.text(v.node) === 'off') metrics[key] = 'off';
      else {
        r.expected('value', `compare.${key}`, v.loc, '"off" (a yes/no metric has no tolerance)', r.describe(v.node));
        ok = false;
      }
      continue;
    }
    const t = readTolerance(r, v, `compare.${key}`, metricSpec(key));
    if (t === undefined) ok = false;
    else metrics[key] = t;
  }
  for (const [m, g] of Object.entries(COMPARE_METRIC_GROUP) as [CompareKey, Group][]) {
    if (groupsOff.includes(g) && metrics[m] === undefined) metrics[m] = 'off';
  }
  if (Object.keys(metrics).length > 0) out.metrics = metrics;
  return ok ? out : undefined;
}
