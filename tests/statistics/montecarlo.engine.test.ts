// Monte Carlo end to end on the system engine (fast): determinism across --jobs, screening,
// confirmation within the budget, statistics computed from the corners alone.
import { afterAll, describe, expect, it } from 'vitest';
import { createNgspiceEngine } from '../../src/engine/index.js';
import { runStudy } from '../../src/run/study.js';
import { renderResultsJson } from '../../src/report/json.js';
import { renderResultsCsv } from '../../src/report/csv.js';
import { renderSamplesCsv } from '../../src/report/samplesCsv.js';
import { parse as parseCsv } from 'csv-parse/sync';
import { renderHtmlReport } from '../../src/report/html/index.js';
import { monteCarloStatistics } from '../../src/statistics/index.js';
import { makeDesign } from '../support/design.js';
import type { Design } from '../../src/design/types.js';

const engine = createNgspiceEngine();
afterAll(() => engine.close());

// An invented 240 W, 24 V converter at two input voltages, full load, regulated.
const design = (seed: number): Design => makeDesign({
  tank: { lr: 60e-6, cr: 42e-9, lm: 310e-6, turnsRatio: 8 },
  switches: { deadTime: 200e-9, coss: 150e-12, rdsOn: 0.12 },
  rectifier: { forwardVoltage: 0.5, resistance: 0.005 },
  output: { voltage: 24, capacitance: 470e-6, esr: 0.02 },
  operating: { vin: [370, 390], load: [{ kind: 'percent', value: 1 }], ratedPower: 240, frequency: 'regulate', corners: [] },
  tolerances: { lr: 0.05, cr: 0.05, lm: 0.1, corners: 'random', samples: 6, seed, distribution: 'uniform' },
  simulation: { confirm: 3 },
  limits: { frequency: { min: 60e3, max: 150e3 }, zvs: 'required', crVoltage: 330, tankCurrentRms: 3, derating: 1 },
});

describe('Monte Carlo run (system ngspice)', () => {
  let one: string;
  let two: string;
  it('gives byte-identical results.json with --jobs 1 and --jobs 2', async () => {
    const a = await runStudy(design(42), { engine, jobs: 1 });
    const b = await runStudy(design(42), { engine, jobs: 2 });
    one = renderResultsJson(a.results);
    two = renderResultsJson(b.results);
    expect(two).toBe(one);

    const r = a.results;
    expect(r.corners).toHaveLength(12);
    expect(r.corners.filter((c) => c.sim !== null)).toHaveLength(3);
    expect(r.corners.filter((c) => c.status === 'screened')).toHaveLength(9);
    for (const c of r.corners) expect(c.ideal).not.toBeUndefined();
    const s = r.statistics!;
    expect(s).toMatchObject({ samples: 6, seed: 42, distribution: 'uniform', confirmed: { count: 3 } });
    // the worst screened Cr peak (about 90 % of the 330 V bound, the limit closest to its bound)
    // was among the confirmed corners: worst first, limits round-robin
    expect(r.corners.find((c) => c.id === s.worst.find((w) => w.limit === 'crVoltage')!.id)!.sim).not.toBeNull();
    for (const c of r.corners) expect(c.checks!.map((x) => x.limit)).toContain('crVoltage');
    expect(s.yield.fha.value).toBe(1); // comfortable limits for this design
    expect(s.yield.ideal.value).toBe(1);
    expect(s.confirmed.outside).toBe(0);
    // the statistics depend on the corners alone: recomputing them gives the same object
    expect(monteCarloStatistics(r.corners, { seed: 42, distribution: 'uniform' })).toEqual(s);
    // the screening's accuracy, measured: the ideal model's regulated fs within 2 % of the simulation's
    const fs = s.confirmed.agreement.find((x) => x.metric === 'fs')!;
    expect(fs.count).toBe(3);
    expect(fs.worst).toBeLessThan(0.02);
    // results.csv covers every corner; samples.csv has one row per sample x operating point (parsed by csv-parse)
    const csv = renderResultsCsv(r);
    for (const c of r.corners) expect(csv).toContain(c.id);
    const rows = parseCsv(renderSamplesCsv(r), { columns: true }) as Record<string, string>[];
    expect(rows.map((x) => x['corner'])).toEqual(r.corners.map((c) => c.id));
    expect(rows.filter((x) => x['status'] !== 'screened')).toHaveLength(3);
    expect(Number(rows[4]!['cr_F'])).toBe(r.corners[4]!.inputs.cr);
    expect(rows.every((x) => x['within_fha'] === 'yes')).toBe(true);
    const html = renderHtmlReport({ results: r, waveforms: a.waveforms, design: design(42) });
    expect(html).toContain('<section id="statistics">');
  }, 240_000);

  it('a different seed gives different samples', async () => {
    const c = (await runStudy(design(43), { engine, jobs: 1 })).results;
    const a = JSON.parse(one) as { corners: { inputs: { cr: number } }[] };
    expect(c.corners.map((x) => x.inputs.cr)).not.toEqual(a.corners.map((x) => x.inputs.cr));
  }, 240_000);
});
