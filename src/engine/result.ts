/**
 * Pure assembly of a SimResult from what an adapter collected: the raw-file bytes (if any) and the run
 * outcome. Shared by the native and wasm engines so both return the same vector names and failure kinds.
 */
import { classifyRun, type RunOutcome } from './classify.js';
import { parseRaw, RawFormatError, type RawPlot } from './rawfile.js';
import type { Diagnostic, SimFailure, SimResult } from './types.js';

/** A result for a run that produced nothing: the failure plus one error diagnostic with its message. */
export function failedResult(id: string, failure: SimFailure, wallMs: number): SimResult {
  return { id, ok: false, failure, partial: false, vectors: {}, diagnostics: [{ level: 'error', text: failure.message }], wallMs };
}

/**
 * Vectors of one plot for SimResult: the scale first, then the other vectors sorted by name (the two
 * engines write them in different orders). Complex plots give `real(name)` and `imag(name)`; the scale
 * (e.g. 'frequency') keeps its plain name.
 */
export function plotVectors(plot: RawPlot): Record<string, Float64Array> {
  const [scale, ...rest] = plot.variables;
  const ordered = scale ? [scale, ...rest.sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))] : [];
  const out: Record<string, Float64Array> = {};
  for (const v of ordered) {
    if (v.index === 0 || plot.flags === 'real') out[v.name] = plot.vectors[v.name];
    else {
      out[`real(${v.name})`] = plot.vectors[v.name];
      out[`imag(${v.name})`] = plot.imag![v.name];
    }
  }
  return out;
}

/** What an adapter hands to assembleResult. */
export interface AssembleInput {
  id: string;
  /** Raw-file bytes; undefined when no file was written. */
  raw?: Uint8Array;
  /** `completed` here means the engine itself reported success; the raw file is checked on top. */
  outcome: RunOutcome;
  wallMs: number;
  /** Extra diagnostics from the adapter, placed before the engine's own. */
  notes?: Diagnostic[];
}

/**
 * Why the vectors of a plot cannot be real simulator output, or undefined when they can: a value
 * that is not finite (NaN, Infinity) or a scale (time) that runs backwards. A damaged file can parse
 * cleanly and still hold such rows; nothing downstream should measure them.
 */
export function implausibleVectors(plot: RawPlot): string | undefined {
  for (const v of plot.variables) {
    const values = plot.vectors[v.name];
    for (let i = 0; i < values.length; i++) {
      if (!Number.isFinite(values[i])) return `${v.name} has a value that is not finite (${values[i]}) at row ${i}`;
    }
  }
  const scale = plot.variables[0];
  if (scale && plot.flags === 'real') {
    const t = plot.vectors[scale.name];
    for (let i = 1; i < t.length; i++) {
      if (t[i] < t[i - 1]) return `${scale.name} decreases at row ${i} (${t[i - 1]} then ${t[i]}): rows out of order`;
    }
  }
  return undefined;
}

/** Parses the raw bytes (last plot = the final analysis), classifies the run and builds the SimResult. */
export function assembleResult(input: AssembleInput): SimResult {
  const notes: Diagnostic[] = [...(input.notes ?? [])];
  let plot: RawPlot | undefined;
  let rawProblem: string | undefined;
  if (input.raw && input.raw.length > 0) {
    try {
      const plots = parseRaw(input.raw);
      plot = plots[plots.length - 1];
    } catch (err) {
      if (!(err instanceof RawFormatError)) throw err;
      rawProblem = `unreadable raw file: ${err.message}`;
      notes.push({ level: 'error', text: rawProblem });
    }
  } else rawProblem = input.raw ? 'the raw file is empty' : 'no raw file was written';
  if (plot?.aborted) {
    rawProblem = plot.declaredPoints > plot.points
      ? `the raw file is truncated (${plot.points} of ${plot.declaredPoints} rows)`
      : `the raw file is incomplete (${plot.points} rows, no final row count)`;
  }
  const completed = input.outcome.completed && plot !== undefined && !plot.aborted;
  const classified = classifyRun({ ...input.outcome, completed });
  let failure = classified.failure;
  // The engine said it finished, so the reason lies in the raw file: name it instead of a generic "no data"
  if (input.outcome.completed && !completed && failure?.kind === 'engine' && rawProblem) {
    failure = { kind: 'engine', message: `the simulator reported success but ${rawProblem}` };
  }
  const diagnostics = classified.diagnostics;
  const corrupt = plot && !failure ? implausibleVectors(plot) : undefined;
  if (corrupt) {
    failure = { kind: 'engine', message: `corrupt raw file: ${corrupt}` };
    notes.push({ level: 'error', text: failure.message });
    plot = undefined;
  }
  const vectors = plot ? plotVectors(plot) : {};
  const rows = plot?.points ?? 0;
  const result: SimResult = {
    id: input.id,
    ok: failure === undefined,
    partial: failure !== undefined && rows > 0,
    vectors,
    diagnostics: [...notes, ...diagnostics],
    wallMs: input.wallMs,
  };
  if (failure) result.failure = failure;
  return result;
}
