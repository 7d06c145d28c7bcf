import { formatSi } from './format.js';

/**
 * Numbers for people in tables and reports: significant digits, percentages, engineering values.
 * The one home of number display (with formatSi); report/ and compare/ render through these.
 */

/** The number when finite, else null (results.json stores non-finite numbers as null). */
export function finite(x: unknown): number | null {
  return typeof x === 'number' && Number.isFinite(x) ? x : null;
}

/**
 * x / scale with `digits` significant digits, trailing zeros trimmed (`"99"`, `"0.1235"`);
 * `empty` for null, non-numbers and non-finite values. @default digits 4, scale 1, empty ''
 */
export function num(x: unknown, digits = 4, scale = 1, empty = ''): string {
  const v = finite(x);
  if (v === null) return empty;
  return Number((v / scale).toPrecision(digits)).toString();
}

/** Relative error as a signed percentage, e.g. 0.035 -> "+3.5%"; '' for null. @default decimals 1 */
export function pct(x: unknown, decimals = 1): string {
  const v = finite(x);
  if (v === null) return '';
  return `${v >= 0 ? '+' : '-'}${Math.abs(v * 100).toFixed(decimals)}%`;
}

/** Like num but keeps trailing zeros so columns line up (`"99.00"`); no exponent form. */
export function sig(x: unknown, digits = 4, scale = 1): string {
  const v = finite(x);
  if (v === null) return '';
  const y = v / scale;
  return Math.abs(y) >= 10 ** digits ? Math.round(y).toString() : y.toPrecision(digits);
}

/** Unsigned percentage for tolerances, 0.1 -> "10 %"; '' for null. */
export function pctAbs(x: unknown): string {
  const v = finite(x);
  return v === null ? '' : `${Number((v * 100).toPrecision(3))} %`;
}

/** Engineering value with an SI prefix and the micro sign, 6e-5 H -> "60 µH" (formatSi); '' for null. @default digits 3 */
export function eng(x: unknown, unit: string, digits = 3): string {
  const v = finite(x);
  return v === null ? '' : formatSi(v, unit, digits, { micro: 'µ' });
}

/** A value as text: numbers with `digits` significant digits, anything else as String(v). @default digits 5 */
export function plain(v: unknown, digits = 5): string {
  return typeof v === 'number' ? Number(v.toPrecision(digits)).toString() : String(v);
}

/** Compact, file-name-safe spelling of a number for ids: 6 significant digits, '.' -> 'p', '-' -> 'm' (`97.5` -> `97p5`, `1e-7` -> `1em7`). */
export function idNumber(x: number): string {
  const s = Number(x.toPrecision(6)).toString();
  if (/e/i.test(s)) return s.replace('.', 'p').replace('+', '').replace('-', 'm').toLowerCase();
  return s.replace('.', 'p').replace('-', 'm');
}
