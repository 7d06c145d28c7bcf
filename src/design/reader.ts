import { isAlias, isMap, isScalar, isSeq, type Document, type LineCounter, type Node } from 'yaml';
import { didYouMean, quote, type Problem, type ProblemCode } from './problem.js';

/** A 1-based source position; line 0 means unknown. */
export interface Loc {
  line: number;
  column: number;
}

/** A value found under a key, with where it was written. */
export interface Entry {
  node: Node | null;
  /** Position of the value (of the key when the value is empty). */
  loc: Loc;
  /** Position of the key, for "missing field" problems inside this value. */
  keyLoc: Loc;
}

/** Where a leaf value came from and how it was written, for cross-field checks. */
export interface Seen extends Loc {
  text: string;
}

/**
 * Walks the YAML document tree for the section parsers: resolves aliases, reports wrong types,
 * unknown and duplicate keys with positions, and collects every problem instead of stopping.
 */
export class Reader {
  readonly errors: Problem[] = [];
  readonly warnings: Problem[] = [];
  readonly seen = new Map<string, Seen>();

  constructor(
    private readonly doc: Document,
    private readonly lines: LineCounter,
  ) {}

  /** Position of a node (its first character). */
  loc(node: unknown): Loc {
    const range = (node as Node | null)?.range;
    if (!range) return { line: 0, column: 0 };
    const { line, col } = this.lines.linePos(range[0]);
    return { line, column: col };
  }

  /** Follow an alias to the anchored node (the alias count was bounded before walking). */
  resolve(node: unknown): Node | null {
    if (isAlias(node)) return (node.resolve(this.doc) as Node | undefined) ?? null;
    return (node as Node | null) ?? null;
  }

  problem(level: 'error' | 'warning', code: ProblemCode, path: string, at: Loc, message: string, extra: Partial<Problem> = {}): void {
    const p: Problem = { code, path, line: at.line, column: at.column, expected: '', received: '', message, ...extra };
    (level === 'error' ? this.errors : this.warnings).push(p);
  }

  /** Error "expected X, got Y[: detail]" with the structured fields filled in. */
  expected(code: ProblemCode, path: string, at: Loc, expected: string, received: string, detail?: string): void {
    this.problem('error', code, path, at, `expected ${expected}, got ${received}${detail ? `: ${detail}` : ''}`, {
      expected,
      received,
    });
  }

  /** How a node reads in a message: a quoted scalar, or "a list" / "a mapping" / "nothing". */
  describe(node: unknown): string {
    const n = this.resolve(node);
    if (n === null) return 'nothing';
    if (isMap(n)) return 'a mapping';
    if (isSeq(n)) return 'a list';
    const text = this.text(n);
    return text === undefined || text === '' ? 'nothing' : quote(text);
  }

  /**
   * Source text of a scalar as written (so `0x10` stays `0x10` instead of becoming 16),
   * or undefined for collections and empty values.
   */
  text(node: unknown): string | undefined {
    const n = this.resolve(node);
    if (!isScalar(n) || n.value === null) return undefined;
    const src = (n as { source?: unknown }).source;
    return typeof src === 'string' ? src : String(n.value);
  }

  /**
   * Read a mapping: reports a wrong type, duplicate keys and unknown keys (with "did you mean"),
   * and returns the known entries, or undefined when `node` is not a mapping.
   */
  map(node: unknown, path: string, at: Loc, known: readonly string[], what = 'a mapping'): Map<string, Entry> | undefined {
    const n = this.resolve(node);
    if (!isMap(n)) {
      this.expected('type', path, n ? this.loc(n) : at, what, this.describe(n));
      return undefined;
    }
    const out = new Map<string, Entry>();
    const join = (k: string): string => (path === '' ? k : `${path}.${k}`);
    for (const pair of n.items) {
      const keyNode = this.resolve(pair.key);
      const key = isScalar(keyNode) && keyNode.value !== null ? String(keyNode.value) : undefined;
      const keyLoc = this.loc(keyNode ?? n);
      if (key === undefined) {
        this.expected('type', path, keyLoc, 'a plain key', this.describe(keyNode));
      } else if (out.has(key)) {
        // the YAML layer reports duplicates too; this one carries the key path
        this.problem('error', 'duplicate-key', join(key), keyLoc, `duplicate key "${key}"; a key may appear only once`);
      } else if (!known.includes(key)) {
        const hint = didYouMean(key, known);
        this.problem('error', 'unknown-key', join(key), keyLoc,
          `unknown key ${quote(key)}${hint ? `; did you mean "${hint}"?` : `; known keys: ${known.join(', ')}`}`,
          { expected: known.join(' | '), received: quote(key) });
      } else {
        const value = this.resolve(pair.value);
        const isEmpty = value === null || (isScalar(value) && value.value === null);
        out.set(key, { node: isEmpty ? null : value, loc: isEmpty ? keyLoc : this.loc(value), keyLoc });
      }
    }
    return out;
  }

  /** Items of a list, or the single node itself when one value was written instead of a list. */
  items(entry: Entry): Entry[] {
    const n = this.resolve(entry.node);
    if (!isSeq(n)) return [entry];
    return n.items.map((item) => {
      const v = this.resolve(item);
      return { node: v, loc: v ? this.loc(v) : entry.loc, keyLoc: entry.keyLoc };
    });
  }

  isList(entry: Entry): boolean {
    return isSeq(this.resolve(entry.node));
  }
}
