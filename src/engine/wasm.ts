/**
 * Embedded wasm engine (eecircuit-engine, ngspice-45.2). Each Simulation blocks its thread for a whole run,
 * so it lives in a worker_threads Worker (wasm-worker.mjs); this side queues jobs onto at most `workers`
 * workers, one run per worker at a time, enforces the per-run timeout (terminate + respawn), replaces a
 * worker at once on a fatal ngspice error, and recycles a worker after `recycleAfter` runs.
 */
import { Worker } from 'node:worker_threads';
import { EngineUnavailableError } from './errors.js';
import { checkJob, timeLimitMs } from './job.js';
import { failedResult } from './result.js';
import type { SimEngine, SimFailure, SimJob, SimResult } from './types.js';
import { finishRun, type DoneMessage, type FatalMessage } from './wasm-protocol.js';

const failed = (job: SimJob, failure: SimFailure, t0: number) => failedResult(job.id, failure, performance.now() - t0);

/** Options of the wasm engine. */
export interface WasmEngineOptions {
  /** Number of worker threads (each ~0.4-0.5 GB RSS). @default 1 */
  workers?: number;
  /** Replace a worker after this many runs (each run leaks ~85 KB in ngspice). @default 300 */
  recycleAfter?: number;
  /** Limit for a worker to load and start the engine, in ms. @default 60000 */
  startTimeoutMs?: number;
}

/** The wasm engine, with counters for progress displays and tests. */
export interface WasmEngine extends SimEngine {
  /** Workers started so far (start, fatal-error/timeout replacement, recycling) and runs finished by workers. */
  stats(): { workersStarted: number; runs: number };
}

interface Pending {
  job: SimJob;
  resolve(result: SimResult): void;
  t0: number;
  timer?: NodeJS.Timeout;
  onAbort?: () => void;
}

interface Slot {
  worker: Worker;
  ready: Promise<string>;
  /** The start-up time limit; cleared once started or stopped, so that it never holds the process open. */
  startTimer?: NodeJS.Timeout;
  runs: number;
  current?: Pending;
  dead: boolean;
}

const WORKER_URL = new URL('./wasm-worker.mjs', import.meta.url);

/** Creates the wasm engine (name 'wasm'). Workers start lazily on the first run() or version(). */
export function createWasmEngine(options: WasmEngineOptions = {}): WasmEngine {
  const maxWorkers = Math.max(1, options.workers ?? 1);
  const recycleAfter = Math.max(1, options.recycleAfter ?? 300);
  const startTimeoutMs = options.startTimeoutMs ?? 60_000;
  const slots: Slot[] = [];
  const queue: Pending[] = [];
  let nextJobId = 0;
  let version: string | undefined;
  const counts = { workersStarted: 0, runs: 0 };

  function kill(slot: Slot): void {
    slot.dead = true;
    clearTimeout(slot.startTimer);
    const i = slots.indexOf(slot);
    if (i >= 0) slots.splice(i, 1);
    void slot.worker.terminate();
  }

  function settle(slot: Slot, result: SimResult): void {
    const p = slot.current;
    if (!p) return;
    slot.current = undefined;
    clearTimeout(p.timer);
    if (p.onAbort) p.job.signal?.removeEventListener('abort', p.onAbort);
    if (!slot.dead) slot.worker.unref();
    p.resolve(result);
    setImmediate(pump);
  }

  function spawn(): Slot {
    // stdout/stderr: true keeps engine output off our terminal. The streams are deliberately not read:
    // reading a worker's stdio refs the worker until it exits, so an idle engine would keep the process
    // alive without close(). The worker discards its own stdio writes, so nothing accumulates.
    const worker = new Worker(WORKER_URL, { stdout: true, stderr: true });
    counts.workersStarted += 1;
    let fail: (e: Error) => void = () => {};
    const slot = { worker, runs: 0, dead: false } as Slot;
    slot.ready = new Promise<string>((resolve, reject) => {
      fail = reject;
      // a worker stopped while starting (Ctrl-C in the first seconds) clears this in kill(): a pending
      // 60 s timer would otherwise keep the process alive long after the results were written
      slot.startTimer = setTimeout(() => reject(new Error(`wasm engine did not start within ${startTimeoutMs} ms`)), startTimeoutMs);
      worker.on('message', (m: { type: string; version?: string; message?: string }) => {
        if (m.type === 'ready') resolve(m.version ?? 'ngspice-unknown');
        else if (m.type === 'startError') reject(new Error(m.message));
        else return;
        clearTimeout(slot.startTimer);
      });
    });
    slot.ready.catch(() => kill(slot));
    worker.on('message', (m: DoneMessage | FatalMessage) => {
      const p = slot.current;
      if (!p || (m.type !== 'done' && m.type !== 'fatal')) return;
      if (m.type === 'fatal') {
        kill(slot);
        settle(slot, finishRun(p.job, { type: 'done', jobId: m.jobId, lines: m.lines, nonceOk: false, constants: false }, performance.now() - p.t0));
        return;
      }
      slot.runs += 1;
      counts.runs += 1;
      if (slot.runs >= recycleAfter) kill(slot);
      settle(slot, finishRun(p.job, m, performance.now() - p.t0));
    });
    const onGone = (err?: unknown) => {
      fail(new Error(`wasm worker stopped: ${String(err ?? 'exit')}`));
      if (slot.dead) return;
      kill(slot);
      const p = slot.current;
      if (p) settle(slot, failed(p.job, { kind: 'engine', message: `wasm worker stopped during the run: ${String(err ?? 'exit')}` }, p.t0));
    };
    worker.on('error', onGone);
    worker.on('exit', () => onGone());
    worker.unref();
    slots.push(slot);
    return slot;
  }

  async function start(slot: Slot, p: Pending): Promise<void> {
    slot.current = p;
    slot.worker.ref();
    try {
      await slot.ready;
    } catch (err) {
      settle(slot, failed(p.job, { kind: 'engine', message: `wasm engine unavailable: ${(err as Error).message}` }, p.t0));
      return;
    }
    if (slot.current !== p) return; // aborted while the worker was starting
    p.t0 = performance.now();
    const limit = timeLimitMs(p.job.timeoutMs);
    if (limit !== undefined) {
      p.timer = setTimeout(() => {
        kill(slot);
        settle(slot, failed(p.job, { kind: 'timeout', message: `simulation did not finish within ${p.job.timeoutMs} ms` }, p.t0));
      }, limit);
    }
    slot.worker.postMessage({ type: 'run', jobId: ++nextJobId, deck: p.job.deck, includes: p.job.includes ?? {} });
  }

  function pump(): void {
    while (queue.length > 0) {
      const slot = slots.find((s) => !s.current && !s.dead) ?? (slots.length < maxWorkers ? spawn() : undefined);
      if (!slot) return;
      void start(slot, queue.shift()!);
    }
  }

  function run(job: SimJob): Promise<SimResult> {
    const t0 = performance.now();
    const problem = checkJob(job);
    if (problem) return Promise.resolve(failed(job, { kind: 'input', message: problem }, t0));
    if (job.signal?.aborted) return Promise.resolve(failed(job, { kind: 'aborted', message: 'run cancelled' }, t0));
    return new Promise<SimResult>((resolve) => {
      const p: Pending = { job, resolve, t0 };
      p.onAbort = () => {
        const qi = queue.indexOf(p);
        if (qi >= 0) queue.splice(qi, 1);
        const slot = slots.find((s) => s.current === p);
        if (slot) kill(slot);
        if (slot) settle(slot, failed(job, { kind: 'aborted', message: 'run cancelled' }, p.t0));
        else resolve(failed(job, { kind: 'aborted', message: 'run cancelled' }, p.t0));
      };
      job.signal?.addEventListener('abort', p.onAbort, { once: true });
      queue.push(p);
      pump();
    });
  }

  return {
    name: 'wasm',
    async version() {
      if (version) return version;
      const slot = slots.find((s) => !s.dead) ?? spawn();
      slot.worker.ref(); // keep the process alive while waiting for the start
      try {
        version = await slot.ready;
      } catch (err) {
        throw new EngineUnavailableError(`wasm engine cannot start: ${(err as Error).message}`, 'wasm', { cause: err });
      } finally {
        if (!slot.current && !slot.dead) slot.worker.unref();
      }
      return version;
    },
    run,
    stats: () => ({ ...counts }),
    async close() {
      for (const p of queue.splice(0)) p.resolve(failed(p.job, { kind: 'aborted', message: 'engine closed' }, p.t0));
      for (const slot of [...slots]) {
        const p = slot.current;
        kill(slot);
        if (p) settle(slot, failed(p.job, { kind: 'aborted', message: 'engine closed' }, p.t0));
      }
    },
  };
}
