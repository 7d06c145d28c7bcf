/**
 * Tables behind the engineering-notation parser: unit kinds, unit symbols, scale prefixes.
 *
 * The prefixes follow SI, with the SPICE spelling `meg` for mega (ngspice manual, section
 * "Some naming conventions": SPICE reads `M` as milli and only `meg` as mega). A bare `M` with no
 * unit is therefore ambiguous and rejected; `M` followed by a unit symbol (`1.5 MHz`, `2 Mohm`) is SI mega.
 */

/** Quantity kinds a design field can hold. `ratio` takes `5%` or `0.05`; `number` is a plain dimensionless number. */
export type UnitKind =
  | 'henry'
  | 'farad'
  | 'ohm'
  | 'volt'
  | 'ampere'
  | 'watt'
  | 'second'
  | 'hertz'
  | 'ratio'
  | 'number';

/** Kinds that carry a physical unit symbol (everything but `ratio` and `number`). */
export type PhysicalKind = Exclude<UnitKind, 'ratio' | 'number'>;

/** Canonical ASCII symbol per kind, used in messages and in `formatSi`. */
export const UNIT_SYMBOL: Record<UnitKind, string> = {
  henry: 'H',
  farad: 'F',
  ohm: 'ohm',
  volt: 'V',
  ampere: 'A',
  watt: 'W',
  second: 's',
  hertz: 'Hz',
  ratio: '',
  number: '',
};

/**
 * Accepted spellings of each unit symbol (case sensitive). `F` is farad here, never femto
 * (femto is lower-case `f`); this differs from SPICE on purpose, and the range checks of the
 * design layer catch a farad written where femto was meant.
 */
export const UNIT_SPELLINGS: Record<PhysicalKind, readonly string[]> = {
  henry: ['H'],
  farad: ['F'],
  ohm: ['ohm', 'ohms', 'Ohm', 'Ohms', '\u03a9', '\u2126'],
  volt: ['V'],
  ampere: ['A'],
  watt: ['W'],
  second: ['s'],
  hertz: ['Hz', 'hz', 'HZ'],
};

/** What each kind is called in messages ("expected an inductance ..."). */
export const KIND_NOUN: Record<UnitKind, string> = {
  henry: 'an inductance',
  farad: 'a capacitance',
  ohm: 'a resistance',
  volt: 'a voltage',
  ampere: 'a current',
  watt: 'a power',
  second: 'a time',
  hertz: 'a frequency',
  ratio: 'a ratio',
  number: 'a number',
};

/** A typical value per kind for "such as" hints. */
export const KIND_EXAMPLE: Record<UnitKind, string> = {
  henry: '47 uH',
  farad: '27 nF',
  ohm: '110 mohm',
  volt: '400 V',
  ampere: '2.5 A',
  watt: '240 W',
  second: '200 ns',
  hertz: '100 kHz',
  ratio: '5%',
  number: '8',
};

export interface Prefix {
  /** Spelling as written. */
  text: string;
  /** Power of ten. */
  exp: number;
  /** Match any letter case (only `meg`, as in SPICE). */
  anyCase?: boolean;
  /** Valid only when a unit symbol follows (SI `M`; alone it would read as SPICE milli). */
  needsUnit?: boolean;
}

/** Scale prefixes, longest first so `meg` wins over `m`. Micro accepts `u`, U+00B5 and U+03BC. */
export const PREFIXES: readonly Prefix[] = [
  { text: 'meg', exp: 6, anyCase: true },
  { text: 'T', exp: 12 },
  { text: 'G', exp: 9 },
  { text: 'M', exp: 6, needsUnit: true },
  { text: 'k', exp: 3 },
  { text: 'K', exp: 3 },
  { text: 'm', exp: -3 },
  { text: 'u', exp: -6 },
  { text: '\u00b5', exp: -6 },
  { text: '\u03bc', exp: -6 },
  { text: 'n', exp: -9 },
  { text: 'p', exp: -12 },
  { text: 'f', exp: -15 },
];

/** The prefix `suffix` starts with, honouring case rules; longest match first. */
export function prefixesOf(suffix: string): Prefix[] {
  return PREFIXES.filter((p) =>
    p.anyCase
      ? suffix.slice(0, p.text.length).toLowerCase() === p.text
      : suffix.startsWith(p.text),
  );
}

/** The physical kind a bare unit symbol belongs to, if any. */
export function kindOfSymbol(symbol: string): PhysicalKind | undefined {
  for (const [kind, spellings] of Object.entries(UNIT_SPELLINGS)) {
    if (spellings.includes(symbol)) return kind as PhysicalKind;
  }
  return undefined;
}

const escapeRe = (s: string): string => s.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');

/** Regular expression source for a decimal number with optional exponent (no hex, no `_`, no NaN/Infinity). */
/** Prefixes usable without a unit (any-case `meg` and the single letters; not `M`). */
const PREFIX_SOURCE = `(?:[mM][eE][gG]|${PREFIXES.filter((p) => !p.needsUnit && !p.anyCase).map((p) => escapeRe(p.text)).join('|')})`;

export const NUMBER_SOURCE = '[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?';

/**
 * ECMA-262 regular expression (anchored) for the strings `parseQuantity` accepts for `kind`.
 * Used in the JSON Schema so editors flag malformed values; the parser stays the authority
 * (it also rejects values that over- or underflow).
 */
export function quantityPattern(kind: UnitKind): string {
  if (kind === 'number') return `^${NUMBER_SOURCE}$`;
  if (kind === 'ratio') return `^${NUMBER_SOURCE}(?:[ \\t]*%)?$`;
  const units = UNIT_SPELLINGS[kind].map(escapeRe).join('|');
  return `^${NUMBER_SOURCE}(?:[ \\t]*(?:${PREFIX_SOURCE}(?:${units})?|M(?:${units})|(?:${units})))?$`;
}

/** Like `quantityPattern`, for a load (`parseLoad`): a percentage, or a resistance, current or power with its unit. */
export function loadPattern(): string {
  const units = (['ohm', 'ampere', 'watt'] as const).flatMap((k) => UNIT_SPELLINGS[k]).map(escapeRe).join('|');
  return `^${NUMBER_SOURCE}[ \\t]*(?:%|(?:${PREFIX_SOURCE}|M)?(?:${units}))$`;
}
