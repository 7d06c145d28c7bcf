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
  it('is well-formed, one test case per corner and one per corner and limit, failures and errors counted', () => {
    const xml = renderJunit(results);
    expect(XMLValidator.validate(xml)).toBe(true);
    const doc = new XMLParser({ ignoreAttributes: false }).parse(xml);
    const suite = doc.testsuites.testsuite;
    // 4 corners, each with its region check (capacitive operation is always a limit)
    expect(suite.testcase).toHaveLength(8);
    expect(suite.testcase.filter((t: any) => t['@_classname'].endsWith('.limits')).map((t: any) => t['@_name'].split(': ')[1])).toEqual(['region', 'region', 'region', 'region']);
    expect(suite['@_failures']).toBe('1'); // the divergence has no cause: unexplained
    expect(suite['@_errors']).toBe('1');
  });

  it('names the failing limit; an explained divergence passes unless failOn is divergence', () => {
    const design = makeDesign({ limits: { zvs: 'ignore', crVoltage: 450, tankCurrentRms: 10, derating: 0.9 } });
    const r = predictStudy(design);
    const c = r.corners[0]!;
    c.status = 'outside-limits';
    c.sim = { ...(c.fha as never as Record<string, number>), region: 'inductive', crVoltagePeak: 420, crVoltageMin: -20, settled: true } as never;
    const cr = c.checks!.find((k) => k.limit === 'crVoltage')!;
    expect(cr.fha.within).toBe(true); // FHA Cr peak of the worked example, 392.7 V, is below 450 V x 0.9 = 405 V
    cr.sim = { value: 420, within: false };
    cr.flip = true;
    c.checks!.find((k) => k.limit === 'region')!.sim = { value: 'inductive', within: true };
    c.checks!.find((k) => k.limit === 'tankCurrentRms')!.sim = { value: 6, within: true };
    c.divergences = [{ metric: 'magnetizingCurrentPeak', fha: 1, sim: 1.2, error: 0.2, tolerance: 0.1, reason: 'triangle', cause: 'approximation' } as never];
    const parse = (xml: string) => {
      expect(XMLValidator.validate(xml)).toBe(true);
      return new XMLParser({ ignoreAttributes: false }).parse(xml).testsuites.testsuite;
    };
    const suite = parse(renderJunit(r));
    const failures = suite.testcase.filter((t: any) => t.failure);
    expect(failures.map((t: any) => t['@_name'])).toEqual([`${c.id}: crVoltage`]);
    expect(failures[0].failure['@_message']).toBe('crVoltage outside (FHA said within)');
    expect(failures[0].failure['#text']).toMatch(/^crVoltage: sim 420 V OUTSIDE, ideal [\d.]+ V (within|OUTSIDE), FHA 392.7 V within; bound <= 405 V \(FHA missed this\)$/);
    expect(suite['@_failures']).toBe('1');
    const corner = suite.testcase.find((t: any) => t['@_name'] === c.id);
    expect(corner['system-out']).toMatch(/magnetizingCurrentPeak.*\[approximation\]/);
    const strict = parse(renderJunit(r, { failOn: 'divergence' }));
    expect(strict.testcase.find((t: any) => t['@_name'] === c.id).failure['@_message']).toBe('1 metric(s) beyond tolerance');
    expect(strict['@_failures']).toBe('2');
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
