/**
 * Thrown by an engine's `version()` (and by `probeNgspice`) when the simulator cannot be started at all:
 * the ngspice binary is missing or not executable, or the wasm engine fails to load. The CLI maps it to
 * exit code 4. Simulator problems during a run are never thrown; they come back as `SimResult.failure`.
 */
export class EngineUnavailableError extends Error {
  override name = 'EngineUnavailableError';
  constructor(
    message: string,
    /** 'ngspice' | 'wasm' */
    readonly engine: string,
    options?: { cause?: unknown },
  ) {
    super(message, options);
  }
}
