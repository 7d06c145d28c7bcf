/** Simulator engines: the SimEngine contract, the wasm and system-ngspice adapters and their helpers. */
import { createNgspiceEngine, type NgspiceEngineOptions } from './native.js';
import { createWasmEngine, type WasmEngineOptions } from './wasm.js';
import type { SimEngine } from './types.js';

export type { Attempt, Diagnostic, SimEngine, SimFailure, SimJob, SimResult } from './types.js';
export { EngineUnavailableError } from './errors.js';
export { createNgspiceEngine, probeNgspice, type NgspiceEngineOptions } from './native.js';
export { createWasmEngine, type WasmEngine, type WasmEngineOptions } from './wasm.js';
export { parseRaw, normaliseVectorName, RawFormatError, type RawPlot, type RawVariable } from './rawfile.js';
export { classifyRun, parseDiagnostics, findTimestepFailure, type RunOutcome, type Classification } from './classify.js';
export { mapPool, defaultJobs, maxJobs, type HostInfo } from './pool.js';
export { runWithRetries, RETRY_LADDER, ZERO_START_LABEL, type RetryRung } from './retry.js';

/** Engine names as the CLI spells them. */
export type EngineName = 'wasm' | 'ngspice';

/** Options for createEngine; each engine reads only its own fields. */
export type EngineOptions = WasmEngineOptions & NgspiceEngineOptions;

/** Creates the named engine ('wasm' = embedded eecircuit-engine, 'ngspice' = the system binary). */
export function createEngine(name: EngineName, opts: EngineOptions = {}): SimEngine {
  if (name === 'wasm') return createWasmEngine({ workers: opts.workers, recycleAfter: opts.recycleAfter, startTimeoutMs: opts.startTimeoutMs });
  if (name === 'ngspice') return createNgspiceEngine({ path: opts.path, keepDir: opts.keepDir, tmpRoot: opts.tmpRoot, killGraceMs: opts.killGraceMs });
  throw new Error(`unknown engine ${JSON.stringify(name)}`);
}
