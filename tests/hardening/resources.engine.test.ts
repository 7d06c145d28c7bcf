// Resources: the engines' temp folders are removed (kept only with --keep-decks), the number of
// parallel jobs is bounded by free memory and cores whatever --jobs asks, and no simulator process
// outlives a run.
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { freemem, tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { runCli } from '../support/cli.js';
import { defaultJobs, maxJobs, WASM_TWO_WORKER_MIN_FREE } from '../../src/engine/pool.js';
import { baseTree, emit, setAt } from './support/designText.js';
import { childrenOf, ngspiceUnder } from './support/procs.js';
import { writeFileSync } from 'node:fs';

const GB = 1024 ** 3;
const dir = mkdtempSync(join(tmpdir(), 'tankcheck-res-'));
const jobRoot = join(dir, 'jobs');
const savedTmp = process.env['TMPDIR'];
beforeAll(() => {
  mkdirSync(jobRoot);
  process.env['TMPDIR'] = jobRoot;
});
afterAll(() => {
  if (savedTmp === undefined) delete process.env['TMPDIR'];
  else process.env['TMPDIR'] = savedTmp;
  rmSync(dir, { recursive: true, force: true });
});

function design(name: string): string {
  const tree = baseTree();
  setAt(tree, 'operating.load', '[50%, 100%]');
  const file = join(dir, name);
  writeFileSync(file, emit(tree).text);
  return file;
}

describe('job count', () => {
  it('wasm workers are bounded by free memory (0.5 GB each), native jobs by 4 per core; never below 1', () => {
    // 380-490 MB RSS per wasm instance, measured during development (bench/RESULTS.md section 6 measures it again)
    expect(maxJobs('wasm', { cpus: 64, freeBytes: 8 * GB })).toBe(16);
    expect(maxJobs('wasm', { cpus: 64, freeBytes: 1.4 * GB })).toBe(2);
    expect(maxJobs('wasm', { cpus: 64, freeBytes: 0.3 * GB })).toBe(1);
    expect(maxJobs('ngspice', { cpus: 2, freeBytes: 64 * GB })).toBe(8);
    expect(maxJobs('ngspice', { cpus: 1, freeBytes: 0 })).toBe(4);
    // the defaults stay within the bound
    for (const free of [0, 0.6 * GB, WASM_TWO_WORKER_MIN_FREE, 32 * GB]) {
      for (const cpus of [1, 2, 16]) {
        for (const e of ['wasm', 'ngspice'] as const) expect(defaultJobs(e, { cpus, freeBytes: free })).toBeLessThanOrEqual(maxJobs(e, { cpus, freeBytes: free }));
      }
    }
  });

  it('--jobs 1000 with the wasm engine is cut to what free memory holds, with a warning', async () => {
    const limit = Math.max(1, Math.floor(freemem() / (0.5 * GB)));
    // --only matching nothing stops the run (exit 2) after the options are checked, before any engine starts
    const r = await runCli(['run', design('jobs.yaml'), '--engine', 'wasm', '--jobs', '1000', '--only', 'no-such-corner', '--out', join(dir, 'jobs-out'), '--no-cache']);
    expect(r.code, r.stderr).toBe(2);
    const used = Number(/--jobs 1000 is more than this machine can hold for the wasm engine .*; using (\d+)/.exec(r.stderr)?.[1]);
    expect(used).toBeGreaterThanOrEqual(1);
    expect(Math.abs(used - limit)).toBeLessThanOrEqual(1); // free memory moves a little between the two reads
  });
});

describe('temp folders and processes of system ngspice', () => {
  it('every job folder is removed after the run; no ngspice is left, among our children or anywhere under our temp root', async () => {
    const r = await runCli(['run', design('clean.yaml'), '--engine', 'ngspice', '--out', join(dir, 'clean-out'), '--no-cache']);
    expect([0, 1]).toContain(r.code);
    expect(readdirSync(jobRoot)).toEqual([]);
    expect(ngspiceUnder(jobRoot)).toEqual([]);
    expect(childrenOf(process.pid).filter((p) => p.comm === 'ngspice')).toEqual([]);
  });

  it('--keep-decks keeps one folder per simulator run, each with its deck and raw file', async () => {
    const out = join(dir, 'keep-out');
    const r = await runCli(['run', design('keep.yaml'), '--engine', 'ngspice', '--out', out, '--no-cache', '--keep-decks']);
    expect([0, 1]).toContain(r.code);
    const res = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
    const runs = res.corners.reduce((n: number, c: { sim: { runs: number } }) => n + c.sim.runs, 0);
    const kept = readdirSync(jobRoot);
    expect(kept.length).toBe(runs);
    for (const d of kept) expect(readdirSync(join(jobRoot, d)).sort()).toEqual(['deck.cir', 'out.raw']);
  });
});
