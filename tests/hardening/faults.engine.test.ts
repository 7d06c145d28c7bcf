// Simulator faults against system ngspice. Each fault must end as a failed corner with its reason
// while the study finishes, the other corner keeps its result, nothing is left running and the
// engine's temp folders are removed (checked after every test by faultKit). Faults are injected with
// wrapper executables around the real ngspice (support/wrappers.ts). The wasm engine's faults are in
// wasmFaults.engine.test.ts.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { KEEP, TARGET, expectKept, faultKit } from './support/faultKit.js';
import { killChildWrapper, killSelfWrapper, lengthenWrapper, noConvergenceWrapper, notNgspice, rawDamageWrapper, type RawDamage } from './support/wrappers.js';
import { alive } from './support/procs.js';

const { dir, loadsDesign, twoCorners, run } = faultKit('faults');

describe('killed ngspice', () => {
  it('ngspice killed with SIGKILL mid-run (by its parent wrapper): failed corner with the exit status, the other corner kept, exit 3', async () => {
    const r = await run([twoCorners('kill-child.yaml'), '--engine', 'ngspice', '--ngspice-path', killChildWrapper(TARGET), '--jobs', '1']);
    expect(r.code, r.stderr).toBe(3);
    expect(r.results.incomplete).toBeUndefined();
    expectKept(r.corners[KEEP]);
    expect(r.corners[TARGET].status).toBe('failed');
    expect(r.corners[TARGET].failure).toMatchObject({ kind: 'engine' });
    expect(r.corners[TARGET].failure!.message).toMatch(/^ngspice exited with code 137/);
  });

  it('the process tankcheck started dies by SIGKILL and leaves its ngspice child behind: failed corner, the orphan is killed at once', async () => {
    const pidFile = join(dir, 'orphan.pid');
    const r = await run([twoCorners('kill-self.yaml'), '--engine', 'ngspice', '--ngspice-path', killSelfWrapper(TARGET, pidFile), '--jobs', '1']);
    expect(r.code, r.stderr).toBe(3);
    expectKept(r.corners[KEEP]);
    expect(r.corners[TARGET].failure).toMatchObject({ kind: 'engine' });
    expect(r.corners[TARGET].failure!.message).toMatch(/^ngspice killed by SIGKILL/);
    const orphan = Number(readFileSync(pidFile, 'utf8'));
    expect(alive(orphan)).toBe(false);
    // the orphan had minutes of work left and held the output pipes: the study did not wait for it
    expect(r.ms).toBeLessThan(60_000);
  });
});

describe('damaged raw files', () => {
  it('truncated, header-only, empty, garbage, NaN-filled, missing and time-reversed raw files: each its own failed corner with a reason; the undamaged corner is kept', async () => {
    const plan: Record<string, RawDamage> = {
      v390_10pct_f110k_nom: 'truncate-half', v390_20pct_f110k_nom: 'header-only', v390_30pct_f110k_nom: 'empty',
      v390_40pct_f110k_nom: 'garbage', v390_50pct_f110k_nom: 'nan-data', v390_60pct_f110k_nom: 'missing', v390_70pct_f110k_nom: 'time-reversed',
    };
    const file = loadsDesign('raw.yaml', ['10%', '20%', '30%', '40%', '50%', '60%', '70%', '100%']);
    const r = await run([file, '--engine', 'ngspice', '--ngspice-path', rawDamageWrapper(plan)]);
    expect(r.code, r.stderr).toBe(3);
    expectKept(r.corners['v390_100pct_f110k_nom']);
    const reasons: Record<string, string> = {};
    for (const [id, damage] of Object.entries(plan)) {
      expect(r.corners[id].status, `${damage}: ${JSON.stringify(r.corners[id])}`).toBe('failed');
      expect(r.corners[id].failure!.kind, damage).toBe('engine');
      reasons[damage] = r.corners[id].failure!.message;
    }
    expect(reasons['truncate-half']).toMatch(/^the simulator reported success but the raw file is truncated \(\d+ of \d+ rows\)$/);
    expect(reasons['header-only']).toMatch(/^the simulator reported success but the raw file is incomplete \(0 rows/);
    expect(reasons['empty']).toBe('the simulator reported success but the raw file is empty');
    expect(reasons['garbage']).toMatch(/^the simulator reported success but unreadable raw file: /);
    expect(reasons['nan-data']).toMatch(/^corrupt raw file: time has a value that is not finite \(NaN\) at row 0$/);
    expect(reasons['missing']).toBe('the simulator reported success but no raw file was written');
    expect(reasons['time-reversed']).toMatch(/^corrupt raw file: time decreases at row 1 .*rows out of order$/);
  });
});

describe('timeouts', () => {
  it('--timeout 3 with system ngspice on a deck that runs for minutes: a timeout failure after the limit; the other corner is kept', async () => {
    const r = await run([twoCorners('timeout-ngspice.yaml'), '--engine', 'ngspice', '--ngspice-path', lengthenWrapper(TARGET), '--timeout', '3', '--jobs', '1']);
    expect(r.code, r.stderr).toBe(3);
    expectKept(r.corners[KEEP]);
    expect(r.corners[TARGET].failure).toMatchObject({ kind: 'timeout', message: 'simulation did not finish within 3000 ms' });
    expect(r.ms).toBeLessThan(60_000); // the lengthened deck needs minutes
  });
});

describe('no convergence on any rung of the retry ladder', () => {
  it('every retry fails with "Timestep too small": a convergence failure naming every rung tried; the other corner is kept', async () => {
    const log = join(dir, 'attempts');
    mkdirSync(log);
    const r = await run([twoCorners('noconv.yaml'), '--engine', 'ngspice', '--ngspice-path', noConvergenceWrapper(TARGET, log), '--jobs', '1']);
    expect(r.code, r.stderr).toBe(3);
    expectKept(r.corners[KEEP]);
    const f = r.corners[TARGET].failure!;
    expect(f.kind).toBe('convergence');
    expect(f.message).toMatch(/Timestep too small; time = 1\.23e-06/);
    expect(f.message).toMatch(/after 4 attempts: as configured, rshunt=1e7, other integration method, zero-state start/);
    // the ladder really rewrote the deck on each rung (src/engine/retry.ts RETRY_LADDER)
    const decks = readdirSync(log).sort().map((n) => readFileSync(join(log, n), 'latin1'));
    expect(decks).toHaveLength(4);
    expect(decks[1]).toMatch(/^\.options rshunt=10000000$/m);
    expect(decks[0]).toMatch(/method=trap/); // accuracy "fast" is trapezoidal
    expect(decks[2]).toMatch(/method=gear/);
    expect(decks[3]).not.toMatch(/ ic=[-+]?[1-9]/);
  });
});

describe('engine unavailable (exit 4, nothing written)', () => {
  it('ngspice missing from PATH, a path that is not executable, and a binary that is not ngspice', async () => {
    const file = loadsDesign('unavail.yaml', ['100%']);
    const empty = join(dir, 'empty-bin');
    mkdirSync(empty);
    const noExec = join(dir, 'ngspice-noexec');
    writeFileSync(noExec, '#!/bin/sh\nexit 0\n');
    const savedPath = process.env['PATH'];
    process.env['PATH'] = empty;
    let missing;
    try {
      missing = await run([file, '--engine', 'ngspice']);
    } finally {
      process.env['PATH'] = savedPath;
    }
    expect(missing.code).toBe(4);
    expect(missing.stderr).toMatch(/engine ngspice unavailable: cannot run ngspice \(ngspice\): ENOENT/);
    const denied = await run([file, '--engine', 'ngspice', '--ngspice-path', noExec]);
    expect(denied.code).toBe(4);
    expect(denied.stderr).toMatch(/EACCES/);
    const other = await run([file, '--engine', 'ngspice', '--ngspice-path', notNgspice()]);
    expect(other.code).toBe(4);
    expect(other.stderr).toMatch(/printed no ngspice version/);
    for (const x of [missing, denied, other]) expect(x.results.corners).toEqual([]);
  });
});
