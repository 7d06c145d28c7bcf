/**
 * System ngspice adapter: one `ngspice -n -b -r out.raw deck.cir` process per job in a fresh temp dir.
 * `-n` and HOME = the temp dir keep any `.spiceinit` (cwd or home) from being read; stdin is ignored and
 * argv is an array (no shell). The raw file is parsed even after a failure or a kill, to keep partial rows.
 * Each process leads its own process group, which is killed as soon as the process exits (and when
 * tankcheck exits), so nothing it started (a wrapper script's ngspice, say) outlives the job.
 */
import { rmSync } from 'node:fs';
import { mkdir, mkdtemp, readFile, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { execa } from 'execa';
import { EngineUnavailableError } from './errors.js';
import { checkJob, timeLimitMs } from './job.js';
import { assembleResult, failedResult } from './result.js';
import type { SimEngine, SimJob, SimResult } from './types.js';

/** Options of the system-ngspice engine. */
export interface NgspiceEngineOptions {
  /** Executable name or path. @default 'ngspice' */
  path?: string;
  /** Keep each job's temp dir (deck.cir, includes, out.raw) and report it as `workDir`. @default false */
  keepDir?: boolean;
  /** Parent of the per-job temp dirs. @default os.tmpdir() */
  tmpRoot?: string;
  /** After a timeout or cancel, SIGKILL follows SIGTERM after this many ms. @default 2000 */
  killGraceMs?: number;
}

/** Environment for ngspice: HOME is the job dir; only what is needed to find and load the binary passes through. */
function childEnv(dir: string): Record<string, string> {
  const env: Record<string, string> = { HOME: dir, LC_ALL: 'C' };
  for (const key of ['PATH', 'LD_LIBRARY_PATH', 'SYSTEMROOT', 'TMPDIR']) {
    const v = process.env[key];
    if (v !== undefined) env[key] = v;
  }
  return env;
}

/** POSIX only: a job leads its own process group, so the whole group can be signalled. */
const GROUPS = process.platform !== 'win32';
/**
 * Jobs still running: process group -> work dir to remove (undefined with keepDir). If tankcheck exits
 * first (a forced second Ctrl-C, say), the exit hook kills the groups and removes the dirs.
 */
const running = new Map<number, string | undefined>();
let exitHook = false;

/** SIGKILL to every process of the job's group; a group that is already gone is fine. */
function killGroup(pid: number): void {
  try {
    process.kill(-pid, 'SIGKILL');
  } catch {
    // ESRCH: nothing left
  }
}

function track(pid: number, dir: string | undefined): void {
  running.set(pid, dir);
  if (exitHook) return;
  exitHook = true;
  process.on('exit', () => {
    for (const [g, d] of running) {
      killGroup(g);
      if (d) rmSync(d, { recursive: true, force: true });
    }
  });
}

/** Time limit of the `ngspice -v` probe, ms. */
export const PROBE_TIMEOUT_MS = 15_000;

/**
 * Reads the version from the first `ngspice-…` token of `ngspice -v` (e.g. 'ngspice-39'). The probe
 * leads its own process group, which is killed when it exits or times out: a wrapper script that hangs
 * (or leaves a child holding its output open) cannot keep tankcheck waiting past the limit.
 * @param timeoutMs limit for the probe. @default PROBE_TIMEOUT_MS
 * @throws EngineUnavailableError when the binary cannot be run or does not identify as ngspice.
 */
export async function probeNgspice(path = 'ngspice', timeoutMs = PROBE_TIMEOUT_MS): Promise<string> {
  const child = execa(path, ['-v'], { reject: false, stdin: 'ignore', timeout: timeoutMs, forceKillAfterDelay: 500, extendEnv: false, env: childEnv(tmpdir()), detached: GROUPS });
  const pid = child.pid;
  let timer: NodeJS.Timeout | undefined;
  if (GROUPS && pid !== undefined) {
    track(pid, undefined);
    child.on('exit', () => killGroup(pid));
    timer = setTimeout(() => killGroup(pid), timeoutMs);
  }
  let r;
  try {
    r = await child;
  } finally {
    clearTimeout(timer);
    if (GROUPS && pid !== undefined) {
      killGroup(pid);
      running.delete(pid);
    }
  }
  if (r.timedOut) throw new EngineUnavailableError(`${path} -v did not finish within ${timeoutMs} ms`, 'ngspice');
  if (r.code || r.exitCode === undefined) {
    throw new EngineUnavailableError(`cannot run ngspice (${path}): ${r.code ?? r.shortMessage ?? 'failed'}`, 'ngspice');
  }
  const m = /ngspice-[0-9][\w.+-]*/.exec(`${r.stdout}\n${r.stderr}`);
  if (!m) throw new EngineUnavailableError(`${path} -v printed no ngspice version`, 'ngspice');
  return m[0];
}

function failedEarly(job: SimJob, kind: 'input' | 'aborted', message: string, t0: number): SimResult {
  return failedResult(job.id, { kind, message }, performance.now() - t0);
}

async function writeJobFiles(dir: string, job: SimJob): Promise<void> {
  await writeFile(join(dir, 'deck.cir'), job.deck, 'latin1');
  for (const [path, text] of Object.entries(job.includes ?? {})) {
    await mkdir(dirname(join(dir, path)), { recursive: true });
    await writeFile(join(dir, path), text, 'latin1');
  }
}

async function runJob(opts: Required<Omit<NgspiceEngineOptions, 'tmpRoot'>> & { tmpRoot: string }, job: SimJob): Promise<SimResult> {
  const t0 = performance.now();
  const problem = checkJob(job);
  if (problem) return failedEarly(job, 'input', problem, t0);
  if (job.signal?.aborted) return failedEarly(job, 'aborted', 'run cancelled', t0);
  const dir = await mkdtemp(join(opts.tmpRoot, 'tankcheck-'));
  try {
    await writeJobFiles(dir, job);
    const child = execa(opts.path, ['-n', '-b', '-r', 'out.raw', 'deck.cir'], {
      cwd: dir,
      env: childEnv(dir),
      extendEnv: false,
      stdin: 'ignore',
      reject: false,
      timeout: timeLimitMs(job.timeoutMs) ?? 0, // 0 = no limit
      forceKillAfterDelay: opts.killGraceMs,
      cancelSignal: job.signal,
      maxBuffer: 64 * 1024 * 1024,
      // own process group (and no terminal signals: an interrupt reaches ngspice through cancelSignal)
      detached: GROUPS,
    });
    const pid = child.pid;
    if (GROUPS && pid !== undefined) {
      track(pid, opts.keepDir ? undefined : dir);
      // whatever the process left running would hold its output pipes open and keep this run waiting
      child.on('exit', () => killGroup(pid));
    }
    let r;
    try {
      r = await child;
    } finally {
      if (GROUPS && pid !== undefined) {
        killGroup(pid);
        running.delete(pid);
      }
    }
    const raw = await readFile(join(dir, 'out.raw')).catch(() => undefined);
    const stdoutMessages = r.stdout.split('\n').filter((l) => /^\s*(error|warning)\b/i.test(l));
    const lines = [...r.stderr.split('\n'), ...stdoutMessages];
    if (r.code) lines.push(`Error: cannot start ${opts.path}: ${r.code}`);
    const result = assembleResult({
      id: job.id,
      raw,
      outcome: {
        lines,
        completed: r.exitCode === 0,
        exitCode: r.exitCode ?? null,
        signal: r.signal ?? null,
        timedOut: r.timedOut,
        canceled: r.isCanceled,
        timeoutMs: job.timeoutMs,
      },
      wallMs: performance.now() - t0,
    });
    if (opts.keepDir) result.workDir = dir;
    return result;
  } finally {
    if (!opts.keepDir) await rm(dir, { recursive: true, force: true });
  }
}

/** Creates the system-ngspice engine (name 'ngspice'). Jobs may run concurrently: one process each. */
export function createNgspiceEngine(options: NgspiceEngineOptions = {}): SimEngine {
  const opts = {
    path: options.path ?? 'ngspice',
    keepDir: options.keepDir ?? false,
    tmpRoot: options.tmpRoot ?? tmpdir(),
    killGraceMs: options.killGraceMs ?? 2000,
  };
  let version: Promise<string> | undefined;
  return {
    name: 'ngspice',
    version() {
      version ??= probeNgspice(opts.path).catch((err: unknown) => {
        version = undefined; // let a later call retry (e.g. after installing ngspice)
        throw err;
      });
      return version;
    },
    run: (job) => runJob(opts, job),
    close: async () => {},
  };
}
