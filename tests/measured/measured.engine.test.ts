// run --measured end to end on the system engine: a bench file made from the tool's own simulation
// compares back within the settle tolerance, and the same file 3 % low fails at compare.measured 2 %.
import { describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { XMLParser } from 'fast-xml-parser';
import type { Results } from '../../src/results/types.js';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-measured-'));
const demoText = readFileSync(DEMO_FILE, 'utf8');

/** The demo at two fixed frequencies around resonance, 390 V, 50 % load. */
function design(file: string, measuredTolerance?: string): string {
  let text = demoText.replace(/vin: \[.*\]/, 'vin: [390 V]').replace(/load: \[.*\]/, 'load: [50%]')
    .replace(/frequency: regulate/, 'frequency: [92 kHz, 106 kHz]');
  if (measuredTolerance) text = text.replace(/compare:\n/, `compare:\n  measured: ${measuredTolerance}\n`);
  const path = join(dir, file);
  writeFileSync(path, text);
  return path;
}

const read = (out: string): Results => JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
const common = ['--engine', 'ngspice', '--cache-dir', join(dir, 'cache')];

describe('run --measured (system ngspice)', () => {
  it('a bench file written from the simulation compares back; 3 % low fails at compare.measured 2 %', async () => {
    const file = design('demo2.yaml');
    const first = await runCli(['run', file, ...common, '--out', join(dir, 'sim')]);
    expect(first.code).not.toBe(2);
    const sim = read(join(dir, 'sim')).corners;
    expect(sim).toHaveLength(2);
    const csv = (scale: number) => ['vin,load,fs,vout', ...sim.map((c) =>
      `${c.inputs.vin} V,${c.inputs.load.toPrecision(15)} ohm,${c.sim!.fs.toPrecision(15)} Hz,${(c.sim!.vout * scale).toPrecision(15)} V`)].join('\n') + '\n';
    writeFileSync(join(dir, 'same.csv'), csv(1));
    writeFileSync(join(dir, 'low.csv'), csv(0.97));

    const same = await runCli(['run', file, ...common, '--measured', join(dir, 'same.csv'), '--only', 'm*', '--out', join(dir, 'same'), '--no-cache']);
    expect(same.code).not.toBe(2);
    const back = read(join(dir, 'same'));
    expect(back.corners.map((c) => c.source)).toEqual(['measured', 'measured']);
    for (const c of back.corners) {
      // the same circuit simulated again: agreement within the settle tolerance (0.1 %)
      expect(Math.abs(c.measured!.errors.sim!.vout!)).toBeLessThan(0.001);
      expect(c.measured!.within).toBe(true);
      expect(c.measured!.errors.fha!.vout).toBeDefined();
    }
    expect(back.measured).toMatchObject({ points: 2, missed: 0, tolerance: 0.05 });
    expect(same.stdout).toMatch(/Measured points/);

    const strict = design('demo2-strict.yaml', '2%');
    const low = await runCli(['run', strict, ...common, '--measured', join(dir, 'low.csv'), '--only', 'm*', '--out', join(dir, 'low')]);
    expect(low.code).toBe(1);
    const lowResults = read(join(dir, 'low'));
    for (const c of lowResults.corners) {
      expect(c.measured!.errors.sim!.vout!).toBeCloseTo(-0.03, 3);
      expect(c.measured!.within).toBe(false);
    }
    expect(lowResults.measured).toMatchObject({ points: 2, missed: 2, tolerance: 0.02 });
    // JUnit read with a reference parser (fast-xml-parser): one failing case per missed point
    const junit = new XMLParser({ ignoreAttributes: false }).parse(readFileSync(join(dir, 'low', 'junit.xml'), 'utf8'));
    const cases = [junit.testsuites.testsuite.testcase].flat() as { '@_name': string; failure?: { '@_message': string } }[];
    const bench = cases.filter((c) => c['@_name'].includes('vs bench'));
    expect(bench).toHaveLength(2);
    expect(bench.every((c) => /more than 2.0 %/.test(c.failure?.['@_message'] ?? ''))).toBe(true);
  });

  it('a bad measured file exits 2 naming file, line, column and column name, before simulating', async () => {
    const bad = join(dir, 'bad.csv');
    writeFileSync(bad, 'vin,load,fs,vout\n390 V,50%,95 kHz,24 V\n390 V,50%,95 uH,24 V\n');
    const r = await runCli(['run', design('demo3.yaml'), ...common, '--measured', bad, '--out', join(dir, 'bad-out')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toContain(`${bad}:3:11: fs: "95 uH" has the unit of inductance`);
    expect(() => readFileSync(join(dir, 'bad-out', 'results.json'))).toThrow();
  });
});
