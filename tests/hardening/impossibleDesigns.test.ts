// Designs that are well-formed but physically impossible or unreachable: a clear message naming the
// key, and never a NaN (or Infinity/undefined) in anything printed or written.
import { mkdtempSync, readFileSync, rmSync, writeFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { baseTree, emit, setAt, type Tree } from './support/designText.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-phys-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
const NOT_A_NUMBER = /NaN|Infinity|undefined/;
/** The heavy suite (tests/heavy) multiplies the case count and draws a fresh seed. */
const SCALE = Number(process.env['TANKCHECK_FUZZ_SCALE'] ?? '1');

function designFile(name: string, edits: Record<string, string | Tree | undefined>): string {
  const tree = baseTree();
  for (const [path, v] of Object.entries(edits)) setAt(tree, path, v);
  const file = join(dir, name);
  writeFileSync(file, emit(tree).text);
  return file;
}

/** Every number in a JSON text is finite (JSON cannot hold NaN, but a writer could print "NaN" as text). */
function expectCleanJson(text: string): void {
  expect(text).not.toMatch(NOT_A_NUMBER);
  JSON.parse(text);
}

describe('physically impossible designs', () => {
  it('Lm smaller than Lr: exit 2 naming tank.lm with both values and Ln', async () => {
    const file = designFile('lm-lt-lr.yaml', { 'tank.lm': '40 uH' });
    const r = await runCli(['fha', file, '--json', join(dir, 'x.json')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(new RegExp(`${file}:\\d+:\\d+: tank\\.lm: physically implausible: Lm \\(40 uH\\) must exceed Lr \\(60 uH\\).*Ln = Lm/Lr = 0\\.667`));
    expect(existsSync(join(dir, 'x.json'))).toBe(false);
  });

  it('Lm below Lr only in an explicit corner: exit 2 at that corner', async () => {
    const file = designFile('corner-lm.yaml', { operating: { vin: '[390 V]', load: '[100%]', ratedPower: '240 W', frequency: '110 kHz', corners: '[{vin: 390 V, load: 50%, lm: 50 uH}]' } });
    const r = await runCli(['fha', file]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/operating\.corners\[0\]\.lm: physically implausible in this corner: Lm \(50 uH\) must exceed Lr \(60 uH\)/);
  });

  it('dead time longer than half a period: exit 2 naming switches.deadTime, the period half and the frequency it came from', async () => {
    // 110 kHz: T/2 = 4.545 us
    const file = designFile('deadtime.yaml', { 'switches.deadTime': '5 us' });
    const r = await runCli(['run', file, '--engine', 'ngspice', '--out', join(dir, 'dt-out')]);
    expect(r.code).toBe(2);
    expect(r.stderr).toMatch(/switches\.deadTime: dead time 5 us is not shorter than half the switching period at 110 kHz \(4\.545 us, from operating\.frequency\)/);
    expect(existsSync(join(dir, 'dt-out'))).toBe(false);
  });

  it('a target gain FHA cannot reach: the corner is "unreachable", a warning names turnsRatio, and no NaN is printed or written', async () => {
    // M = n (Vo + VF) / (Vin/2) = 8 * 24.5 / 50 = 3.92, while an Ln = 5 tank at Q = Zr/Rac = 37.8/127 = 0.30
    // peaks near 1.3 (docs/method.md#gain, #solving; Rac = 8 n^2 V_rect / (pi^2 Io))
    const file = designFile('unreachable.yaml', { 'operating.vin': '[100 V]', 'operating.frequency': 'regulate' });
    const json = join(dir, 'unreach.json');
    const csv = join(dir, 'unreach.csv');
    const r = await runCli(['fha', file, '--json', json, '--csv', csv]);
    expect(r.code).toBe(0);
    expect(r.stderr).toMatch(/warning: .*tank\.turnsRatio: regulating to 24 V .* needs a tank gain M = n \(Vo \+ drops\) \/ Vin_eff = 3\.92/);
    const row = r.stdout.split('\n').find((l) => l.startsWith('v100_100pct_reg_nom'))!;
    expect(row).toMatch(/\s-\s/); // no frequency: a dash, not a number
    expect(r.stdout).not.toMatch(NOT_A_NUMBER);
    const res = JSON.parse(readFileSync(json, 'utf8'));
    expect(res.corners[0].status).toBe('unreachable');
    expect(res.corners[0].fha.fs).toBeNull();
    expectCleanJson(readFileSync(json, 'utf8'));
    expect(readFileSync(csv, 'utf8')).not.toMatch(NOT_A_NUMBER);
  });
});

/** A valid design drawn from the whole accepted range (plausibility windows of src/design/fields.ts). */
const logUniform = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((x) => 10 ** x);
const extremeDesign = fc.record({
  lr: logUniform(1e-8, 1e-2),
  ln: logUniform(1.01, 100),
  cr: logUniform(1e-12, 1e-3),
  n: logUniform(1e-2, 100),
  fsRatio: fc.option(logUniform(0.05, 9), { nil: undefined }),
  vin: logUniform(1e-2, 1e5),
  vout: logUniform(1e-2, 1e5),
  load: fc.constantFrom('0.001%', '1%', '50%', '100%', '1000%', '1 uohm', '1 Gohm', '1 nA', '100 kA', '1 uW', '100 MW'),
  vf: fc.constantFrom('0 V', '0.5 V', '10 V'),
  inverter: fc.constantFrom('half-bridge', 'full-bridge'),
  rectifier: fc.constantFrom('center-tapped', 'full-bridge'),
  integrated: fc.boolean(),
});

describe('extreme but valid designs through tankcheck fha', () => {
  it(`${200 * SCALE} generated designs across the accepted ranges: exit 0, no NaN/Infinity/undefined in the table, JSON or CSV`, async () => {
    const json = join(dir, 'x.json');
    const csv = join(dir, 'x.csv');
    const file = join(dir, 'extreme.yaml');
    let accepted = 0;
    await fc.assert(fc.asyncProperty(extremeDesign, async (d) => {
      const fr = 1 / (2 * Math.PI * Math.sqrt(d.lr * d.cr));
      const fsHz = Math.min(Math.max(fr * (d.fsRatio ?? 1), 10), 5e8); // inside the accepted 1 Hz .. 1 GHz
      const fs = d.fsRatio === undefined ? 'regulate' : `${fsHz.toPrecision(6)} Hz`;
      const tree = baseTree();
      setAt(tree, 'tank', { lr: `${d.lr.toPrecision(6)} H`, cr: `${d.cr.toPrecision(6)} F`, lm: `${(d.lr * d.ln).toPrecision(6)} H`, turnsRatio: d.n.toPrecision(6), integrated: String(d.integrated) });
      setAt(tree, 'topology', { inverter: d.inverter, rectifier: d.rectifier });
      // 2 % of the period, inside the accepted 1 ps .. 100 us
      setAt(tree, 'switches.deadTime', `${Math.min(Math.max(0.02 / fsHz, 1e-11), 5e-5).toPrecision(3)} s`);
      setAt(tree, 'rectifier.forwardVoltage', d.vf);
      setAt(tree, 'output.voltage', `${d.vout.toPrecision(6)} V`);
      setAt(tree, 'operating', { vin: `[${d.vin.toPrecision(6)} V]`, load: `[${d.load}]`, ratedPower: '240 W', frequency: fs });
      writeFileSync(file, emit(tree).text);
      const r = await runCli(['fha', file, '--json', json, '--csv', csv]);
      // the deadTime and windows are chosen so the file is always valid; a refusal here is a test bug
      expect(r.code, r.stderr).toBe(0);
      accepted++;
      expect(r.stdout).not.toMatch(NOT_A_NUMBER);
      expect(r.stderr).not.toMatch(NOT_A_NUMBER);
      expectCleanJson(readFileSync(json, 'utf8'));
      expect(readFileSync(csv, 'utf8')).not.toMatch(NOT_A_NUMBER);
    }), { numRuns: 200 * SCALE, seed: SCALE > 1 ? undefined : 23, endOnFailure: true });
    expect(accepted).toBe(200 * SCALE);
  });
});
