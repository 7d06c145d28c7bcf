import { isScalar } from 'yaml';
import type { LoadSpec } from './types.js';
import { KIND_NOUN, UNIT_SYMBOL, formatSi, parseLoad, parseQuantity } from '../units/index.js';
import { LOAD_DESCRIPTION, LOAD_WINDOWS, type BoolSpec, type EnumSpec, type QuantitySpec } from './fields.js';
import { didYouMean, quote } from './problem.js';
import type { Entry, Reader } from './reader.js';

const pct = (x: number): string => `${Number((x * 100).toPrecision(6))}%`;

/** "an inductance > 0 H such as "310 uH"", "a fraction >= 0 and < 50% such as "5%"". */
export function expectedText(spec: QuantitySpec): string {
  const sign = spec.sign === 'positive' ? '> 0' : '>= 0';
  if (spec.unit === 'ratio') {
    const top = spec.below !== undefined ? ` and < ${pct(spec.below)}` : spec.atMost !== undefined ? ` and <= ${pct(spec.atMost)}` : '';
    return `a fraction ${sign}${top} such as "${spec.example}"`;
  }
  if (spec.unit === 'number') return `${spec.integer ? 'a whole number' : 'a number'} ${sign} such as "${spec.example}"`;
  return `${KIND_NOUN[spec.unit]} ${sign} ${UNIT_SYMBOL[spec.unit]} such as "${spec.example}"`;
}

const show = (value: number, spec: QuantitySpec): string =>
  spec.unit === 'ratio' ? pct(value) : formatSi(value, UNIT_SYMBOL[spec.unit]);

/** Check a parsed number against the limits of its spec; returns false on an error. */
export function checkLimits(r: Reader, path: string, e: Entry, text: string, value: number, spec: QuantitySpec): boolean {
  const expected = expectedText(spec);
  const got = quote(text);
  const bad = (detail?: string): false => (r.expected('range', path, e.loc, expected, got, detail), false);
  if (spec.sign === 'positive' ? !(value > 0) : !(value >= 0)) return bad();
  if (spec.below !== undefined && !(value < spec.below)) return bad(`must be below ${show(spec.below, spec)}`);
  if (spec.atMost !== undefined && !(value <= spec.atMost)) return bad(`must be at most ${show(spec.atMost, spec)}`);
  if (spec.integer && !Number.isInteger(value)) return bad('must be a whole number');
  const [lo, hi] = spec.plausible ?? [-Infinity, Infinity];
  if (value < lo || value > hi) {
    r.problem('error', 'implausible', path, e.loc,
      `implausible value ${got} (${show(value, spec)}), outside ${show(lo, spec)} .. ${show(hi, spec)}; check the unit prefix`,
      { expected: `${show(lo, spec)} .. ${show(hi, spec)}`, received: got });
    return false;
  }
  const [ulo, uhi] = spec.usual ?? [-Infinity, Infinity];
  if (value < ulo || value > uhi) {
    r.problem('warning', 'implausible', path, e.loc,
      `unusual value ${got} (${show(value, spec)}), usually ${show(ulo, spec)} .. ${show(uhi, spec)}; check the unit prefix`,
      { expected: `${show(ulo, spec)} .. ${show(uhi, spec)}`, received: got });
  }
  return true;
}

/** Read a quantity field; reports problems and returns undefined when it is unusable. */
export function readQuantity(r: Reader, e: Entry, path: string, spec: QuantitySpec): number | undefined {
  const text = r.text(e.node);
  if (text === undefined) {
    r.expected(e.node === null ? 'missing' : 'type', path, e.loc, expectedText(spec), r.describe(e.node));
    return undefined;
  }
  const parsed = parseQuantity(text, spec.unit);
  if (!parsed.ok) {
    // "is not a number" adds nothing to "expected a number ..., got "abc""
    r.expected('value', path, e.loc, expectedText(spec), quote(text), parsed.detail === 'is not a number' ? undefined : parsed.detail);
    return undefined;
  }
  r.seen.set(path, { ...e.loc, text });
  return checkLimits(r, path, e, text, parsed.value, spec) ? parsed.value : undefined;
}

/** Read one of a fixed set of words, with "did you mean" for near misses. */
export function readEnum<T extends string>(r: Reader, e: Entry, path: string, spec: EnumSpec): T | undefined {
  const text = r.text(e.node);
  if (text !== undefined && spec.values.includes(text)) {
    r.seen.set(path, { ...e.loc, text });
    return text as T;
  }
  const expected = spec.values.map((v) => `"${v}"`).join(' or ');
  const hint = text === undefined ? undefined : didYouMean(text, spec.values);
  r.expected(text === undefined ? 'type' : 'value', path, e.loc, expected, r.describe(e.node), hint && `did you mean "${hint}"?`);
  return undefined;
}

/** Read a YAML boolean (`true` / `false`, not quoted strings). */
export function readBool(r: Reader, e: Entry, path: string, _spec: BoolSpec): boolean | undefined {
  const n = r.resolve(e.node);
  if (isScalar(n) && typeof n.value === 'boolean') return n.value;
  r.expected('type', path, e.loc, 'true or false', r.describe(n));
  return undefined;
}

/** Read one load entry (`50%`, `12 ohm`, `5 A`, `120 W`) and check it is > 0 and sane. */
export function readLoad(r: Reader, e: Entry, path: string): LoadSpec | undefined {
  const text = r.text(e.node);
  const expected = 'a load > 0 such as "50%", "12 ohm", "5 A" or "120 W"';
  if (text === undefined) {
    r.expected(e.node === null ? 'missing' : 'type', path, e.loc, expected, r.describe(e.node));
    return undefined;
  }
  const parsed = parseLoad(text);
  if (!parsed.ok) {
    r.expected('value', path, e.loc, expected, quote(text), parsed.detail);
    return undefined;
  }
  r.seen.set(path, { ...e.loc, text });
  const load = parsed.value;
  const unit = load.kind === 'percent' ? 'ratio' : load.kind;
  const spec: QuantitySpec = { kind: 'quantity', unit, sign: 'positive', plausible: LOAD_WINDOWS[load.kind], example: '50%', description: LOAD_DESCRIPTION };
  if (!(load.value > 0)) {
    r.expected('range', path, e.loc, expected, quote(text), 'for a very light load use a small share such as "1%"');
    return undefined;
  }
  return checkLimits(r, path, e, text, load.value, spec) ? load : undefined;
}
