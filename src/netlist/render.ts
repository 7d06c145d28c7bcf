/**
 * Placeholder rendering for deck templates. Only two kinds of value may enter a deck: finite
 * numbers, written in plain exponent notation (SPICE suffixes such as M = milli are never used),
 * and text that is already a safe token (element lines we build, sanitised names).
 */
export type TemplateValue = number | { raw: string };

/** Plain exponent notation with 13 significant digits, e.g. 6.000000000000e-5. */
export function spiceNumber(x: number): string {
  if (!Number.isFinite(x)) throw new Error(`netlist: refusing to write a non-finite number (${x})`);
  return x.toExponential(12);
}

/**
 * A name reduced to [A-Za-z0-9_.-] (max 80 characters), safe in a comment, title or file name. A
 * leading '.' becomes '_': a design may be named ".control" or "..", and neither a dot command nor a
 * relative path may come out of it.
 */
export function safeName(s: string): string {
  const out = s.replace(/[^A-Za-z0-9_.-]+/g, '_').replace(/^\./, '_').slice(0, 80);
  return out.length > 0 ? out : '_';
}

const TOKEN = /^[A-Za-z0-9_ ().=,+-]*$/;

/** Replace every {{name}} in a template; a missing or unsafe value is a programming error. */
export function renderTemplate(template: string, values: Record<string, TemplateValue>): string {
  return template.replace(/\{\{(\w+)\}\}/g, (_, key: string) => {
    const v = values[key];
    if (v === undefined) throw new Error(`netlist: no value for placeholder {{${key}}}`);
    if (typeof v === 'number') return spiceNumber(v);
    // Element lines we build may span lines, but no line may be a dot command or carry odd characters.
    if (v.raw.split('\n').some((line) => !TOKEN.test(line) || line.trimStart().startsWith('.'))) {
      throw new Error(`netlist: unsafe text for {{${key}}}`);
    }
    return v.raw;
  });
}
