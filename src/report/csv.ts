import { stringify } from 'csv-stringify/sync';
import type { Results } from '../results/types.js';
import { MEASURED_CSV_HEADER, measuredCells, measuredExtraRows } from './measuredCsv.js';

const HEADER = ['corner', 'status', 'vin_V', 'load_ohm', 'metric', 'fha', 'sim', 'error', 'tolerance', 'verdict', 'unexpected_sign', 'reason', 'ideal', 'cause', ...MEASURED_CSV_HEADER];

/**
 * CSV text of rows (RFC 4180 quoting, CRLF line ends) by csv-stringify. Numbers stay numbers; a
 * non-finite one is an empty cell; booleans read true/false. A text cell that a spreadsheet would
 * run as a formula (starting with = + - @, tab or CR: the reason column is free text) gets a
 * leading single quote (escape_formulas; OWASP, "CSV Injection").
 */
export function renderCsv(rows: readonly (readonly unknown[])[]): string {
  const clean = rows.map((r) => r.map((v) => (typeof v === 'number' && !Number.isFinite(v) ? '' : v)));
  return stringify(clean, { record_delimiter: '\r\n', escape_formulas: true, cast: { boolean: (b) => String(b) } });
}

/**
 * One row per corner and metric (results.csv). FHA-only corners list the FHA values with empty
 * simulation columns; failed corners have a single 'failure' row carrying the reason. The last
 * two columns: the ideal time-domain model's value of the metric and, for a divergence, its cause.
 * Then the bench columns (`run --measured`, report/measuredCsv.ts): the measured value of the
 * metric and the gaps of FHA, ideal and sim, plus rows for input current, power and efficiency.
 */
export function renderResultsCsv(results: Results): string {
  const lines: unknown[][] = [HEADER];
  for (const c of results.corners) {
    const lead = [c.id, c.status, c.inputs.vin, c.inputs.load];
    if (c.comparison.length > 0) {
      for (const r of c.comparison) lines.push([...lead, r.metric, r.fha, r.sim, r.error, r.tolerance, r.verdict, r.unexpectedSign ? 'yes' : '', r.reason ?? '', r.ideal ?? '', r.cause ?? '', ...measuredCells(c, r.metric)]);
    } else {
      const ideal = (c.ideal ?? {}) as Record<string, unknown>;
      for (const [k, v] of Object.entries(c.fha)) {
        if (typeof v === 'number' || typeof v === 'boolean' || typeof v === 'string') lines.push([...lead, k, v, '', '', '', '', '', '', ideal[k] ?? '', '', ...measuredCells(c, k)]);
      }
    }
    for (const x of measuredExtraRows(c)) lines.push([...lead, x.metric, '', x.sim, '', '', '', '', '', '', '', ...measuredCells(c, x.metric)]);
    if (c.failure) lines.push([...lead, 'failure', '', '', '', '', 'failed', '', `${c.failure.kind}: ${c.failure.message}`, '', '', ...measuredCells(c, 'failure')]);
  }
  return renderCsv(lines);
}
