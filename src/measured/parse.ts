import { parse as parseCsv } from 'csv-parse/sync';
import { parseLoad, parseQuantity, type ParseResult } from '../units/index.js';
import { didYouMean } from '../design/problem.js';
import { COLUMNS, LOAD_HEADER_UNITS, splitHeader, type ColumnSpec } from './columns.js';
import type { MeasuredParse, MeasuredPoint, MeasuredProblem } from './types.js';

/** Rows read at most: a bench file is tens of points; this bounds memory on a wrong file. */
export const MAX_ROWS = 100_000;

interface Column {
  spec: ColumnSpec;
  index: number;
  unit?: string;
}

type Record_ = { record: string[]; raw: string; line: number };

/**
 * Read a measured-points CSV (pure: text in, points or every problem out).
 *
 * One header row; required columns `vin`, `load`, `fs`, `vout`; optional `iin`, `pin`,
 * `tankCurrentRms`, `crVoltagePeak`, `switchTurnOffCurrent`, `note`. Cells use the design
 * file's engineering notation (`390 V`, `98.5 kHz`, `50%`); a header may carry a unit in brackets
 * (`vin [V]`) and then a bare number in that column takes it. Comma or semicolon delimiters (the
 * one the header uses), a UTF-8 byte-order mark, empty lines and whole-line `#` comments are
 * accepted. Every bad cell is
 * reported, each with its line and character column.
 */
export function parseMeasured(text: string): MeasuredParse {
  // one line ending, so csv-parse's raw text counts lines the same way for CRLF and LF files
  const body = (text.charCodeAt(0) === 0xfeff ? text.slice(1) : text).replace(/\r\n?/g, '\n');
  const delimiter = guessDelimiter(body);
  let records: Record_[];
  try {
    const parsed = parseCsv(body, { delimiter, record_delimiter: '\n', comment: '#', comment_no_infix: true, raw: true, relax_column_count: true, skip_empty_lines: true, to: MAX_ROWS + 2 }) as unknown as { record: string[]; raw: string }[];
    records = withLines(parsed);
  } catch (e) {
    const err = e as { lines?: number; message?: string };
    return fail([{ line: err.lines ?? 1, column: 1, field: '', message: `not readable as CSV: ${err.message ?? String(e)}` }]);
  }
  records = records.filter((r) => r.record.some((c) => c.trim() !== ''));
  if (records.length === 0) return fail([{ line: 1, column: 1, field: '', message: 'is empty; expected a header row with vin, load, fs, vout' }]);
  const problems: MeasuredProblem[] = [];
  const [head, ...rows] = records;
  const columns = readHeader(head, delimiter, problems);
  if (rows.length > MAX_ROWS) problems.push({ line: rows[MAX_ROWS].line, column: 1, field: '', message: `has more than ${MAX_ROWS} rows` });
  if (rows.length === 0) problems.push({ line: head.line, column: 1, field: '', message: 'has a header but no rows' });
  if (problems.length) return fail(problems);
  const points = rows.slice(0, MAX_ROWS).map((r) => readRow(r, columns, delimiter, problems));
  return problems.length ? fail(problems) : { ok: true, points };
}

function fail(problems: MeasuredProblem[]): MeasuredParse {
  return { ok: false, problems: problems.sort((a, b) => a.line - b.line || a.column - b.column) };
}

/** The delimiter the header row uses: the more frequent of `,` and `;` outside quotes. */
function guessDelimiter(text: string): ',' | ';' {
  const firstLine = text.split('\n').find((l) => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? '';
  let commas = 0;
  let semis = 0;
  let quoted = false;
  for (const ch of firstLine) {
    if (ch === '"') quoted = !quoted;
    else if (!quoted && ch === ',') commas++;
    else if (!quoted && ch === ';') semis++;
  }
  return semis > commas ? ';' : ',';
}

/** 1-based character column where each field of a one-line raw record starts. */
function fieldColumns(raw: string, delimiter: string): number[] {
  const line = raw.split('\n')[0];
  const starts = [1];
  let quoted = false;
  for (let i = 0; i < line.length; i++) {
    if (line[i] === '"') quoted = !quoted;
    else if (!quoted && line[i] === delimiter) starts.push(i + 2);
  }
  return starts;
}

/**
 * The 1-based line each record starts on, counted from the raw text csv-parse hands back (its own
 * line counter counts a record's end and skipped empty lines inconsistently across line endings).
 */
function withLines(parsed: { record: string[]; raw: string }[]): Record_[] {
  let before = 0;
  return parsed.map((p) => {
    const leading = /^(?:[ \t]*(?:#[^\n]*)?\n)*/.exec(p.raw)![0];
    const line = before + 1 + (leading.match(/\n/g)?.length ?? 0);
    before += p.raw.match(/\n/g)?.length ?? 0;
    return { record: p.record, raw: p.raw.slice(leading.length), line };
  });
}

function readHeader(head: Record_, delimiter: string, problems: MeasuredProblem[]): Column[] {
  const line = head.line;
  const cols = fieldColumns(head.raw, delimiter);
  const names = COLUMNS.map((c) => c.name);
  const columns: Column[] = [];
  head.record.forEach((cell, index) => {
    const at = { line, column: cols[index] ?? 1 };
    const { name, unit } = splitHeader(cell);
    const spec = COLUMNS.find((c) => c.name === name);
    if (!spec) {
      const hint = didYouMean(name, names);
      problems.push({ ...at, field: name, message: `unknown column${hint ? `; did you mean "${hint}"?` : `; expected one of ${names.join(', ')}`}` });
      return;
    }
    if (columns.some((c) => c.spec === spec)) {
      problems.push({ ...at, field: name, message: 'appears twice in the header' });
      return;
    }
    if (unit !== undefined && !headerUnitFits(spec, unit)) {
      problems.push({ ...at, field: name, message: `header unit "[${unit}]" does not fit; expected ${unitHint(spec)}` });
      return;
    }
    columns.push({ spec, index, ...(unit !== undefined ? { unit } : {}) });
  });
  for (const spec of COLUMNS) {
    if (spec.required && !columns.some((c) => c.spec === spec) && !problems.some((p) => p.field === spec.name)) {
      problems.push({ line, column: 1, field: spec.name, message: 'required column is missing' });
    }
  }
  return columns;
}

function headerUnitFits(spec: ColumnSpec, unit: string): boolean {
  if (spec.kind === 'text') return false;
  if (spec.kind === 'load') return (LOAD_HEADER_UNITS as readonly string[]).includes(unit);
  return parseQuantity(`1 ${unit}`, spec.kind).ok;
}

function unitHint(spec: ColumnSpec): string {
  if (spec.kind === 'text') return 'no unit (free text)';
  if (spec.kind === 'load') return `one of ${LOAD_HEADER_UNITS.map((u) => `[${u}]`).join(' ')}`;
  return `a unit of ${spec.kind} such as [${parseHintUnit(spec.kind)}]`;
}

function parseHintUnit(kind: ColumnSpec['kind']): string {
  return ({ volt: 'V', hertz: 'kHz', ampere: 'A', watt: 'W' } as Record<string, string>)[kind] ?? '';
}

/** One cell as a quantity: a bare number takes the header's unit (`390` under `vin [V]`). */
function readCell(cell: string, col: Column): ParseResult<unknown> {
  const bare = col.unit !== undefined && /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/.test(cell);
  const withUnit = bare ? `${cell}${col.unit === '%' ? '' : ' '}${col.unit}` : cell;
  if (col.spec.kind === 'load') return parseLoad(withUnit);
  return parseQuantity(withUnit, col.spec.kind as Exclude<ColumnSpec['kind'], 'load' | 'text'>);
}

function readRow(r: Record_, columns: Column[], delimiter: string, problems: MeasuredProblem[]): MeasuredPoint {
  const line = r.line;
  const cols = fieldColumns(r.raw, delimiter);
  const point: Record<string, unknown> = { line };
  for (const col of columns) {
    const cell = (r.record[col.index] ?? '').trim();
    const at = { line, column: cols[col.index] ?? cols[cols.length - 1] + 1, field: col.spec.name };
    if (cell === '') {
      if (col.spec.required) problems.push({ ...at, message: 'is empty; a value is required' });
      continue;
    }
    if (col.spec.kind === 'text') {
      point[col.spec.name] = cell;
      continue;
    }
    const v = readCell(cell, col);
    if (!v.ok) {
      problems.push({ ...at, message: v.message });
      continue;
    }
    const value = v.value;
    if (typeof value === 'number' && !(value > 0)) {
      problems.push({ ...at, message: `"${cell}" must be greater than 0` });
      continue;
    }
    if (col.spec.kind === 'load' && !((value as { value: number }).value > 0)) {
      problems.push({ ...at, message: `"${cell}" must be greater than 0` });
      continue;
    }
    point[col.spec.name] = value;
  }
  return point as unknown as MeasuredPoint;
}
