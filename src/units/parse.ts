import {
  KIND_EXAMPLE,
  KIND_NOUN,
  UNIT_SPELLINGS,
  UNIT_SYMBOL,
  kindOfSymbol,
  prefixesOf,
  type PhysicalKind,
  type UnitKind,
} from './table.js';

/** Outcome of parsing one quantity. `detail` says what exactly was wrong, without the "expected" part. */
export type ParseResult<T = number> =
  | { ok: true; value: T }
  | { ok: false; expected: string; message: string; detail?: string };

const NUMBER_RE = /^([+-]?)(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+-]?\d+))?[ \t]*/;
/** Resistor-code notation (`4k7`): ngspice versions disagree on it, so it is refused. */
const RKM_RE = /^\d+(?:[RrKkMmGgTtUuNnPpFf\u00b5\u03bc]|[mM][eE][gG])\d+$/;
const MAX_TEXT = 64;

/** `4k7` -> `4.7k`, `4R7` -> `4.7`: the decimal spelling of a resistor-code value. */
function rkmFix(text: string): string {
  const m = /^(\d+)(\D+)(\d+)$/.exec(text);
  if (!m) return text;
  const prefix = /^[Rr]$/.test(m[2]) ? '' : m[2] === 'M' ? 'meg' : m[2];
  return `${m[1]}.${m[3]}${prefix}`;
}

/** A number split into its decimal pieces, so scaling is done on the exponent (correctly rounded). */
interface Split {
  sign: string;
  mantissa: string;
  exp: number;
  suffix: string;
}

function splitNumber(text: string): Split | undefined {
  const m = NUMBER_RE.exec(text);
  if (!m) return undefined;
  const expDigits = m[3] ?? '0';
  // Clamp absurd exponents so the string below stays a decimal literal; the result still over/underflows.
  const exp = Math.max(-10_000, Math.min(10_000, Number(expDigits)));
  return { sign: m[1], mantissa: m[2], exp, suffix: text.slice(m[0].length) };
}

/** Exact decimal scaling: Number("27e-9") is the correctly rounded double, unlike 27 * 1e-9. */
function scale(s: Split, extraExp: number): ParseResult {
  const value = Number(`${s.sign}${s.mantissa}e${s.exp + extraExp}`);
  if (!Number.isFinite(value)) return fail('', 'number', 'is too large to represent');
  if (value === 0 && /[1-9]/.test(s.mantissa)) return fail('', 'number', 'is too small to represent (underflows to 0)');
  return { ok: true, value };
}

function expectedFor(kind: UnitKind): string {
  if (kind === 'ratio') return `${KIND_NOUN.ratio} as a percentage or plain number such as "5%" or "0.05"`;
  if (kind === 'number') return `a plain number such as "${KIND_EXAMPLE.number}"`;
  return `${KIND_NOUN[kind]} in ${UNIT_SYMBOL[kind]} such as "${KIND_EXAMPLE[kind]}"`;
}

function fail(text: string, kind: UnitKind, detail: string): ParseResult<never> {
  const expected = expectedFor(kind);
  const shown = text === '' ? 'value' : `"${text}"`;
  return { ok: false, expected, detail, message: `${shown} ${detail}; expected ${expected}` };
}

/** Re-label a failure from `scale` with the original text and kind. */
function relabel(r: ParseResult, text: string, kind: UnitKind): ParseResult {
  return r.ok ? r : fail(text, kind, r.detail ?? 'is not valid');
}

/** Interpret a unit suffix (prefix and/or unit symbol) for a physical kind. */
function applySuffix(s: Split, text: string, kind: PhysicalKind): ParseResult {
  const units = UNIT_SPELLINGS[kind];
  if (units.includes(s.suffix)) return relabel(scale(s, 0), text, kind);
  for (const p of prefixesOf(s.suffix)) {
    const rest = s.suffix.slice(p.text.length);
    if (rest === '' && p.needsUnit) {
      const n = `${s.sign}${s.mantissa}${s.exp ? `e${s.exp}` : ''}`;
      return fail(text, kind,
        `is ambiguous: a bare "M" is milli in SPICE but mega in SI; write "${n}m" for milli or "${n}meg" for mega`);
    }
    if (rest === '' || units.includes(rest)) return relabel(scale(s, p.exp), text, kind);
  }
  return diagnose(s, text, kind);
}

/** Explain why a suffix was not accepted. */
function diagnose(s: Split, text: string, kind: PhysicalKind): ParseResult<never> {
  const suffix = s.suffix;
  if (suffix === '%') return fail(text, kind, 'is a percentage, which does not fit here');
  const other = [suffix, ...prefixesOf(suffix).map((p) => suffix.slice(p.text.length))]
    .map(kindOfSymbol)
    .find((k) => k !== undefined);
  if (other) {
    return fail(text, kind,
      `has the unit of ${KIND_NOUN[other].replace(/^an? /, '')} (${UNIT_SYMBOL[other]}), not ${UNIT_SYMBOL[kind]}`);
  }
  const lower = suffix[0].toLowerCase() + suffix.slice(1);
  if (lower !== suffix && prefixesOf(lower).length > 0 && applySuffix({ ...s, suffix: lower }, text, kind).ok) {
    return fail(text, kind, `has an unknown suffix "${suffix}"; prefixes are case sensitive, did you mean "${lower}"?`);
  }
  return fail(text, kind, `has an unknown unit or suffix "${suffix}"`);
}

/**
 * Parse a quantity written in engineering notation into SI base units.
 *
 * Accepts a bare number (`5e-9`, `0.6`), a number with a scale prefix (`27n`, `2.2k`, `1.5meg`,
 * `110m`), a unit (`0.6 V`), or both (`27 nF`, `1.5 MHz`, `110 mohm`); a space between number and
 * suffix is optional. Prefixes: T G meg (any case) M k K m u µ n p f. Case matters elsewhere:
 * `mohm` is milliohm and `Mohm` megaohm; SI `M` is mega only when a unit follows (`2 Mohm`), and a
 * bare `22M` is rejected as ambiguous (SPICE milli vs SI mega). `F` is farad, `f` femto.
 * `ratio` takes `10%` (-> 0.1) or a plain number; `number` takes a plain number only.
 * Rejected: empty text, NaN, Infinity, hex, RKM (`4k7`), unknown letters, a unit of another kind
 * (`27 uH` for a capacitance), values that overflow or underflow. Never uses parseFloat.
 * Negative values parse; range checks belong to the caller.
 */
export function parseQuantity(text: string | number, unit: UnitKind): ParseResult {
  if (typeof text === 'number') {
    return Number.isFinite(text) ? { ok: true, value: text } : fail(String(text), unit, 'is not a finite number');
  }
  const t = text.trim();
  if (t === '') return fail('', unit, 'is empty');
  if (t.length > MAX_TEXT) return fail(`${t.slice(0, 20)}...`, unit, `is too long (${t.length} characters)`);
  const s = splitNumber(t);
  if (!s) return fail(t, unit, 'is not a number');
  if (s.suffix === '') return relabel(scale(s, 0), t, unit);
  if (RKM_RE.test(t)) return fail(t, unit, `uses resistor-code notation, which is not accepted; write "${rkmFix(t)}"`);
  if (unit === 'ratio') return s.suffix === '%' ? relabel(scale(s, -2), t, unit) : fail(t, unit, `has an unknown suffix "${s.suffix}"`);
  if (unit === 'number') return fail(t, unit, `has an unexpected suffix "${s.suffix}"`);
  return applySuffix(s, t, unit);
}
