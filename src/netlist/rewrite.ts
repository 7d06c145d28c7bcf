/**
 * Rewrites of deck text, used as the rungs of the retry ladder (src/engine/retry.ts). Pure text
 * functions on our own deck form (`.options` lines, numeric `ic=` values, `.end` last); they also
 * accept other ngspice decks (suffixed numbers, `.opt` spellings, `+` continuation lines).
 */

const OPTIONS_LINE = /^\s*\.opt(?:ion|ions)?\b/i;
const END_LINE = /^\s*\.end\s*$/i;
const SPICE_SCALE: Record<string, number> = { f: 1e-15, p: 1e-12, n: 1e-9, u: 1e-6, m: 1e-3, k: 1e3, meg: 1e6, g: 1e9, t: 1e12 };

/** Parses a number as SPICE reads it, e.g. '1e-4', '100u', '2.5meg', '1M' (= milli); NaN if it is not one. */
export function parseSpiceNumber(text: string): number {
  const m = /^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)(meg|[fpnumkgt])?[a-z]*$/i.exec(text.trim());
  if (!m) return NaN;
  return Number(m[1]) * (m[2] ? SPICE_SCALE[m[2].toLowerCase()]! : 1);
}

/** Indices of `.options` lines and their `+` continuation lines. */
function optionLineIndices(lines: string[]): number[] {
  const out: number[] = [];
  let inOptions = false;
  lines.forEach((line, i) => {
    if (OPTIONS_LINE.test(line)) inOptions = true;
    else if (!(inOptions && /^\s*\+/.test(line))) inOptions = false;
    if (inOptions) out.push(i);
  });
  return out;
}

/** Inserts `line` before the last `.end` line (appends it when there is none). */
export function insertBeforeEnd(deck: string, line: string): string {
  const lines = deck.split('\n');
  let end = -1;
  lines.forEach((l, i) => {
    if (END_LINE.test(l)) end = i;
  });
  if (end < 0) {
    const trailing = lines.length > 0 && lines[lines.length - 1] === '' ? lines.length - 1 : lines.length;
    lines.splice(trailing, 0, line);
  } else lines.splice(end, 0, line);
  return lines.join('\n');
}

/**
 * Adds `.options rshunt=<ohms>` before `.end`: a resistor from every node to ground (system ngspice;
 * the wasm build ignores the option). @default 1e9 ohm
 */
export function addRshunt(deck: string, ohms = 1e9): string {
  return insertBeforeEnd(deck, `.options rshunt=${ohms}`);
}

/** The integration method the deck asks for: the last `method=` in `.options`, else ngspice's default 'trap'. */
export function integrationMethod(deck: string): 'trap' | 'gear' {
  const lines = deck.split('\n');
  let method: 'trap' | 'gear' = 'trap';
  for (const i of optionLineIndices(lines)) {
    for (const m of lines[i]!.matchAll(/\bmethod\s*=\s*([a-z]+)/gi)) method = m[1]!.toLowerCase() === 'gear' ? 'gear' : 'trap';
  }
  return method;
}

/**
 * Switches gear <-> trap by rewriting every `method=` in `.options` lines (adding one if absent). When the
 * result is trap, every `reltol` above 1e-4 becomes 1e-4 (added if absent): trap at the default 1e-3 rings.
 */
export function switchIntegrationMethod(deck: string): string {
  const to = integrationMethod(deck) === 'gear' ? 'trap' : 'gear';
  const lines = deck.split('\n');
  const idx = optionLineIndices(lines);
  let hasMethod = false;
  let hasReltol = false;
  for (const i of idx) {
    lines[i] = lines[i]!.replace(/\bmethod\s*=\s*[a-z]+/gi, () => {
      hasMethod = true;
      return `method=${to}`;
    });
    if (to === 'trap') {
      lines[i] = lines[i]!.replace(/\breltol\s*=\s*(\S+)/gi, (all, value: string) => {
        hasReltol = true;
        return parseSpiceNumber(value) <= 1e-4 ? all : 'reltol=1e-4';
      });
    }
  }
  const extra = [hasMethod ? '' : `method=${to}`, to === 'trap' && !hasReltol ? 'reltol=1e-4' : ''].filter(Boolean);
  const out = lines.join('\n');
  return extra.length > 0 ? insertBeforeEnd(out, `.options ${extra.join(' ')}`) : out;
}

/**
 * Start from rest: every `ic=` value becomes 0 (the deck keeps `uic`, so the run starts with all
 * capacitors discharged and all inductor currents 0). Case-insensitive; a value in braces is replaced too.
 */
export function zeroStart(deck: string): string {
  return deck.replace(/(\sic\s*=\s*)(\{[^}\n]*\}|[^\s)\n]+)/gi, '$10');
}
