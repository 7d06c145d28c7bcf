import type { LoadSpec } from './load.js';
import { parseQuantity, type ParseResult } from './parse.js';
import { UNIT_SPELLINGS, prefixesOf } from './table.js';

const LOAD_EXPECTED = 'a load as a share of rated power or an absolute value, such as "50%", "12 ohm", "5 A" or "120 W"';
const KINDS = ['ohm', 'ampere', 'watt'] as const;

function loadFail(text: string, detail: string): ParseResult<never> {
  return { ok: false, expected: LOAD_EXPECTED, detail, message: `"${text}" ${detail}; expected ${LOAD_EXPECTED}` };
}

/** The unit symbol that ends `suffix` (after an optional prefix), as one of the load kinds. */
function loadKindOf(suffix: string): (typeof KINDS)[number] | undefined {
  const candidates = [suffix, ...prefixesOf(suffix).map((p) => suffix.slice(p.text.length))];
  return KINDS.find((k) => candidates.some((c) => UNIT_SPELLINGS[k].includes(c)));
}

/**
 * Parse one load entry: `50%` (share of `operating.ratedPower`, stored as 0.5), a resistance
 * (`12 ohm`), a current (`5 A`) or a power (`120 W`), with the prefixes of `parseQuantity`.
 * A unit is mandatory: a bare number is ambiguous. Values are returned in SI units, unsigned
 * checks (> 0) belong to the caller.
 */
export function parseLoad(text: string | number): ParseResult<LoadSpec> {
  if (typeof text === 'number') {
    return loadFail(String(text), 'has no unit; write "%", "ohm", "A" or "W" after the number');
  }
  const t = text.trim();
  if (t.endsWith('%')) {
    const r = parseQuantity(t, 'ratio');
    return r.ok ? { ok: true, value: { kind: 'percent', value: r.value } } : loadFail(t, r.detail ?? 'is not valid');
  }
  const num = parseQuantity(t, 'number');
  if (num.ok) return loadFail(t, 'has no unit; write "%", "ohm", "A" or "W" after the number');
  const suffix = t.replace(/^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?[ \t]*/, '');
  const kind = suffix === t ? undefined : loadKindOf(suffix);
  if (!kind) {
    const r = parseQuantity(t, 'ohm');
    const detail = !r.ok && r.detail?.startsWith('is ambiguous') ? r.detail : undefined;
    return loadFail(t, detail ?? (suffix === t ? 'is not a number' : `has a unit or suffix "${suffix}" that is not a load`));
  }
  const r = parseQuantity(t, kind);
  return r.ok ? { ok: true, value: { kind, value: r.value } } : loadFail(t, r.detail ?? 'is not valid');
}
