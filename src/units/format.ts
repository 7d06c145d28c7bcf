/** Output prefixes from femto to tera; ASCII only (`u` for micro) so reports and terminals stay 7-bit. */
const OUT_PREFIX: Record<number, string> = {
  [-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'u', [-3]: 'm', 0: '', 3: 'k', 6: 'M', 9: 'G', 12: 'T',
};

/** Options of formatSi. */
export interface FormatSiOptions {
  /** Spelling of the micro prefix. @default 'u' (7-bit; the HTML report passes the micro sign) */
  micro?: string;
}

/**
 * Format an SI value for people: `formatSi(62e-6, 'H')` -> `"62 uH"`, `formatSi(101234, 'Hz')` ->
 * `"101.2 kHz"`. `digits` significant digits (default 4), trailing zeros dropped, prefixes f..T.
 * With an empty unit, mega is written `meg` (`"2.2 meg"`) because a bare `M` would read as milli in
 * SPICE and is refused by `parseQuantity`; with a unit, `M` is SI mega (`"2 Mohm"`), which
 * `parseQuantity` reads back the same way. Non-finite values print as `NaN` / `Infinity`.
 */
export function formatSi(value: number, unit: string, digits = 4, opts: FormatSiOptions = {}): string {
  const join = (num: string, prefix: string): string => {
    const tail = `${prefix}${unit}`;
    return tail === '' ? num : `${num} ${tail}`;
  };
  if (!Number.isFinite(value)) return join(String(value), '');
  if (value === 0) return join('0', '');
  const sign = value < 0 ? '-' : '';
  const abs = Math.abs(value);
  const d = Math.max(1, Math.min(15, Math.round(digits)));
  let exp = Math.max(-15, Math.min(12, Math.floor(Math.log10(abs) / 3) * 3));
  let mant = Number((abs / 10 ** exp).toPrecision(d));
  // Rounding can carry into the next prefix (999.96 -> 1000 at 4 digits).
  if (mant >= 1000 && exp < 12) {
    exp += 3;
    mant = Number((abs / 10 ** exp).toPrecision(d));
  }
  const prefix = exp === 6 && unit === '' ? 'meg' : exp === -6 && opts.micro ? opts.micro : OUT_PREFIX[exp];
  return join(`${sign}${mant}`, prefix);
}

/**
 * Format a value for a SPICE netlist: plain exponent notation with 13 significant digits
 * (`value.toExponential(12)`, e.g. `6.000000000000e-5`), no scale suffix and no unit letters,
 * which sidesteps SPICE's `M` = milli and `F` = femto traps. Throws a RangeError for NaN or
 * Infinity, which must never reach a netlist.
 */
export function formatSpice(value: number): string {
  if (!Number.isFinite(value)) throw new RangeError(`formatSpice: ${value} cannot be written to a netlist`);
  return value.toExponential(12);
}

/** SPICE scale suffixes by power of ten, lower case (`meg`, never `M`, which SPICE reads as milli). */
const SPICE_SUFFIX: Record<number, string> = {
  [-15]: 'f', [-12]: 'p', [-9]: 'n', [-6]: 'u', [-3]: 'm', 0: '', 3: 'k', 6: 'meg', 9: 'g', 12: 't',
};

/**
 * Format a value for a netlist in compact engineering notation (`50u`, `90k`, `4.7n`, `1.5meg`,
 * `-1.51786`), with `digits` significant digits (default 6) when the text reads back within
 * `rel` (default 1e-12) of the value, and with as many more digits as that needs otherwise (13 at
 * most, since 13 digits always meet 1e-12). So design values such as 60 uH print short, while a
 * solved frequency keeps the precision it was computed with. Exponents beyond f..t are written as
 * `1.5e-18`. Throws a RangeError for NaN or Infinity, which must never reach a netlist.
 */
export function formatSpiceEng(value: number, digits = 6, rel = 1e-12): string {
  if (!Number.isFinite(value)) throw new RangeError(`formatSpiceEng: ${value} cannot be written to a netlist`);
  if (value === 0) return '0';
  let text = '';
  for (let p = Math.max(1, Math.min(13, Math.round(digits))); p <= 13; p++) {
    const m = /^(-?)(\d)(?:\.(\d+))?e([+-]\d+)$/.exec(value.toExponential(p - 1))!;
    const exp = Number(m[4]);
    const exp3 = Math.floor(exp / 3) * 3;
    const digitsText = `${m[2]}${m[3] ?? ''}`.padEnd(exp - exp3 + 1, '0');
    const intPart = digitsText.slice(0, exp - exp3 + 1);
    const frac = digitsText.slice(exp - exp3 + 1).replace(/0+$/, '');
    const mant = `${m[1]}${intPart}${frac ? `.${frac}` : ''}`;
    const suffix = SPICE_SUFFIX[exp3];
    text = suffix === undefined ? `${mant}e${exp3}` : `${mant}${suffix}`;
    if (Math.abs(Number(`${mant}e${exp3}`) - value) <= rel * Math.abs(value)) break;
  }
  return text;
}
