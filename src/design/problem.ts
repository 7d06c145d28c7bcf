/** What kind of problem a design (or device model) file has. */
export type ProblemCode =
  | 'yaml' // YAML syntax error
  | 'duplicate-key'
  | 'alias' // alias expansion over the limit (alias bomb)
  | 'too-deep' // nesting deeper than any design file needs
  | 'too-large' // file or text over the size cap
  | 'encoding' // not UTF-8
  | 'io' // file could not be read
  | 'unknown-key'
  | 'missing' // required key absent
  | 'type' // wrong YAML type (list where a value was expected, ...)
  | 'value' // value does not parse (bad number, wrong unit, unknown choice)
  | 'range' // outside the physically meaningful range (<= 0, tolerance >= 50 %, ...)
  | 'implausible' // physically possible but almost surely a typo (unit prefix slip) or inconsistent
  | 'model' // device model file rejected by the line filter
  | 'json'; // a results or waveforms file that is not valid JSON

/** One problem in a design file, as a structured record; `formatProblem` renders it for people. */
export interface Problem {
  code: ProblemCode;
  /** Key path such as `tank.lm` or `operating.corners[1].load`; '' for the whole file. */
  path: string;
  /** 1-based line and column of the offending node; 0 when the problem has no position. */
  line: number;
  column: number;
  /** What would have been accepted, e.g. `an inductance > 0 H such as "310 uH"`; '' if not applicable. */
  expected: string;
  /** The text found (shortened, control characters escaped); '' if not applicable. */
  received: string;
  /** Full human-readable explanation, without file or position. */
  message: string;
  /** The file the position refers to when it is not the design file (a device model file). */
  file?: string;
}

/**
 * Render a problem as `file:line:column: path: message`, e.g.
 * `demo.yaml:9:7: tank.lm: expected an inductance > 0 H such as "310 uH", got "abc"` (the form
 * compilers use, so editors and CI problem matchers pick it up); without a position
 * `file: path: message`, and `file: message` for the whole file.
 * `file` is the design file; a problem that belongs to a model file names that file instead.
 */
export function formatProblem(p: Problem, file: string): string {
  const where = `${p.file ?? file}${p.line > 0 ? `:${p.line}:${p.column}` : ''}`;
  return `${where}: ${p.path === '' ? '' : `${p.path}: `}${p.message}`;
}

/** Quote user text for a message: at most `max` characters, control and non-ASCII-space characters escaped. */
export function quote(text: string, max = 40): string {
  const cut = text.length > max ? `${text.slice(0, max)}...` : text;
  // eslint-disable-next-line no-control-regex
  const safe = cut.replace(/[\u0000-\u001f\u007f-\u009f\u2028\u2029"\\]/g, (c) =>
    c === '"' ? '\\"' : c === '\\' ? '\\\\' : `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`,
  );
  return `"${safe}"`;
}

const norm = (s: string): string => s.toLowerCase().replace(/[-_ ]/g, '');

function distance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, i) => i);
  for (let i = 1; i <= a.length; i++) {
    let prev = row[0];
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const cur = row[j];
      row[j] = Math.min(row[j] + 1, row[j - 1] + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = cur;
    }
  }
  return row[b.length];
}

/** The closest known word to `word` (ignoring case, `-`, `_` and spaces), if it is close enough to be a typo. */
export function didYouMean(word: string, known: readonly string[]): string | undefined {
  const w = norm(word.slice(0, 64));
  let best: string | undefined;
  let bestD = Infinity;
  for (const k of known) {
    const d = distance(w, norm(k));
    if (d < bestD) [best, bestD] = [k, d];
  }
  const limit = Math.max(1, Math.floor((best?.length ?? 0) / 3));
  return bestD <= limit ? best : undefined;
}
