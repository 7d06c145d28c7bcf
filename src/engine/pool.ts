/** Bounded concurrency for simulator jobs, and the default job count per engine. */
import { availableParallelism, freemem } from 'node:os';

/**
 * Maps `items` through `fn` with at most `limit` calls in flight; results keep the input order.
 * After the first rejection, or once `signal` aborts, no new item starts; the promise rejects (with that
 * error, or with `signal.reason`) when the calls already running have settled.
 * @param limit maximum concurrent calls (at least 1)
 */
export async function mapPool<T, R>(
  items: readonly T[],
  limit: number,
  fn: (item: T, index: number) => Promise<R>,
  signal?: AbortSignal,
): Promise<R[]> {
  const results = new Array<R>(items.length);
  let next = 0;
  let failure: { error: unknown } | undefined;
  const lane = async (): Promise<void> => {
    while (next < items.length && !failure) {
      if (signal?.aborted) {
        failure = { error: signal.reason };
        return;
      }
      const i = next++;
      try {
        results[i] = await fn(items[i], i);
      } catch (error) {
        failure ??= { error };
      }
    }
  };
  const lanes = Math.max(1, Math.min(Math.floor(limit) || 1, items.length));
  await Promise.all(Array.from({ length: lanes }, lane));
  if (!failure && signal?.aborted && next < items.length) failure = { error: signal.reason };
  if (failure) throw failure.error;
  return results;
}

/** Host facts for defaultJobs; read from node:os when not given. */
export interface HostInfo {
  /** @default os.availableParallelism() */
  cpus?: number;
  /** Free memory in bytes. @default os.freemem() */
  freeBytes?: number;
}

/** Free memory (bytes) below which the wasm engine gets one worker: each needs ~0.4-0.5 GB. */
export const WASM_TWO_WORKER_MIN_FREE = 1.5 * 1024 ** 3;

/**
 * Default number of parallel jobs: min(CPUs, 2); for 'wasm' 1 when free memory is under 1.5 GB.
 */
export function defaultJobs(engineName: 'wasm' | 'ngspice', host: HostInfo = {}): number {
  const cpus = host.cpus ?? availableParallelism();
  const jobs = Math.max(1, Math.min(cpus, 2));
  if (engineName === 'wasm' && (host.freeBytes ?? freemem()) < WASM_TWO_WORKER_MIN_FREE) return 1;
  return jobs;
}

/** Memory one wasm worker may take (RSS 0.4-0.5 GB per eecircuit-engine 1.8 instance after a few runs, measured during development; bench/RESULTS.md section 6 has the current figure), bytes. */
export const WASM_WORKER_BYTES = 0.5 * 1024 ** 3;

/**
 * Most jobs the host can hold at once, whatever --jobs asks for: wasm one worker per 0.5 GB of free
 * memory; native ngspice (~13 MB per process) 4 per CPU, beyond which processes only wait for a core.
 * Never below 1.
 */
export function maxJobs(engineName: 'wasm' | 'ngspice', host: HostInfo = {}): number {
  if (engineName === 'wasm') return Math.max(1, Math.floor((host.freeBytes ?? freemem()) / WASM_WORKER_BYTES));
  return Math.max(1, 4 * (host.cpus ?? availableParallelism()));
}
