/**
 * Shared set-up of the fault tests: a private TMPDIR for the engines' job folders (so leftovers and
 * stray ngspice processes can be attributed), checked after every test; two-corner designs; and a
 * runner that returns the results by corner id.
 */
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, afterEach, beforeAll, expect } from 'vitest';
import { runCli } from '../../support/cli.js';
import { baseTree, emit, setAt } from './designText.js';
import { childrenOf, ngspiceUnder, waitFor } from './procs.js';
import { removeWrappers } from './wrappers.js';

/** The corner every fault targets, and the healthy one that must keep its result. */
export const TARGET = 'v390_50pct_f110k_nom';
export const KEEP = 'v390_100pct_f110k_nom';

export interface Corner { id: string; status: string; sim: unknown; failure?: { kind: string; message: string; detail?: string } }

export interface RunOutcome {
  code: number;
  stderr: string;
  ms: number;
  corners: Record<string, Corner>;
  results: { incomplete?: boolean; corners: Corner[] };
}

/** Registers the hooks in the calling test file; returns its helpers. */
export function faultKit(prefix: string) {
  const dir = mkdtempSync(join(tmpdir(), `tankcheck-${prefix}-`));
  const jobRoot = join(dir, 'jobs');
  const savedTmp = process.env['TMPDIR'];
  beforeAll(() => {
    mkdirSync(jobRoot, { recursive: true });
    process.env['TMPDIR'] = jobRoot;
  });
  afterEach(async () => {
    // after every fault: no ngspice left running from our jobs or among our children, no job folder left
    expect(await waitFor(() => ngspiceUnder(jobRoot).length === 0, 3000), JSON.stringify(ngspiceUnder(jobRoot))).toBe(true);
    expect(childrenOf(process.pid).filter((p) => p.comm === 'ngspice')).toEqual([]);
    expect(readdirSync(jobRoot)).toEqual([]);
  });
  afterAll(() => {
    if (savedTmp === undefined) delete process.env['TMPDIR'];
    else process.env['TMPDIR'] = savedTmp;
    rmSync(dir, { recursive: true, force: true });
    removeWrappers();
  });

  /** Fast corners of the demo tank at 110 kHz, one per load. */
  function loadsDesign(name: string, loads: string[]): string {
    const tree = baseTree();
    setAt(tree, 'operating.load', `[${loads.join(', ')}]`);
    const file = join(dir, name);
    writeFileSync(file, emit(tree).text);
    return file;
  }

  /**
   * Two fixed-frequency corners of the demo tank, KEEP first (a fraction of a second per run). The
   * faults make TARGET's deck simulate 10 s of circuit time (minutes of work), so a kill after 0.3 s
   * or a timeout of a few seconds always lands in the middle of a run, however fast or loaded the
   * machine. (A design whose own deck runs long, with fs far below fr, is no good here: the time-domain
   * start model then takes seconds of synchronous work per corner before any simulator runs.)
   */
  const twoCorners = (name: string): string => loadsDesign(name, ['100%', '50%']);

  /** `tankcheck run <args> --out <fresh> --no-cache` in-process. */
  async function run(args: string[]): Promise<RunOutcome> {
    const out = join(dir, `out-${Math.random().toString(36).slice(2)}`);
    const t0 = performance.now();
    const r = await runCli(['run', ...args, '--out', out, '--no-cache']);
    const ms = performance.now() - t0;
    const results = existsSync(join(out, 'results.json')) ? JSON.parse(readFileSync(join(out, 'results.json'), 'utf8')) : { corners: [] };
    return { code: r.code, stderr: r.stderr, ms, results, corners: Object.fromEntries(results.corners.map((c: Corner) => [c.id, c])) };
  }

  return { dir, jobRoot, loadsDesign, twoCorners, run };
}

/** The healthy corner kept its simulation. */
export function expectKept(c: Corner | undefined): void {
  expect(c?.status).toMatch(/^(ok|diverged|not-settled)$/);
  expect(c?.sim).not.toBeNull();
}
