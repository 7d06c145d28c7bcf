import type { CornerResult, Results } from '../results/types.js';
import { worstCheck } from '../limits/evaluate.js';
import { describeCheck, showUsage } from '../limits/describe.js';
import { num as fmtNum } from '../units/display.js';

export interface TableOptions {
  /** ANSI emphasis for flagged cells and statuses (only on a TTY). @default false */
  color?: boolean;
}

const pad = (s: string, w: number) => (s.length >= w ? s : s + ' '.repeat(w - s.length));
const lpad = (s: string, w: number) => (s.length >= w ? s : ' '.repeat(w - s.length) + s);

const num = (x: number | null | undefined, digits = 4): string => fmtNum(x, digits, 1, '-');

function yn(b: boolean | null | undefined): string {
  return b === null || b === undefined ? '-' : b ? 'yes' : 'NO';
}

/** The corner table of `tankcheck fha`: one row per corner with the key FHA figures. */
export function renderFhaTable(results: Results): string {
  const head = ['corner', 'Vin V', 'load', 'fs kHz', 'fn', 'Q', 'gain M', 'Vout V', 'region', 'ZVS', 'ZCS', 'Ir,rms A', 'Vcr,pk V', 'Id,pk A'];
  const rows = results.corners.map((c) => {
    const f = c.fha;
    return [c.id, num(c.inputs.vin), c.inputs.loadLabel, num(f.fs === null ? null : f.fs / 1e3), num(f.fn, 3), num(f.q, 3), num(f.gain),
      num(f.vout), f.region ?? 'n/a', yn(f.zvs), yn(f.zcs), num(f.tankCurrentRms, 3), num(f.crVoltagePeak, 4), num(f.diodeCurrentPeak, 3)];
  });
  const out = grid(head, rows);
  const notes = results.corners.flatMap((c) => c.fha.warnings.map((w) => `  ${c.id}: ${w}`));
  return notes.length ? `${out}\nNotes:\n${notes.join('\n')}\n` : out;
}

export function grid(head: string[], rows: string[][]): string {
  const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i]!.length)));
  const line = (r: string[]) => r.map((x, i) => (i === 0 ? pad(x, widths[i]!) : lpad(x, widths[i]!))).join('  ').trimEnd();
  return [line(head), line(widths.map((w) => '-'.repeat(w))), ...rows.map(line)].join('\n') + '\n';
}

type Cell = { text: string; flagged: boolean };

function triple(c: CornerResult, metric: string, scale = 1, digits = 4, withIdeal = false): Cell[] {
  const r = c.comparison.find((x) => x.metric === metric);
  const ideal = withIdeal ? [{ text: idealText(c, metric, scale, digits), flagged: false }] : [];
  if (!r) return [{ text: '-', flagged: false }, ...ideal, { text: '-', flagged: false }, { text: '', flagged: false }];
  const f = typeof r.fha === 'number' ? num(r.fha / scale, digits) : '-';
  const s = typeof r.sim === 'number' ? num(r.sim / scale, digits) : '-';
  const flagged = r.verdict === 'diverged';
  const e = r.error === null ? (flagged ? '!' : '') : `${r.error >= 0 ? '+' : ''}${(r.error * 100).toFixed(1)}%`;
  return [{ text: f, flagged: false }, ...ideal, { text: s, flagged: false }, { text: `${e}${flagged ? '*' : ''}${r.unexpectedSign ? '?' : ''}`, flagged }];
}

/** The ideal model's value of a metric: from the corner's `ideal` (also on FHA-only corners), '-' without one. */
function idealText(c: CornerResult, metric: string, scale: number, digits: number): string {
  const v = c.ideal ? (c.ideal as unknown as Record<string, unknown>)[metric] : undefined;
  return typeof v === 'number' ? num(v / scale, digits) : '-';
}

/** Divergences by cause, e.g. '5a 1c': approximation (FHA's own error), circuit, unexplained. */
function causeCounts(c: CornerResult): Cell {
  const n = { a: 0, c: 0, u: 0 };
  for (const d of c.divergences) n[d.cause === 'approximation' ? 'a' : d.cause === 'circuit' ? 'c' : 'u']++;
  const text = (['a', 'c', 'u'] as const).filter((k) => n[k] > 0).map((k) => `${n[k]}${k}`).join(' ');
  return { text: text || '-', flagged: n.u > 0 };
}

function blank(n = 3): Cell[] {
  return Array.from({ length: n }, () => ({ text: '', flagged: false }));
}

function status(c: CornerResult, metric: 'zvs' | 'zcs'): Cell {
  const r = c.comparison.find((x) => x.metric === metric);
  const show = (v: unknown) => (v === true ? 'y' : v === false ? 'n' : '-');
  const flagged = r?.verdict === 'diverged';
  return { text: r ? `${show(r.fha)}/${show(r.sim)}${flagged ? '*' : ''}` : '-', flagged };
}

/**
 * Side-by-side FHA | ideal | sim | error table of `tankcheck run` (the ideal time-domain model's
 * column for the compared frequency or output and the tank RMS). A '*' marks a value beyond
 * tolerance and '?' a gain, output or frequency where the simulation contradicts the ideal model,
 * so the table reads the same without colour. 'causes' counts the divergences by cause: a =
 * approximation (FHA's own error), c = circuit, u = unexplained.
 */
export function renderRunTable(results: Results, opts: TableOptions = {}): string {
  const em = (cell: Cell) => (opts.color && cell.flagged ? `\u001b[1;7m${cell.text}\u001b[0m` : cell.text);
  // Regulated corners are compared on the frequency that meets the target, fixed ones on Vout.
  const showFs = results.corners.some((c) => c.inputs.fs === null);
  const showVout = results.corners.some((c) => c.inputs.fs !== null);
  const head1 = ['', '', ...(showFs ? ['fs kHz', '', '', ''] : []), ...(showVout ? ['Vout V', '', '', ''] : []), 'gain M', '', '', 'Ir,rms A', '', '', '', 'ZVS', 'ZCS', '', '', 'worst limit', '', ''];
  const head2 = ['corner', 'status', ...(showFs ? ['FHA', 'ideal', 'sim', 'err'] : []), ...(showVout ? ['FHA', 'ideal', 'sim', 'err'] : []), 'FHA', 'sim', 'err', 'FHA', 'ideal', 'sim', 'err', 'F/S', 'F/S', 'causes', 'mode', 'limit', 'use', 'flip'];
  const rows: Cell[][] = results.corners.map((c) => [
    { text: c.id, flagged: false },
    { text: c.status, flagged: c.status === 'failed' || c.status === 'diverged' || c.status === 'not-settled' || c.status === 'outside-limits' },
    ...(showFs ? (c.inputs.fs === null ? triple(c, 'fs', 1e3, 4, true) : blank(4)) : []),
    ...(showVout ? (c.inputs.fs !== null ? triple(c, 'vout', 1, 4, true) : blank(4)) : []),
    ...triple(c, 'gain', 1, 4), ...triple(c, 'tankCurrentRms', 1, 3, true),
    status(c, 'zvs'), status(c, 'zcs'), causeCounts(c), { text: c.sim?.mode ?? '-', flagged: false },
    ...worstCells(c),
  ]);
  const textual = new Set([0, 1, head2.length - 4, head2.length - 3, head2.length - 1]);
  const widths = head2.map((h, i) => Math.max(h.length, head1[i]!.length, ...rows.map((r) => r[i]!.text.length)));
  const fmt = (cells: Cell[]) => cells.map((x, i) => {
    const w = widths[i]!;
    const padded = textual.has(i) ? pad(x.text, w) : lpad(x.text, w);
    return x.flagged ? padded.replace(x.text, em(x)) : padded;
  }).join('  ').trimEnd();
  const plain = (r: string[]) => fmt(r.map((text) => ({ text, flagged: false })));
  const lines = [plain(head1), plain(head2), plain(widths.map((w) => '-'.repeat(w))), ...rows.map(fmt)];
  const failures = results.corners.filter((c) => c.failure && c.status !== 'unreachable').map((c) => `  ${c.id}: ${c.failure!.kind}: ${c.failure!.message}`);
  if (failures.length) lines.push('', 'Failed corners:', ...failures);
  const missed = results.corners.flatMap((c) => (c.checks ?? []).filter((k) => k.flip && k.fha.within).map((k) => `  ${c.id} ${describeCheck(k)}`));
  if (missed.length) lines.push('', 'FHA missed this (FHA within, simulation outside):', ...missed);
  const unreachable = results.corners.filter((c) => c.failure && c.status === 'unreachable').map((c) => `  ${c.id}: ${c.failure!.message}`);
  if (unreachable.length) lines.push('', 'Unreachable targets:', ...unreachable);
  return `${lines.join('\n')}\n`;
}

/**
 * Worst limit of a corner: the check using most of its bound (value / bound, or bound / value for
 * a lower limit) in simulation, in FHA when not simulated; '*' when outside, 'F' when any check flips.
 */
function worstCells(c: CornerResult): Cell[] {
  const w = worstCheck(c.checks);
  const flips = (c.checks ?? []).some((k) => k.flip);
  if (!w) return [{ text: '-', flagged: false }, { text: '', flagged: false }, { text: flips ? 'F' : '', flagged: flips }];
  const side = w.source === 'sim' ? w.check.sim : w.check.fha;
  const outside = side?.within === false;
  const use = w.check.kind === 'state' ? (outside ? 'NO' : '') : showUsage(w.check, side);
  return [{ text: `${w.check.limit}${w.source === 'fha' ? ' (FHA)' : ''}`, flagged: false }, { text: `${use}${outside ? '*' : ''}`, flagged: outside },
    { text: flips ? 'F' : '', flagged: flips }];
}

/** One-paragraph summary printed after the table. */
export function renderSummary(results: Results): string {
  const s = results.summary;
  const parts = [`${s.corners} corners: ${s.ok} ok, ${s.outsideLimits ?? 0} outside limits, ${s.diverged} diverged, ${s.failed} failed, ${s.notSettled} not settled`];
  if (s.flips) parts.push(`${s.flips} limit check(s) where FHA and simulation disagree`);
  if (s.unreachable) parts.push(`${s.unreachable} unreachable`);
  if (s.predicted) parts.push(`${s.predicted} not simulated`);
  if (s.screened) parts.push(`${s.screened} screened only (FHA and ideal model)`);
  const head = `${parts.join(', ')}. Engine ${results.engine?.name ?? 'none'} ${results.engine?.version ?? ''}; ${s.simulations} operating points simulated.`;
  const worst = s.worst.slice(0, 5).map((w) => `  ${w.id} ${w.metric}${w.error !== null ? ` ${(w.error * 100).toFixed(1)} % (tolerance ${((w.tolerance ?? 0) * 100).toFixed(0)} %)` : ' status differs'}`);
  const inc = results.incomplete ? '\nINCOMPLETE: the run was interrupted; unfinished corners carry FHA values only.' : '';
  return `${head}${worst.length ? `\nLargest divergences:\n${worst.join('\n')}` : ''}${inc}\n`;
}
