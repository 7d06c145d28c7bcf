// Decks written by `tankcheck decks -o DIR` and run by hand with `ngspice -b`: their .meas results,
// the Cr measurement against tankcheck's own measurement of the same run, and an edited fs.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execa } from 'execa';
import { runCli } from '../support/cli.js';
import { DEMO_FILE } from '../support/demo.js';
import { loadDesignOrThrow } from '../../src/design/index.js';
import { expandCorners } from '../../src/corners/expand.js';
import { createNgspiceEngine, createWasmEngine } from '../../src/engine/index.js';
import { toWaveforms } from '../../src/netlist/waveforms.js';
import { HAND_CR_NODE } from '../../src/netlist/hand.js';
import { measure } from '../../src/measure/index.js';
import { HAND_CYCLES, HAND_WINDOW } from '../../src/cli/decks.js';
import type { Design } from '../../src/design/types.js';
import type { Corner } from '../../src/corners/types.js';

const dir = mkdtempSync(join(tmpdir(), 'tankcheck-hand-'));
const FS = 100e3;
let design: Design;
let corner: Corner;
let deck: string;

/** `ngspice -b deck.cir` as a user runs it (own directory and HOME, so no .spiceinit is read); the .meas results by name. */
async function runByHand(text: string, name: string): Promise<{ meas: Record<string, number>; out: string }> {
  writeFileSync(join(dir, name), text);
  const r = await execa('ngspice', ['-b', name], { cwd: dir, env: { HOME: dir }, reject: false, stdin: 'ignore' });
  expect(r.exitCode, r.stderr).toBe(0);
  const meas: Record<string, number> = {};
  for (const m of r.stdout.matchAll(/^(\w+)\s+=\s+(\S+)/gm)) meas[m[1]!] = Number(m[2]);
  return { meas, out: `${r.stdout}\n${r.stderr}` };
}

beforeAll(async () => {
  // One fixed-frequency corner of the demo, just below its resonance (fr = 100.3 kHz).
  const text = readFileSync(DEMO_FILE, 'utf8').replace(/vin: \[.*\]/, 'vin: [390 V]').replace(/load: \[.*\]/, 'load: [100%]')
    .replace('frequency: regulate', 'frequency: [100 kHz]');
  const file = join(dir, 'hand.yaml');
  writeFileSync(file, text);
  const r = await runCli(['decks', file, '-o', join(dir, 'out')]);
  expect(r.code, r.stderr).toBe(0);
  const names = readdirSync(join(dir, 'out')).filter((f) => f.endsWith('.cir'));
  expect(names).toHaveLength(1);
  deck = readFileSync(join(dir, 'out', names[0]!), 'utf8');
  design = (await loadDesignOrThrow(file)).design;
  corner = expandCorners(design)[0]!;
});

const native = createNgspiceEngine();
const wasm = createWasmEngine();
afterAll(async () => {
  await native.close();
  await wasm.close();
});

describe('a written deck run by hand with ngspice -b', () => {
  it('prints every measurement, the Cr voltage extremes included, and no measurement error', async () => {
    const { meas, out } = await runByHand(deck, 'as-written.cir');
    expect(out).not.toMatch(/no such vector|failed!|error/i);
    for (const k of ['vout_avg', 'tank_rms', 'tank_max', 'vcr_max', 'vcr_min', 'gate_period', 'tank_period']) expect(Number.isFinite(meas[k]), k).toBe(true);
  });

  it('its Cr, output and tank measurements agree within 0.1 % with tankcheck\'s own measurement of the same run', async () => {
    const { meas } = await runByHand(deck, 'same-run.cir');
    // The same text through the system-ngspice engine (raw file, same ngspice, same time steps) and measure().
    const r = await native.run({ id: corner.id, deck, timeoutMs: 60_000 });
    expect(r.ok, r.failure?.message).toBe(true);
    const w = toWaveforms(design, corner, FS, r.vectors);
    const tstop = HAND_CYCLES / FS;
    const m = measure(w, { tStart: tstop - HAND_WINDOW / FS, cycles: HAND_WINDOW }, { zvsThreshold: design.simulation.zvsThreshold });
    const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);
    expect(rel(meas['vcr_max']!, m.crVoltagePeak)).toBeLessThan(1e-3);
    expect(rel(meas['vcr_min']!, m.crVoltageMin)).toBeLessThan(1e-3);
    expect(rel(meas['vout_avg']!, m.vout)).toBeLessThan(1e-3);
    expect(rel(meas['tank_rms']!, m.tankCurrentRms)).toBeLessThan(1e-3);
    // The copy node is the Cr voltage itself: v(t2) - v(t3) at every saved point.
    const copy = r.vectors[`v(${HAND_CR_NODE})`]!;
    let worst = 0;
    for (let k = 0; k < copy.length; k++) worst = Math.max(worst, Math.abs(copy[k]! - w.crVoltage[k]!));
    expect(worst).toBeLessThan(1e-6 * m.crVoltagePeak);
    expect(m.crVoltagePeak).toBeGreaterThan(100); // a real swing, not an empty vector
  });

  it('also runs in the embedded wasm ngspice without a parameter or measurement error', async () => {
    const r = await wasm.run({ id: corner.id, deck, timeoutMs: 120_000 });
    expect(r.ok, r.failure?.message).toBe(true);
    expect(r.diagnostics.map((d) => d.text).join('\n')).not.toMatch(/no such vector|failed!|meas|param/i);
    expect(r.vectors[`v(${HAND_CR_NODE})`]?.length).toBeGreaterThan(100);
  });

  it('after editing only the fs line the measured gate and tank periods follow the new fs', async () => {
    const line = /^\.param fs=(\S+)$/m.exec(deck)!;
    expect(line[1]).toBe('100k');
    const base = (await runByHand(deck, 'fs-100k.cir')).meas;
    const edited = (await runByHand(deck.replace(line[0], '.param fs=125k'), 'fs-125k.cir')).meas;
    // The gate source is exact: its period is 1/fs up to the crossing interpolation.
    expect(Math.abs(base['gate_period']! * 100e3 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(edited['gate_period']! * 125e3 - 1)).toBeLessThan(1e-6);
    // The tank current is driven at fs: its zero crossings repeat at 1/fs within 1 % (not yet fully settled after the edit).
    expect(Math.abs(base['tank_period']! * 100e3 - 1)).toBeLessThan(0.01);
    expect(Math.abs(edited['tank_period']! * 125e3 - 1)).toBeLessThan(0.01);
    // Above resonance the LLC gain falls with frequency (FHA gain curve, common practice): the output drops.
    expect(edited['vout_avg']!).toBeLessThan(0.97 * base['vout_avg']!);
  });
});
