// Interruption of `tankcheck run` by SIGINT/SIGTERM, with the built CLI as a child process (README
// "Exit codes": 128 + the signal number, finished corners kept, results marked incomplete), plus --version/--help smoke
// tests of the binary. The engines' job folders go to a private TMPDIR so that leftovers and stray
// ngspice processes can be attributed to these tests.
import { spawn, type ChildProcess } from 'node:child_process';
import { chmodSync, existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { execa } from 'execa';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { baseTree, emit, setAt } from './support/designText.js';
import { ngspiceUnder, waitFor } from './support/procs.js';
import { REAL_NGSPICE } from './support/wrappers.js';
import { TOOL_VERSION } from '../../src/version.js';

const ROOT = new URL('../../', import.meta.url).pathname;
const BIN = join(ROOT, 'bin', 'tankcheck.js');
const dir = mkdtempSync(join(tmpdir(), 'tankcheck-signals-'));
const jobRoot = join(dir, 'jobs');
mkdirSync(jobRoot);

afterAll(() => rmSync(dir, { recursive: true, force: true }));
beforeAll(async () => {
  const b = await execa('npm', ['run', 'build'], { cwd: ROOT, reject: false, all: true });
  if (b.exitCode !== 0) {
    // tsc still emits JavaScript when a file being edited by someone else does not typecheck (no
    // noEmitOnError); `npm run typecheck` reports such errors. Anything else is a real build failure.
    if (!/error TS\d+/.test(b.all ?? '')) throw new Error(`npm run build failed:\n${b.all}`);
    console.warn(`npm run build reported type errors; testing the emitted JavaScript:\n${(b.all ?? '').split('\n').filter((l) => /error TS/.test(l)).join('\n')}`);
    await execa('node', ['scripts/copy-assets.mjs'], { cwd: ROOT });
  }
}, 300_000);

/** Eight corners (2 Vin x 4 loads) at 100 kHz, each a few runs of system ngspice. */
function gridDesign(name: string): string {
  const tree = baseTree();
  setAt(tree, 'operating', { vin: '[370 V, 390 V]', load: '[25%, 50%, 75%, 100%]', ratedPower: '240 W', frequency: '100 kHz' });
  setAt(tree, 'simulation.accuracy', 'normal');
  const file = join(dir, name);
  writeFileSync(file, emit(tree).text);
  return file;
}

interface Child {
  proc: ChildProcess;
  stderr: () => string;
  exit: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

function start(args: string[]): Child {
  const proc = spawn(process.execPath, [BIN, ...args], { cwd: dir, env: { ...process.env, TMPDIR: jobRoot }, stdio: ['ignore', 'pipe', 'pipe'] });
  let err = '';
  proc.stderr!.on('data', (d) => { err += String(d); });
  proc.stdout!.resume();
  const exit = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => proc.on('exit', (code, signal) => resolve({ code, signal })));
  return { proc, stderr: () => err, exit };
}

async function until(child: Child, re: RegExp, ms = 120_000): Promise<void> {
  const ok = await waitFor(() => re.test(child.stderr()), ms);
  if (!ok) throw new Error(`never saw ${re} on stderr:\n${child.stderr()}`);
}

/** Reads results.json every few ms while `running` is true; every read must be a whole JSON document. */
function pollJson(file: string): { stop: () => { reads: number; torn: number } } {
  let reads = 0;
  let torn = 0;
  const timer = setInterval(() => {
    if (!existsSync(file)) return;
    try {
      JSON.parse(readFileSync(file, 'utf8'));
      reads++;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'ENOENT') torn++;
    }
  }, 2);
  return { stop: () => { clearInterval(timer); return { reads, torn }; } };
}

describe('interrupting tankcheck run', () => {
  for (const [sig, engine] of [['SIGINT', 'ngspice'], ['SIGTERM', 'wasm']] as const) {
    it(`${sig} during run --engine ${engine}: exit 128 + signal number, finished corners kept, "incomplete": true at the top, nothing left running, and a rerun takes them from the cache`, async () => {
      const file = gridDesign(`grid-${engine}.yaml`);
      const out = join(dir, `out-${engine}`);
      const cache = join(dir, `cache-${engine}`);
      mkdirSync(out);
      writeFileSync(join(out, 'results.json'), '{"schema":"an older run"}\n');
      const poll = pollJson(join(out, 'results.json'));
      const args = ['run', file, '--engine', engine, '--out', out, '--cache-dir', cache, '--jobs', engine === 'wasm' ? '1' : '2'];
      const child = start(args);
      await until(child, /^\[1\/8\] \S+ \S+$/m);
      child.proc.kill(sig);
      const { code, signal } = await child.exit;
      const { torn } = poll.stop();
      expect(signal).toBeNull();
      expect(code, child.stderr()).toBe(sig === 'SIGTERM' ? 143 : 130); // 128 + the signal number
      expect(child.stderr()).toMatch(new RegExp(`tankcheck: ${sig}: stopping; finished corners are kept`));
      expect(torn).toBe(0);

      const text = readFileSync(join(out, 'results.json'), 'utf8');
      const res = JSON.parse(text);
      expect(Object.keys(res).slice(0, 2)).toEqual(['schema', 'incomplete']);
      expect(res.incomplete).toBe(true);
      const finished = res.corners.filter((c: { status: string }) => c.status !== 'predicted').map((c: { id: string }) => c.id);
      expect(finished.length).toBeGreaterThanOrEqual(1);
      expect(finished.length).toBeLessThan(8);
      for (const c of res.corners) if (c.status !== 'predicted') expect(c.sim).not.toBeNull();
      expect(readdirSync(out).filter((f) => f.includes('.tmp-'))).toEqual([]);
      // the pool and the simulator processes stopped; the engines' temp folders are gone
      expect(ngspiceUnder(jobRoot)).toEqual([]);
      expect(readdirSync(jobRoot)).toEqual([]);
      if (engine === 'wasm') return; // the cache path is the same for both engines; run it once

      const again = start(['run', file, '--engine', engine, '--out', join(dir, 'rerun'), '--cache-dir', cache, '--jobs', '2']);
      const second = await again.exit;
      expect([0, 1], again.stderr()).toContain(second.code);
      const res2 = JSON.parse(readFileSync(join(dir, 'rerun', 'results.json'), 'utf8'));
      expect(res2.incomplete).toBeUndefined();
      const log = JSON.parse(readFileSync(join(dir, 'rerun', 'run-log.json'), 'utf8'));
      expect([...log.fromCache].sort()).toEqual([...finished].sort());
    });
  }

  for (const [sig, want] of [['SIGINT', 130], ['SIGHUP', 129]] as const) {
    it(`${sig} while the embedded engine is still starting: exit ${want} at once, nothing simulated or written`, async () => {
      const file = gridDesign(`grid-start-${sig}.yaml`);
      const out = join(dir, `out-start-${sig}`);
      const child = start(['run', file, '--engine', 'wasm', '--out', out, '--no-cache', '--jobs', '1']);
      await until(child, /^starting the wasm engine$/m);
      const t0 = Date.now();
      child.proc.kill(sig);
      const { code } = await child.exit;
      // it took about 58 s: the worker was stopped, but its start-up time limit kept the process alive
      expect(Date.now() - t0).toBeLessThan(5000);
      expect(code, child.stderr()).toBe(want);
      expect(child.stderr()).toMatch(/interrupted while the wasm engine was starting/);
      expect(child.stderr()).not.toMatch(/simulating/);
      expect(existsSync(join(out, 'results.json'))).toBe(false);
    });
  }

  it('a second SIGINT stops at once, even while a simulator ignores SIGTERM; no ngspice and no temp folder is left', async () => {
    // a simulator that ignores SIGTERM and SIGINT (the first interrupt has to wait for the 2 s kill grace)
    // on a deck lengthened to minutes of work
    const stubborn = join(dir, 'stubborn-ngspice');
    writeFileSync(stubborn, `#!/bin/sh\ntrap '' TERM INT\ncase "$1" in -v) ;; *) sed -i 's/^\\.tran .*/.tran 1e-7 10 9.99 1e-7 uic/' deck.cir;; esac\nexec '${REAL_NGSPICE}' "$@"\n`);
    chmodSync(stubborn, 0o755);
    const tree = baseTree();
    const file = join(dir, 'one.yaml');
    writeFileSync(file, emit(tree).text);
    const out = join(dir, 'out-double');
    const child = start(['run', file, '--engine', 'ngspice', '--ngspice-path', stubborn, '--out', out, '--no-cache']);
    await until(child, /^simulating 1 corners$/m);
    expect(await waitFor(() => ngspiceUnder(jobRoot).length > 0, 30_000)).toBe(true);
    child.proc.kill('SIGINT');
    await until(child, /SIGINT: stopping/);
    const t0 = Date.now();
    child.proc.kill('SIGINT');
    const { code } = await child.exit;
    expect(Date.now() - t0).toBeLessThan(1500); // well inside the 2 s grace the first interrupt waits for
    expect(code).toBe(130);
    expect(child.stderr()).toMatch(/SIGINT again: stopping at once/);
    expect(existsSync(join(out, 'results.json'))).toBe(false);
    expect(await waitFor(() => ngspiceUnder(jobRoot).length === 0, 2000)).toBe(true);
    expect(readdirSync(jobRoot)).toEqual([]);
  });
});

describe('the built binary', () => {
  it('--version prints the version and exits 0; --help and run --help list the commands and options', async () => {
    const v = await execa(process.execPath, [BIN, '--version'], { reject: false });
    expect(v.exitCode).toBe(0);
    expect(v.stdout.trim()).toBe(TOOL_VERSION);
    const h = await execa(process.execPath, [BIN, '--help'], { reject: false });
    expect(h.exitCode).toBe(0);
    for (const cmd of ['init', 'fha', 'decks', 'run', 'report', 'schema']) expect(h.stdout).toMatch(new RegExp(`^\\s+${cmd}\\b`, 'm'));
    const rh = await execa(process.execPath, [BIN, 'run', '--help'], { reject: false });
    expect(rh.exitCode).toBe(0);
    for (const opt of ['--engine', '--ngspice-path', '--jobs', '--out', '--only', '--timeout', '--keep-decks', '--no-cache']) expect(rh.stdout).toContain(opt);
    const bad = await execa(process.execPath, [BIN, '--no-such-option'], { reject: false });
    expect(bad.exitCode).toBe(2);
  });
});
