/** The bench columns and rows of results.csv (`run --measured`). Pure. */
import type { CornerResult } from '../results/types.js';

/** Columns appended to every results.csv row; empty on corners that are not bench points. */
export const MEASURED_CSV_HEADER = ['measured', 'gap_fha', 'gap_ideal', 'gap_sim', 'within', 'measured_line', 'note'];

/**
 * A text cell a spreadsheet must not run as a formula: a leading = + - @ tab or CR gets a quote
 * mark in front (the usual guard against CSV formula injection; the note is free text from a file).
 */
export function textCell(s: string | undefined): string {
  if (!s) return '';
  return /^[=+\-@\t\r]/.test(s) ? `'${s}` : s;
}

const n = (x: unknown): number | '' => (typeof x === 'number' && Number.isFinite(x) ? x : '');

/**
 * Bench cells of one row: the measured value of `metric` when the point has one, the gap
 * (measured - model) / |model| of FHA, the ideal model and the simulation, and the point's
 * within (yes/no; '' without a simulation), file line and note. Numbers stay numbers.
 */
export function measuredCells(c: CornerResult, metric: string): (number | string)[] {
  const m = c.measured;
  if (!m) return MEASURED_CSV_HEADER.map(() => '');
  const rec = m as unknown as Record<string, unknown>;
  const gap = (model: 'fha' | 'ideal' | 'sim') => n((m.errors[model] as Record<string, unknown> | null)?.[metric]);
  const value = metric === 'pin' ? m.pin ?? (m.iin !== undefined ? m.vin * m.iin : undefined) : rec[metric];
  return [n(value), gap('fha'), gap('ideal'), gap('sim'), m.within === null ? '' : m.within ? 'yes' : 'no', m.line, textCell(m.note)];
}

/**
 * Extra rows of a bench point for what only the bench has: input current and power, and the
 * efficiency Pout / Pin beside the simulation's (conduction losses of the modelled parts only),
 * as [metric, sim] pairs for the writer to place; only those the point holds.
 */
export function measuredExtraRows(c: CornerResult): { metric: string; sim: number | '' }[] {
  const m = c.measured;
  if (!m) return [];
  const rows: { metric: string; sim: number | '' }[] = [];
  if (m.iin !== undefined) rows.push({ metric: 'iin', sim: '' });
  if (m.pin !== undefined || m.iin !== undefined) rows.push({ metric: 'pin', sim: n(c.sim?.inputPower) });
  if (m.efficiency !== undefined || m.simEfficiency !== null) rows.push({ metric: 'efficiency', sim: n(m.simEfficiency) });
  return rows;
}
