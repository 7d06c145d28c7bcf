import { CST, Lexer } from 'yaml';

/** Largest design text accepted, in characters (the loader applies the same cap to bytes). */
export const MAX_DESIGN_CHARS = 1_000_000;
/** Deepest flow nesting (`[[...]]`, `{...}`) and most block indicators on one line accepted. */
export const MAX_NESTING = 20;
/** Widest indentation accepted, in columns. */
export const MAX_INDENT = 100;

export interface GuardFailure {
  offset: number;
  message: string;
}

/**
 * Refuse input nested far deeper than any design file needs, before the YAML composer sees it.
 * The composer recurses per nesting level; near the stack limit Node has been seen to abort the
 * whole process (a fatal V8 error, not a catchable exception) instead of throwing. The yaml Lexer
 * is an iterative generator, so scanning its tokens is safe and stops at the first excess.
 */
export function guardNesting(text: string): GuardFailure | undefined {
  let offset = 0;
  let flow = 0;
  let indicators = 0;
  let lineStart = true;
  for (const token of new Lexer().lex(text)) {
    const type = CST.tokenType(token);
    if (type === 'newline') {
      indicators = 0;
      lineStart = true;
    } else {
      if (type === 'space' && lineStart && token.length > MAX_INDENT) {
        return { offset, message: `indentation of ${token.length} columns is deeper than a design file needs (at most ${MAX_INDENT})` };
      }
      lineStart = false;
      if (type === 'flow-seq-start' || type === 'flow-map-start') flow++;
      if (type === 'flow-seq-end' || type === 'flow-map-end') flow = Math.max(0, flow - 1);
      // block indicators on one line (`- - - x`) each open a level; inside flow collections `:` does not
      if (flow === 0 && (type === 'seq-item-ind' || type === 'explicit-key-ind' || type === 'map-value-ind')) indicators++;
      if (flow > MAX_NESTING || indicators > MAX_NESTING) {
        return { offset, message: `nesting is deeper than a design file needs (at most ${MAX_NESTING} levels)` };
      }
    }
    // doc-mode, scalar and flow-error-end are lexer markers, not source characters
    if (type !== 'doc-mode' && type !== 'scalar' && type !== 'flow-error-end') offset += token.length;
  }
  return undefined;
}
