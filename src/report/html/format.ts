/** Number formatting for the report: significant digits, percent errors, null-safe. */

/** The number when finite, else null (results.json stores non-finite numbers as null). */
export function finite(x: unknown): number | null {
  return typeof x === 'number' && Number.isFinite(x) ? x : null;
}

/** x / scale with `digits` significant digits, trailing zeros trimmed; '' for null or non-finite. */
export function num(x: unknown, digits = 4, scale = 1): string {
  const v = finite(x);
  if (v === null) return '';
  return Number((v / scale).toPrecision(digits)).toString();
}

/** Relative error as a signed percentage with one decimal, e.g. "+3.5%"; '' for null. */
export function pct(x: unknown, decimals = 1): string {
  const v = finite(x);
  if (v === null) return '';
  return `${v >= 0 ? '+' : '-'}${Math.abs(v * 100).toFixed(decimals)}%`;
}

/** Like num but keeps trailing zeros (table columns line up: "99.00"); no exponent form. */
export function sig(x: unknown, digits = 4, scale = 1): string {
  const v = finite(x);
  if (v === null) return '';
  const y = v / scale;
  return Math.abs(y) >= 10 ** digits ? Math.round(y).toString() : y.toPrecision(digits);
}

/** Unsigned percentage for tolerances, e.g. "10 %". */
export function pctAbs(x: unknown): string {
  const v = finite(x);
  return v === null ? '' : `${Number((v * 100).toPrecision(3))} %`;
}

/** Engineering value with an SI prefix, e.g. 6e-5 H -> "60 µH"; '' for null. */
export function eng(x: unknown, unit: string, digits = 3): string {
  const v = finite(x);
  if (v === null) return '';
  if (v === 0) return `0 ${unit}`;
  const prefixes = ['p', 'n', 'µ', 'm', '', 'k', 'M', 'G'];
  const e = Math.min(Math.max(Math.floor(Math.log10(Math.abs(v)) / 3), -4), 3);
  return `${Number((v / 10 ** (3 * e)).toPrecision(digits))} ${prefixes[e + 4]}${unit}`;
}
