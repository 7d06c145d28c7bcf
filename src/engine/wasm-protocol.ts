/**
 * Messages between wasm.ts and wasm-worker.mjs, and the pure step that turns a worker's report into a
 * SimResult. Protocol:
 *   worker -> {type:'ready', version} once its Simulation has started, or {type:'startError', message}
 *   parent -> {type:'run', jobId, deck, includes}
 *   worker -> DoneMessage after the run, or FatalMessage as soon as ngspice reports a fatal error
 *             (the instance then hangs; the parent terminates the worker)
 */
import { assembleResult } from './result.js';
import type { SimJob, SimResult } from './types.js';

export interface DoneMessage {
  type: 'done';
  jobId: number;
  /** The engine's getError() lines for this run (plus the worker's own 'Error: ...' lines). */
  lines: string[];
  /** The result header carried this run's title nonce (false: stale or placeholder data). */
  nonceOk: boolean;
  /** ngspice returned its 'Constant values' plot (1 point, no variables): the deck did not parse. */
  constants: boolean;
  /** out.raw bytes, transferred; only when nonceOk && !constants. */
  raw?: Uint8Array;
}

export interface FatalMessage {
  type: 'fatal';
  jobId: number;
  lines: string[];
}

const ABORTED = /simulation\(s\) aborted|simulation interrupted|timestep too small|fatal error/i;

/** Builds the SimResult of a finished worker run; the raw bytes are parsed by the shared parser. */
export function finishRun(job: SimJob, msg: DoneMessage, wallMs: number): SimResult {
  const usable = msg.nonceOk && !msg.constants;
  const lines = [...msg.lines];
  if (msg.constants) lines.push('Error: circuit not parsed (the engine returned only its constant-values plot)');
  else if (!msg.nonceOk) lines.push("Error: the engine's result lacks this run's title nonce (stale or placeholder data); discarded");
  return assembleResult({
    id: job.id,
    raw: usable ? msg.raw : undefined,
    outcome: { lines, completed: usable && !lines.some((l) => ABORTED.test(l)), timeoutMs: job.timeoutMs },
    wallMs,
  });
}
