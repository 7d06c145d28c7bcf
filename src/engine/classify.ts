/**
 * Pure mapping of ngspice message text (native stderr lines, or the wasm engine's getError() lines) plus
 * the process outcome to a SimFailure and a list of diagnostics. Both engines print the same texts
 * (ngspice-39 and ngspice-45.2 checked; see classify.test.ts for the recorded lines).
 */
import type { Diagnostic, SimFailure } from './types.js';

/** What an adapter observed about one run. */
export interface RunOutcome {
  /** Message lines in order (stderr or getError()); may contain '\r'-joined progress fragments. */
  lines: string[];
  /** True when the engine delivered a complete data set (native: exit 0 and a whole raw file). */
  completed: boolean;
  exitCode?: number | null;
  signal?: string | null;
  timedOut?: boolean;
  /** Cancelled through the job's AbortSignal. */
  canceled?: boolean;
  /** The run's time limit, for the timeout message (ms). */
  timeoutMs?: number;
}

/** The verdict on one run: a failure (absent when the run is usable) and the cleaned messages. */
export interface Classification {
  failure?: SimFailure;
  diagnostics: Diagnostic[];
}

const INPUT = [
  /error on line/i,
  /unknown subckt/i,
  /could not find a valid modelname/i,
  /could not find include file/i,
  /circuit not parsed/i,
  /unknown device type/i,
  /unknown model/i,
  /can't find model/i,
  /syntax error/i,
  /xspice is required/i,
  /deck is not 7-bit ascii/i,
];
const CONVERGENCE = [
  /timestep too small/i,
  /transient op failed/i,
  /iteration limit reached/i,
  /no convergence/i,
  /gmin stepping failed/i,
  /source stepping failed/i,
  /singular matrix/i,
  /run simulation\(s\) aborted/i,
];
const FATAL = /fatal error in ngspice/i;
/** Progress prefixes that ngspice prints without a newline before the real message. */
const PROGRESS_PREFIX = /^\s*(trying gmin\s*=\s*\S+|supplies reduced to\s*\S+%)\s*/i;

/** Splits '\r'-joined fragments, strips progress prefixes, drops empty and 'Reference value' lines. */
export function cleanLines(lines: string[]): string[] {
  const out: string[] = [];
  for (const raw of lines.flatMap((l) => l.split(/\r\n|\r|\n/))) {
    let line = raw.trimEnd();
    if (/^\s*reference value\b/i.test(line)) continue;
    while (PROGRESS_PREFIX.test(line)) line = line.replace(PROGRESS_PREFIX, '');
    if (line.trim() !== '') out.push(line);
  }
  return out;
}

function levelOf(text: string): Diagnostic['level'] {
  if (/^\s*note\b/i.test(text)) return 'note';
  if (/^\s*warning\b/i.test(text) || /^warning from/i.test(text)) return 'warning';
  if (/error|fatal|aborted|too small|interrupted|failed|could not/i.test(text)) return 'error';
  if (/warning|singular/i.test(text)) return 'warning';
  return 'note';
}

/**
 * Turns message lines into diagnostics: indented lines continue the previous one, repeated texts
 * collapse into one entry with a count, and at most `limit` entries are kept (default 40) plus a note.
 */
export function parseDiagnostics(lines: string[], limit = 40): Diagnostic[] {
  const out: Diagnostic[] = [];
  for (const line of cleanLines(lines)) {
    const prev = out[out.length - 1];
    if (prev && /^\s/.test(line)) prev.text += `\n${line.trim()}`;
    else out.push({ level: levelOf(line.trim()), text: line.trim() });
  }
  const counts = new Map<string, number>();
  for (const d of out) counts.set(d.text, (counts.get(d.text) ?? 0) + 1);
  const unique = out.filter((d, i) => out.findIndex((e) => e.text === d.text) === i);
  const merged = unique.map((d) => (counts.get(d.text)! > 1 ? { ...d, text: `${d.text} (x${counts.get(d.text)})` } : d));
  if (merged.length <= limit) return merged;
  return [...merged.slice(0, limit), { level: 'note', text: `${merged.length - limit} more diagnostic lines omitted` }];
}

/** One-line form of a diagnostic, without ngspice's generic 'Simulation interrupted' continuation. */
function oneLine(text: string): string {
  return text.split('\n').filter((l) => !/simulation interrupted due to error/i.test(l)).join(' ').replace(/\s+/g, ' ').trim();
}

/** Error diagnostics matching any pattern, joined with '; ' (warnings only if no error matches). */
function describe(diagnostics: Diagnostic[], patterns: RegExp[]): string | undefined {
  const hits = diagnostics.filter((d) => patterns.some((re) => re.test(d.text)));
  const errors = hits.filter((d) => d.level === 'error');
  const chosen = (errors.length > 0 ? errors : hits).map((d) => oneLine(d.text));
  return chosen.length > 0 ? chosen.join('; ') : undefined;
}

/** Finds the 'Timestep too small' report and the simulated time (s) it names; 'initial timepoint' is t = 0. */
export function findTimestepFailure(lines: string[]): { message: string; atTime?: number } | undefined {
  const hits = cleanLines(lines).filter((l) => /timestep too small/i.test(l));
  const line = hits.find((l) => /doanalyses|time\s*=|initial timepoint/i.test(l)) ?? hits[0];
  if (!line) return undefined;
  const message = line.trim().replace(/\s+/g, ' ');
  const m = /\btime\s*=\s*([-+0-9.eE]+)/.exec(line);
  if (m && Number.isFinite(Number(m[1]))) return { message, atTime: Number(m[1]) };
  if (/initial timepoint/i.test(line)) return { message, atTime: 0 };
  return { message };
}

/** Classifies one run. Precedence: cancel, timeout, input, convergence, fatal, other incomplete runs. */
export function classifyRun(o: RunOutcome): Classification {
  const diagnostics = parseDiagnostics(o.lines);
  const lines = cleanLines(o.lines);
  const fail = (failure: SimFailure): Classification => ({ failure, diagnostics });
  if (o.canceled) return fail({ kind: 'aborted', message: 'run cancelled' });
  if (o.timedOut) {
    const limit = o.timeoutMs !== undefined ? ` within ${o.timeoutMs} ms` : '';
    return fail({ kind: 'timeout', message: `simulation did not finish${limit}` });
  }
  // After a completed run only error-level input messages count (a stray warning does not fail it).
  const input = describe(o.completed ? diagnostics.filter((d) => d.level === 'error') : diagnostics, INPUT);
  if (input) return fail({ kind: 'input', message: input });
  const fatal = lines.find((l) => FATAL.test(l));
  if (!o.completed && !fatal) {
    const step = findTimestepFailure(lines);
    if (step) return fail({ kind: 'convergence', ...step });
    const conv = describe(diagnostics, CONVERGENCE);
    if (conv) return fail({ kind: 'convergence', message: conv });
  }
  if (fatal) return fail({ kind: 'engine', message: fatal.trim() });
  if (!o.completed) {
    const lastError = [...diagnostics].reverse().find((d) => d.level === 'error')?.text;
    const how = o.signal ? `killed by ${o.signal}` : o.exitCode ? `exited with code ${o.exitCode}` : 'returned no complete data';
    return fail({ kind: 'engine', message: lastError ? `ngspice ${how}: ${lastError}` : `ngspice ${how}` });
  }
  return { diagnostics };
}
