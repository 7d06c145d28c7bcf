/** Pure checks on a SimJob shared by both engines, applied before anything is written or run. */
import type { SimJob } from './types.js';

const ASCII = /^[\x00-\x7f]*$/;
/** Files the engines write next to the includes (native job dir; wasm MEMFS root). */
const RESERVED = new Set(['deck.cir', 'out.raw', 'test.cir', 'spinit']);

/** True when `path` is a safe relative include path: no '..', not absolute, no backslash or NUL. */
export function isSafeIncludePath(path: string): boolean {
  if (path === '' || path.startsWith('/') || /[\\\0]/.test(path) || /^[A-Za-z]:/.test(path)) return false;
  return path.split('/').every((seg) => seg !== '..' && seg !== '');
}

/**
 * Returns the reason the job cannot be run (reported as an input failure), or undefined when it is fine.
 * Decks and includes must be 7-bit ASCII: the wasm engine hangs on non-ASCII text.
 */
export function checkJob(job: SimJob): string | undefined {
  if (!ASCII.test(job.deck)) return 'deck is not 7-bit ASCII';
  for (const [path, text] of Object.entries(job.includes ?? {})) {
    if (!isSafeIncludePath(path)) return `include path ${JSON.stringify(path)} must be relative without '..'`;
    if (RESERVED.has(path.toLowerCase())) return `include path ${JSON.stringify(path)} is reserved for the engine's own files`;
    if (!ASCII.test(text)) return `deck is not 7-bit ASCII (include ${path})`;
  }
  return undefined;
}

/** Largest delay a Node timer accepts (ms); longer ones would fire at once. */
const MAX_TIMER_MS = 2_147_483_647;

/** The job's time limit as a usable timer delay in whole ms, or undefined for no limit (<= 0, NaN, Infinity). */
export function timeLimitMs(timeoutMs: number): number | undefined {
  if (!(timeoutMs > 0) || timeoutMs === Infinity) return undefined;
  return Math.min(Math.ceil(timeoutMs), MAX_TIMER_MS);
}
