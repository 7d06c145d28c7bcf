/**
 * Placeholder rendering for deck templates. Only these kinds of value may enter a deck: finite
 * numbers, written in compact engineering notation (lower-case suffixes; `meg`, never `M`, which
 * SPICE reads as milli), `.param` blocks (validated names, numbers and our own expressions), and
 * text that is already a safe token (element lines we build, sanitised names).
 */
import { formatSpiceEng } from '../units/format.js';
import { paramLines, type ParamEntry } from './params.js';

export type TemplateValue = number | { raw: string } | { params: readonly ParamEntry[] };

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

/**
 * Replace every {{name}} in a template; a missing or unsafe value is a programming error. `.param`
 * blocks are rendered in template order, so a block may use the names of the blocks above it.
 * Single braces ({period}) are ngspice expressions and pass through untouched.
 */
export function renderTemplate(template: string, values: Record<string, TemplateValue>): string {
  const declared = new Set<string>();
  return template.replace(/\{\{(\w+)\}\}/g, (_, key: string) => {
    const v = values[key];
    if (v === undefined) throw new Error(`netlist: no value for placeholder {{${key}}}`);
    if (typeof v === 'number') return formatSpiceEng(v);
    if ('params' in v) return paramLines(v.params, declared);
    // Element lines we build may span lines, but no line may be a dot command or carry odd characters.
    if (v.raw.split('\n').some((line) => !TOKEN.test(line) || line.trimStart().startsWith('.'))) {
      throw new Error(`netlist: unsafe text for {{${key}}}`);
    }
    return v.raw;
  });
}
