import { LineCounter, isAlias, parseDocument, visit, type Document } from 'yaml';
import type { Design } from './types.js';
import { checkPhysics } from './checks.js';
import { SECTION_FIELDS, type SectionName } from './fields.js';
import { MAX_DESIGN_CHARS, guardNesting } from './guard.js';
import { readDevices, readName } from './names.js';
import { readOperating, type OperatingValues } from './operating.js';
import type { Problem } from './problem.js';
import { Reader, type Entry, type Loc } from './reader.js';
import { readSection, type SectionValues } from './sections.js';
import { readLimits } from './limits.js';
import { readCompare } from './compareSection.js';

/** Outcome of `parseDesign`: a validated Design plus warnings, or every error found. */
export type ParseDesignResult =
  | {
      ok: true;
      design: Design;
      warnings: Problem[];
      /** Where each device model's `file` key was written, so the loader can point at it when the file cannot be read. */
      modelFileAt?: Partial<Record<'diodeModel' | 'switchModel', Loc>>;
    }
  | { ok: false; problems: Problem[] };

/**
 * Alias expansions allowed while resolving the document (defuses "billion laughs" alias bombs):
 * enough to reuse one anchored value across ~100 explicit corners, far below any bomb.
 */
export const MAX_ALIAS_COUNT = 100;

export const ROOT_KEYS = ['name', 'topology', 'tank', 'switches', 'rectifier', 'output', 'operating', 'tolerances', 'compare', 'simulation', 'devices', 'limits'] as const;

// compare is read by readCompare (group keys, metric names and "off")
const SECTIONS = (Object.keys(SECTION_FIELDS) as SectionName[]).filter((k) => k !== 'compare');

function locOf(text: string, offset: number): Loc {
  const before = text.slice(0, offset);
  const line = before.split('\n').length;
  return { line, column: offset - (before.lastIndexOf('\n') + 1) + 1 };
}

const fileProblem = (code: Problem['code'], at: Loc, message: string): Problem =>
  ({ code, path: '', line: at.line, column: at.column, expected: '', received: '', message });

const byPosition = (a: Problem, b: Problem): number => a.line - b.line || a.column - b.column;

/** YAML-level problems: syntax errors, duplicate keys, alias bombs. */
function yamlProblems(doc: Document.Parsed, text: string): Problem[] {
  const out = doc.errors.map((e) => {
    const pos = e.linePos?.[0] ?? locOf(text, e.pos[0]);
    const at = { line: pos.line, column: 'col' in pos ? pos.col : pos.column };
    const message = e.code === 'MULTIPLE_DOCS' ? 'a design file holds one YAML document; remove the second "---" and what follows or merge it' : e.message.split(/ at line \d+/)[0];
    return fileProblem(e.code === 'DUPLICATE_KEY' ? 'duplicate-key' : 'yaml', at, message);
  });
  try {
    doc.toJS({ maxAliasCount: MAX_ALIAS_COUNT });
  } catch (err) {
    let at: Loc = { line: 0, column: 0 };
    visit(doc, { Alias: (_k, node) => { if (at.line === 0 && node.range) at = locOf(text, node.range[0]); } });
    out.push(fileProblem('alias', at, `aliases expand too much (${err instanceof Error ? err.message : String(err)}); a design file needs few if any, at most ${MAX_ALIAS_COUNT} expansions`));
  }
  return out;
}

const complete = (v: SectionValues | undefined): boolean => v !== undefined && Object.values(v).every((x) => x !== undefined);

/**
 * Parse and validate a design file's text (YAML) into a Design with SI values. Pure: no I/O.
 * Every problem is collected (syntax, unknown or duplicate keys, wrong types, bad numbers or
 * units, out-of-range values, physics cross-checks), each with key path, line and column.
 * Device model texts are left empty; `loadDesign` attaches them. `file` is recorded in the Design.
 */
export function parseDesign(text: string, file: string): ParseDesignResult {
  if (text.length > MAX_DESIGN_CHARS) {
    return { ok: false, problems: [fileProblem('too-large', { line: 0, column: 0 }, `the design text has ${text.length} characters; at most ${MAX_DESIGN_CHARS} are accepted`)] };
  }
  const deep = guardNesting(text);
  if (deep) return { ok: false, problems: [fileProblem('too-deep', locOf(text, deep.offset), deep.message)] };

  const lines = new LineCounter();
  const doc = parseDocument(text, { lineCounter: lines, uniqueKeys: true, prettyErrors: true });
  const yamlIssues = yamlProblems(doc, text);
  if (yamlIssues.some((p) => p.code !== 'duplicate-key')) return { ok: false, problems: yamlIssues.sort(byPosition) };

  const r = new Reader(doc, lines);
  for (const w of doc.warnings) r.problem('warning', 'yaml', '', { line: w.linePos?.[0].line ?? 0, column: w.linePos?.[0].col ?? 0 }, w.message.split(/ at line \d+/)[0]);
  if (doc.contents === null) return { ok: false, problems: [fileProblem('missing', { line: 1, column: 1 }, 'the design file is empty')] };
  const rootEntry: Entry = { node: doc.contents, loc: r.loc(doc.contents), keyLoc: r.loc(doc.contents) };
  const root = r.map(doc.contents, '', rootEntry.loc, ROOT_KEYS, 'a mapping of design sections');
  if (!root) return { ok: false, problems: r.errors };

  const name = readName(r, root.get('name'), rootEntry);
  const s = Object.fromEntries(SECTIONS.map((k) => [k, readSection(r, root, k, rootEntry)])) as Record<SectionName, SectionValues | undefined>;
  const compare = readCompare(r, root);
  const limits = readLimits(r, root);
  const op: OperatingValues | undefined = readOperating(r, root, rootEntry);
  const devices = readDevices(r, root);

  const physicsReady = (['topology', 'tank', 'switches', 'rectifier', 'output', 'tolerances'] as const).every((k) => complete(s[k])) &&
    op !== undefined && Object.values(op).every((x) => x !== undefined);
  const core = physicsReady ? {
    topology: s.topology, tank: s.tank, switches: s.switches, rectifier: s.rectifier, output: s.output,
    operating: op, tolerances: s.tolerances, compare, simulation: s.simulation,
  } as unknown as Omit<Design, 'name' | 'file' | 'devices'> : undefined;
  if (core) checkPhysics(core, r);

  // yaml's own duplicate-key reports are kept only where the walker did not report the same key with its path
  const dupAt = new Set(r.errors.filter((p) => p.code === 'duplicate-key').map((p) => `${p.line}:${p.column}`));
  const errors = [...yamlIssues.filter((p) => !dupAt.has(`${p.line}:${p.column}`)), ...r.errors];
  if (errors.length > 0 || !core || name === undefined || !compare || !complete(s.simulation)) {
    return { ok: false, problems: errors.sort(byPosition) };
  }
  const design = { name, file, ...core, devices, ...(limits ? { limits } : {}) } as Design;
  const modelFileAt: Partial<Record<'diodeModel' | 'switchModel', Loc>> = {};
  for (const key of ['diodeModel', 'switchModel'] as const) {
    const at = r.seen.get(`devices.${key}.file`);
    if (at) modelFileAt[key] = { line: at.line, column: at.column };
  }
  return { ok: true, design, warnings: r.warnings.sort(byPosition), modelFileAt };
}
