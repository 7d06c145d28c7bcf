/**
 * The one reader of the JSON files tankcheck writes and reads back: results.json (for `report`,
 * `--baseline` and merging) and waveforms.json. Pure: it takes the text and the file name (for the
 * messages) and returns the typed value, or every problem with its JSON path, so that a truncated,
 * partial or hand-edited file is refused with a clear message before anything uses it.
 */
import type { FhaResult } from '../fha/types.js';
import type { Corner } from '../corners/types.js';
import type { ComparisonRow, Divergence } from '../compare/types.js';
import type { SimMetrics, ZvsState } from '../measure/types.js';
import type { IdealMetrics } from '../ideal/metrics.js';
import type { DivergenceCause } from '../compare/cause.js';
import type { CheckSide, LimitCheck, LimitName } from '../limits/types.js';
import type { ShardInfo } from './merge.js';
import type { BaselineReport, CornerFailure, CornerResult, CornerStatus, Results, ResultsSummary, SimSummary, WaveformExcerpt } from './types.js';
import type { Problem } from '../design/problem.js';
import { bool, boolOrNull, count, list, literal, num, numOrNull, nullable, object, oneOf, record, scalar, str, strOrNull, type Check, type ShapeProblem } from './shape.js';

/** The value read, or the problems that make the file unusable (rendered with `formatProblem`). */
export type ReadResult<T> = { ok: true; value: T } | { ok: false; problems: Problem[] };

/** Problems listed per file at most; the rest are counted. */
export const MAX_PROBLEMS = 20;

const STATUS: Record<CornerStatus, true> = { predicted: true, unreachable: true, ok: true, diverged: true, failed: true, 'not-settled': true, 'outside-limits': true, screened: true };
const VERDICT: Record<ComparisonRow['verdict'], true> = { ok: true, diverged: true, info: true };
const side: Check = (v, path, out) => {
  if (v !== -1 && v !== 0 && v !== 1) out.push({ path, message: `expected -1, 0 or 1, got ${JSON.stringify(v) ?? 'nothing'}` });
};

const inputs = object<Omit<Corner, 'id'>>({
  vin: num, load: num, loadLabel: str, iout: num, pout: num, fs: numOrNull, lr: num, cr: num, lm: num, turnsRatio: num,
  tolerance: object<Corner['tolerance']>({ lr: side, cr: side, lm: side }, {}),
}, { windingRatio: num, sample: count, deviation: object<NonNullable<Corner['deviation']>>({ lr: num, cr: num, lm: num, turnsRatio: num }, {}) });

const fha = object<FhaResult>({
  fs: numOrNull, fr: num, fp: num, zr: num, rac: num, fn: numOrNull, q: num, ln: num, gain: numOrNull, gainTarget: num,
  vout: numOrNull, iout: numOrNull, region: nullable(oneOf<'inductive' | 'capacitive'>({ inductive: true, capacitive: true })),
  phase: numOrNull, zvs: boolOrNull, zvsMargin: numOrNull, zvsRequiredCurrent: num, zcs: boolOrNull, fsZeroPhase: num,
  gainAtZeroPhase: num, fsPeakGain: num, peakGain: num, tankCurrentRms: numOrNull, tankCurrentPeak: numOrNull,
  magnetizingCurrentPeak: numOrNull, crVoltagePeak: numOrNull, crVoltageMin: numOrNull, switchCurrentRms: numOrNull,
  switchTurnOffCurrent: numOrNull, diodeCurrentAvg: numOrNull, diodeCurrentPeak: numOrNull, diodeCurrentRms: numOrNull,
  diodeReverseVoltage: numOrNull, outputRippleCurrentRms: numOrNull, warnings: list(str),
}, {});

const metricFields = {
  fs: num, gain: num, vout: num, voutRipple: num, iout: num, pout: num, tankCurrentRms: num, tankCurrentPeak: num,
  magnetizingCurrentPeak: num, crVoltagePeak: num, crVoltageMin: num, switchCurrentRms: num, switchTurnOffCurrent: num,
  diodeCurrentAvg: num, diodeCurrentPeak: num, diodeCurrentRms: num, diodeReverseVoltage: num, diodeReverseCurrent: num,
  outputRippleCurrentRms: num, zvs: bool, zvsState: oneOf<ZvsState>({ zvs: true, partial: true, hard: true }), zvsWorstVoltage: num,
  zvsMarginTime: num, zcs: bool, zcsRatio: num, region: oneOf<SimMetrics['region']>({ inductive: true, capacitive: true }), mode: str,
};
const region = oneOf<SimMetrics['region']>({ inductive: true, capacitive: true });
const sim = object<SimSummary>({ ...metricFields, cycles: count, runs: count, simulations: count, settled: bool, settleError: numOrNull },
  { inputPower: numOrNull, chargeBalanceError: numOrNull, periodicityError: numOrNull,
    closest: object<NonNullable<SimSummary['closest']>>({ vout: num, fs: num, region }, {}) });
const ideal = object<IdealMetrics>(metricFields, { inputPower: numOrNull });
/** Sections whose inner fields this reader does not check (yet): they must at least be objects. */
const anObject = record(() => {});

const CAUSE: Record<DivergenceCause, true> = { approximation: true, circuit: true, unexplained: true };
const LIMIT: Record<LimitName, true> = {
  region: true, 'frequency.min': true, 'frequency.max': true, zvs: true, zvsMargin: true, crVoltage: true, tankCurrentRms: true,
  switchCurrentRms: true, diodeReverseVoltage: true, diodeCurrentRms: true, outputRippleCurrentRms: true,
};
const checkSide = object<CheckSide>({ value: scalar, within: boolOrNull }, {});
const check = object<LimitCheck>({
  limit: oneOf(LIMIT), bound: scalar, kind: oneOf<LimitCheck['kind']>({ max: true, min: true, state: true }),
  fha: checkSide, ideal: nullable(checkSide), sim: nullable(checkSide), flip: bool,
}, {});

const row = object<ComparisonRow>({ metric: str, fha: scalar, sim: scalar, error: numOrNull, tolerance: numOrNull, verdict: oneOf(VERDICT) },
  { reason: str, unexpectedSign: bool, ideal: scalar, cause: oneOf(CAUSE) });
const divergence = object<Divergence>({ metric: str, fha: scalar, sim: scalar, error: numOrNull, tolerance: numOrNull, reason: str },
  { unexpectedSign: bool, ideal: scalar, cause: oneOf(CAUSE) });

const corner = object<CornerResult>({
  id: str, inputs, fha, sim: nullable(sim), comparison: list(row), divergences: list(divergence), status: oneOf(STATUS),
}, { failure: object<CornerFailure>({ kind: str, message: str }, { detail: str }), ideal: nullable(ideal), idealReason: str, checks: list(check),
  source: oneOf<'measured'>({ measured: true }), measured: anObject });

/** Summary counts added after results@1 first shipped: optional on read (an older baseline lacks them) and filled in as 0. */
type LaterCounts = 'outsideLimits' | 'flips';
const summary = object<Omit<ResultsSummary, LaterCounts> & Partial<Pick<ResultsSummary, LaterCounts>>>({
  corners: count, ok: count, diverged: count, failed: count, notSettled: count, predicted: count, unreachable: count, simulations: count,
  worst: list(object<ResultsSummary['worst'][number]>({ id: str, metric: str, error: numOrNull, tolerance: numOrNull }, {})),
}, { outsideLimits: count, flips: count, screened: count });

const baseline = object<BaselineReport>({
  file: str, added: list(str), removed: list(str),
  statusChanges: list(object<BaselineReport['statusChanges'][number]>({ id: str, from: str, to: str }, {})),
  moved: list(object<BaselineReport['moved'][number]>({ id: str, metric: str, before: num, after: num, change: numOrNull, tolerance: num }, {})),
  regressed: bool,
}, { checksOutside: list(object<NonNullable<BaselineReport['checksOutside']>[number]>({ id: str, limit: str, before: scalar, after: scalar, bound: scalar }, {})) });

const results = object<Results>({
  schema: literal('tankcheck/results@1'),
  tool: object<Results['tool']>({ name: literal('tankcheck'), version: str }, {}),
  design: object<Results['design']>({ name: str, file: strOrNull }, {}),
  engine: nullable(object<NonNullable<Results['engine']>>({ name: str, version: str }, {})),
  corners: list(corner),
  summary,
}, { incomplete: bool, baseline, measured: anObject, statistics: anObject,
  shard: object<ShardInfo>({ index: count, count, total: count, items: list(count), fingerprint: str }, {}) });

const waveform = object<WaveformExcerpt>({ id: str, fs: num, t: list(num), series: record(list(num)), edges: list(num) }, {});
const waveformsFile = object<{ schema: string; corners: WaveformExcerpt[] }>({ schema: literal('tankcheck/waveforms@1'), corners: list(waveform) }, {});

/** Read a results file (`tankcheck/results@1`): shape, field types, and corner ids that are unique. */
export function readResults(text: string, file: string): ReadResult<Results> {
  return readJson<Results>(text, file, results, (r, out) => {
    r.summary.outsideLimits ??= 0;
    r.summary.flips ??= 0;
    const seen = new Set<string>();
    r.corners.forEach((c, i) => {
      if (seen.has(c.id)) out.push({ path: `corners[${i}].id`, message: `corner ${JSON.stringify(c.id)} appears twice` });
      seen.add(c.id);
    });
  });
}

/** Read a waveforms file (`tankcheck/waveforms@1`); every series must have one value per time point. */
export function readWaveforms(text: string, file: string): ReadResult<WaveformExcerpt[]> {
  const r = readJson<{ corners: WaveformExcerpt[] }>(text, file, waveformsFile, (w, out) => {
    w.corners.forEach((c, i) => {
      for (const [k, s] of Object.entries(c.series)) {
        if (s.length !== c.t.length) out.push({ path: `corners[${i}].series.${k}`, message: `has ${s.length} values for ${c.t.length} time points` });
      }
    });
  });
  return r.ok ? { ok: true, value: r.value.corners } : r;
}

function readJson<T>(text: string, file: string, shape: Check, more: (v: T, out: ShapeProblem[]) => void): ReadResult<T> {
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch (e) {
    return { ok: false, problems: [syntaxProblem(text, file, e)] };
  }
  const out: ShapeProblem[] = [];
  shape(data, '', out);
  if (out.length === 0) more(data as T, out);
  if (out.length === 0) return { ok: true, value: data as T };
  const problems = out.slice(0, MAX_PROBLEMS).map((p) => problem(file, p.path, p.message === 'missing' ? 'missing' : 'type', p.message === 'missing' ? 'missing' : p.message));
  if (out.length > MAX_PROBLEMS) problems.push(problem(file, '', 'type', `${out.length - MAX_PROBLEMS} more problems not shown`));
  return { ok: false, problems };
}

function problem(file: string, path: string, code: Problem['code'], message: string, line = 0, column = 0): Problem {
  return { code, path, line, column, expected: '', received: '', message, file };
}

/** A JSON syntax error with its line and column (a truncated file ends "unexpected end"). */
function syntaxProblem(text: string, file: string, e: unknown): Problem {
  const raw = e instanceof Error ? e.message : String(e);
  const at = /at position (\d+)/.exec(raw);
  const offset = at ? Number(at[1]) : /end of JSON input/.test(raw) ? text.length : -1;
  const atEnd = offset >= text.trimEnd().length;
  const message = `not valid JSON: ${atEnd ? 'the file ends early (truncated?)' : raw.replace(/\s*in JSON at position \d+.*$/, '')}`;
  if (offset < 0) return problem(file, '', 'json', message);
  const before = text.slice(0, offset).split('\n');
  return problem(file, '', 'json', message, before.length, before[before.length - 1]!.length + 1);
}

const outcome = object<{ result: CornerResult; waveform?: WaveformExcerpt }>({ result: corner }, { waveform });

/** Problems (with JSON paths) of a stored corner outcome `{result, waveform?}`, e.g. a cache entry's; [] when sound. */
export function checkCornerOutcome(value: unknown): ShapeProblem[] {
  const out: ShapeProblem[] = [];
  outcome(value, '', out);
  return out;
}
