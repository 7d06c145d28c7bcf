import type { ExplicitCorner, LoadSpec } from './types.js';
import { MAX_CORNERS, MAX_LIST, OPERATING_FIELDS, TANK_FIELDS } from './fields.js';
import { didYouMean, quote } from './problem.js';
import type { Entry, Reader } from './reader.js';
import { expectedText, readLoad, readQuantity } from './values.js';

export interface OperatingValues {
  vin?: number[];
  load?: LoadSpec[];
  ratedPower?: number;
  frequency?: 'regulate' | number[];
  corners?: ExplicitCorner[];
}

export const OPERATING_KEYS = ['vin', 'load', 'ratedPower', 'frequency', 'corners'] as const;
export const CORNER_KEYS = ['vin', 'load', 'frequency', 'lr', 'cr', 'lm'] as const;

const FREQ_EXPECTED = `${expectedText(OPERATING_FIELDS.frequency)}, a list of them, or "regulate"`;

/** One value or a list of values; every item is read (and reported) even after a bad one. */
function readList<T>(r: Reader, e: Entry, path: string, max: number, one: (item: Entry, path: string) => T | undefined): T[] | undefined {
  const list = r.isList(e);
  const items = r.items(e);
  if (list && items.length === 0) {
    r.problem('error', 'missing', path, e.loc, 'the list is empty; give at least one value', { expected: 'at least one value', received: '[]' });
    return undefined;
  }
  if (items.length > max) {
    r.problem('error', 'range', path, e.loc, `the list has ${items.length} entries; at most ${max} are accepted`, { expected: `at most ${max} entries`, received: `${items.length} entries` });
    return undefined;
  }
  const out = items.map((item, i) => one(item, list ? `${path}[${i}]` : path));
  return out.every((v) => v !== undefined) ? (out as T[]) : undefined;
}

/** A fixed frequency, or "regulate" when `allowRegulate`; near misses of "regulate" get a hint. */
function readOneFrequency(r: Reader, e: Entry, path: string, allowRegulate: boolean): number | 'regulate' | undefined {
  const text = r.text(e.node);
  if (text === 'regulate') {
    if (allowRegulate) return 'regulate';
    r.expected('value', path, e.loc, expectedText(OPERATING_FIELDS.frequency), quote(text), 'write "frequency: regulate" alone, not inside a list of fixed frequencies');
    return undefined;
  }
  if (text !== undefined && /^[A-Za-z]/.test(text)) {
    const hint = didYouMean(text, ['regulate']);
    r.expected('value', path, e.loc, FREQ_EXPECTED, quote(text), hint && 'did you mean "regulate"?');
    return undefined;
  }
  return readQuantity(r, e, path, OPERATING_FIELDS.frequency);
}

function readFrequency(r: Reader, e: Entry, path: string): 'regulate' | number[] | undefined {
  if (!r.isList(e)) {
    const one = readOneFrequency(r, e, path, true);
    return one === undefined ? undefined : one === 'regulate' ? 'regulate' : [one];
  }
  return readList(r, e, path, MAX_LIST, (item, p) => readOneFrequency(r, item, p, false) as number | undefined);
}

function readCorner(r: Reader, e: Entry, path: string): ExplicitCorner | undefined {
  const map = r.map(e.node, path, e.loc, CORNER_KEYS, 'a mapping with vin, load and optional frequency, lr, cr, lm');
  if (!map) return undefined;
  const need = (key: string): Entry | undefined => {
    const v = map.get(key);
    if (!v) r.problem('error', 'missing', `${path}.${key}`, e.loc, `missing required key "${key}"`, { expected: key });
    return v;
  };
  const vinE = need('vin');
  const loadE = need('load');
  const vin = vinE && readQuantity(r, vinE, `${path}.vin`, OPERATING_FIELDS.vin);
  const load = loadE && readLoad(r, loadE, `${path}.load`);
  const fE = map.get('frequency');
  const f = fE ? readOneFrequency(r, fE, `${path}.frequency`, true) : 'regulate';
  const corner: ExplicitCorner = { vin: vin ?? NaN, load: load ?? { kind: 'percent', value: NaN }, frequency: f === 'regulate' || f === undefined ? null : f };
  let ok = vin !== undefined && load !== undefined && f !== undefined;
  for (const key of ['lr', 'cr', 'lm'] as const) {
    const te = map.get(key);
    if (!te) continue;
    const v = readQuantity(r, te, `${path}.${key}`, TANK_FIELDS[key]);
    if (v === undefined) ok = false;
    else corner[key] = v;
  }
  return ok ? corner : undefined;
}

/** Read `operating`: the grid (vin x load x frequency) and/or explicit corners. */
export function readOperating(r: Reader, root: Map<string, Entry>, rootEntry: Entry): OperatingValues | undefined {
  const e = root.get('operating');
  if (!e) {
    r.problem('error', 'missing', 'operating', rootEntry.keyLoc, 'missing required section "operating"', { expected: 'operating' });
    return undefined;
  }
  const map = r.map(e.node, 'operating', e.loc, OPERATING_KEYS);
  if (!map) return undefined;
  const out: OperatingValues = {};
  const cornersE = map.get('corners');
  if (cornersE) {
    if (r.isList(cornersE)) out.corners = readList(r, cornersE, 'operating.corners', MAX_CORNERS, (item, p) => readCorner(r, item, p));
    else r.expected('type', 'operating.corners', cornersE.loc, 'a list of corners', r.describe(cornersE.node));
  } else out.corners = [];
  const hasCorners = cornersE !== undefined;
  const vinE = map.get('vin');
  const loadE = map.get('load');
  // Without explicit corners the grid is the only source of corners, so vin and load are required;
  // with corners they are optional, but one without the other is a mistake.
  for (const [key, entry, other] of [['vin', vinE, loadE], ['load', loadE, vinE]] as const) {
    if (!entry && (!hasCorners || other)) {
      r.problem('error', 'missing', `operating.${key}`, e.keyLoc, `missing required key "${key}"`, { expected: key });
    }
  }
  out.vin = vinE ? readList(r, vinE, 'operating.vin', MAX_LIST, (i, p) => readQuantity(r, i, p, OPERATING_FIELDS.vin)) : [];
  out.load = loadE ? readList(r, loadE, 'operating.load', MAX_LIST, (i, p) => readLoad(r, i, p)) : [];
  const fE = map.get('frequency');
  out.frequency = fE ? readFrequency(r, fE, 'operating.frequency') : 'regulate';
  const pE = map.get('ratedPower');
  if (pE) out.ratedPower = readQuantity(r, pE, 'operating.ratedPower', OPERATING_FIELDS.ratedPower);
  else r.problem('error', 'missing', 'operating.ratedPower', e.keyLoc, 'missing required key "ratedPower"', { expected: 'ratedPower' });
  const { vin, load, ratedPower, frequency, corners } = out;
  return { vin, load, ratedPower, frequency, corners };
}
