/**
 * Small structural checks for the JSON files tankcheck reads back (results, baseline, waveforms).
 * Each check reports problems at a JSON path such as `corners[3].fha.gain` and never throws, so a
 * truncated or hand-edited file gives every problem at once instead of a crash further on.
 */

/** One problem found in a JSON value: where (a JSON path, '' for the whole value) and what. */
export interface ShapeProblem {
  path: string;
  message: string;
}

/** Checks `v` found at `path`; pushes problems to `out`. */
export type Check = (v: unknown, path: string, out: ShapeProblem[]) => void;

/** How a JSON value reads in a message: "null", "a list", "an object", or a short quoted scalar. */
export function describe(v: unknown): string {
  if (v === null) return 'null';
  if (v === undefined) return 'nothing';
  if (Array.isArray(v)) return 'a list';
  if (typeof v === 'object') return 'an object';
  const s = JSON.stringify(v);
  return s.length > 40 ? `${s.slice(0, 40)}...` : s;
}

const expect = (what: string, ok: (v: unknown) => boolean): Check => (v, path, out) => {
  if (!ok(v)) out.push({ path, message: `expected ${what}, got ${describe(v)}` });
};

const isNum = (v: unknown): boolean => typeof v === 'number' && Number.isFinite(v);

/** A finite number (fields typed `number`). */
export const num = expect('a number', isNum);
/** A finite number or null (fields typed `number | null`; results.json also writes non-finite numbers as null). */
export const numOrNull = expect('a number or null', (v) => v === null || isNum(v));
/** A whole number >= 0. */
export const count = expect('a whole number >= 0', (v) => Number.isInteger(v) && (v as number) >= 0);
export const str = expect('a string', (v) => typeof v === 'string');
export const strOrNull = expect('a string or null', (v) => v === null || typeof v === 'string');
export const bool = expect('true or false', (v) => typeof v === 'boolean');
export const boolOrNull = expect('true, false or null', (v) => v === null || typeof v === 'boolean');
/** A JSON scalar: number, string, true/false or null. */
export const scalar = expect('a number, string, true/false or null', (v) => v === null || isNum(v) || typeof v === 'string' || typeof v === 'boolean');

/**
 * One of a fixed set of strings. Built from a record over a union type, so a value added to the union
 * without being added here is a type error rather than a file the reader refuses.
 */
export function oneOf<T extends string>(values: Record<T, true>): Check {
  const known = Object.keys(values);
  return (v, path, out) => {
    if (typeof v !== 'string' || !known.includes(v)) out.push({ path, message: `expected one of ${known.map((k) => JSON.stringify(k)).join(', ')}, got ${describe(v)}` });
  };
}

/** Exactly this value. */
export function literal(value: string): Check {
  return expect(JSON.stringify(value), (v) => v === value);
}

export function nullable(c: Check): Check {
  return (v, path, out) => {
    if (v !== null) c(v, path, out);
  };
}

export function list(item: Check): Check {
  return (v, path, out) => {
    if (!Array.isArray(v)) {
      out.push({ path, message: `expected a list, got ${describe(v)}` });
      return;
    }
    v.forEach((x, i) => item(x, `${path}[${i}]`, out));
  };
}

/** An object whose values all pass `item` (any keys). */
export function record(item: Check): Check {
  return (v, path, out) => {
    if (!isObject(v)) {
      out.push({ path, message: `expected an object, got ${describe(v)}` });
      return;
    }
    for (const [k, x] of Object.entries(v)) item(x, join(path, k), out);
  };
}

type OptionalKeys<T> = { [K in keyof T]-?: Record<string, never> extends Pick<T, K> ? K : never }[keyof T];
type RequiredKeys<T> = Exclude<keyof T, OptionalKeys<T>>;

/**
 * An object of type T: every required key present and checked, every optional key checked when present.
 * Keys the reader does not know are allowed (a newer tankcheck may add fields). The key lists are typed
 * from T, so a field added to the type without a check here is a type error.
 */
export function object<T>(required: { [K in RequiredKeys<T>]: Check }, optional: { [K in OptionalKeys<T>]: Check }): Check {
  return (v, path, out) => {
    if (!isObject(v)) {
      out.push({ path, message: `expected an object, got ${describe(v)}` });
      return;
    }
    for (const [k, c] of Object.entries(required) as [string, Check][]) {
      if (!Object.hasOwn(v, k)) out.push({ path: join(path, k), message: 'missing' });
      else c(v[k], join(path, k), out);
    }
    for (const [k, c] of Object.entries(optional) as [string, Check][]) {
      if (Object.hasOwn(v, k)) c(v[k], join(path, k), out);
    }
  };
}

function isObject(v: unknown): v is Record<string, unknown> {
  return typeof v === 'object' && v !== null && !Array.isArray(v);
}

function join(path: string, key: string): string {
  const k = /^[A-Za-z_$][\w$]*$/.test(key) ? key : JSON.stringify(key);
  if (path === '') return k.startsWith('"') ? `[${k}]` : k;
  return k.startsWith('"') ? `${path}[${k}]` : `${path}.${k}`;
}
