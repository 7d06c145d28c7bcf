import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { renderResultsCsv } from './csv.js';
import { renderJunit } from './junit.js';
import { renderResultsJson } from './json.js';
import { renderFhaTable, renderRunTable } from './table.js';
import { predictStudy } from '../run/study.js';
import { makeDesign } from '../../tests/support/design.js';
import type { Results } from '../results/types.js';

const results: Results = predictStudy(makeDesign({ name: 'a "quoted", <odd> & name', operating: { vin: [380, 400], load: [{ kind: 'ohm', value: 4 }], ratedPower: 676, frequency: [90e3, 120e3], corners: [] } }));
results.corners[0]!.status = 'diverged';
results.corners[0]!.divergences = [{ metric: 'gain', fha: 1, sim: 1.1, error: 0.1, tolerance: 0.03, reason: 'below resonance, "quoted", a,b <tag> & more\nsecond line' }];
results.corners[1]!.status = 'failed';
results.corners[1]!.failure = { kind: 'convergence', message: 'Timestep too small; time = 1e-5', detail: 'x < y & z' };
results.summary = { ...results.summary, diverged: 1, failed: 1, predicted: 2 };

describe('CSV (RFC 4180, parsed back with the csv-parse reference library)', () => {
  it('round-trips quotes, commas and newlines; one header and one row per corner and metric', () => {
    const rows: string[][] = parse(renderResultsCsv(results), { relax_column_count: false });
    expect(rows[0]![0]).toBe('corner');
    expect(rows.slice(1).every((r) => r.length === rows[0]!.length)).toBe(true);
    const fail = rows.find((r) => r[4] === 'failure')!;
    expect(fail[11]).toBe('convergence: Timestep too small; time = 1e-5');
    expect(new Set(rows.slice(1).map((r) => r[0])).size).toBe(4);
  });
});

describe('JUnit XML (validated with the fast-xml-parser reference library)', () => {
  it('is well-formed, one test case per corner, failures and errors counted', () => {
    const xml = renderJunit(results);
    expect(XMLValidator.validate(xml)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false }).parse(xml);
    const suite = doc.testsuites.testsuite;
    expect(suite.testcase).toHaveLength(4);
    expect(suite['@_failures']).toBe('1');
    expect(suite['@_errors']).toBe('1');
  });
});

describe('JSON and tables', () => {
  it('JSON is deterministic and writes non-finite numbers as null', () => {
    const r = structuredClone(results);
    r.corners[0]!.fha.peakGain = Infinity;
    const a = renderResultsJson(r);
    expect(a).toBe(renderResultsJson(structuredClone(r)));
    expect(JSON.parse(a).corners[0].fha.peakGain).toBeNull();
  });
  it('the FHA table has one row per corner and no NaN', () => {
    const t = renderFhaTable(results);
    expect(t.split('\n').filter((l) => /^v\d/.test(l))).toHaveLength(4);
    expect(t).not.toMatch(/NaN/);
  });
  it('the run table marks flagged cells with * without colour and lists failures', () => {
    const r = structuredClone(results);
    r.corners[0]!.comparison = [{ metric: 'gain', fha: 1, sim: 1.1, error: 0.1, tolerance: 0.03, verdict: 'diverged', reason: 'x' }];
    const t = renderRunTable(r);
    expect(t).toMatch(/\+10\.0%\*/);
    expect(t).not.toMatch(/\u001b\[/);
    expect(t).toMatch(/Failed corners:[\s\S]*convergence: Timestep too small/);
    expect(renderRunTable(r, { color: true })).toMatch(/\u001b\[1;7m/);
  });
});
