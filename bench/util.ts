/** Small helpers of the benchmark: progress on stderr, statistics, an instrumented engine, an RSS sampler. */
import type { SimEngine } from '../src/engine/index.js';

const T0 = performance.now();

/** One progress line on stderr, prefixed with the seconds since the bench started. */
export function log(msg: string): void {
  process.stderr.write(`[bench ${((performance.now() - T0) / 1000).toFixed(1).padStart(6)} s] ${msg}\n`);
}

/** Seconds since the bench started. */
export function elapsedS(): number {
  return (performance.now() - T0) / 1000;
}

export function median(xs: readonly number[]): number {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

export function mean(xs: readonly number[]): number {
  return xs.length === 0 ? NaN : xs.reduce((a, b) => a + b, 0) / xs.length;
}

export function maxAbs(xs: readonly number[]): number {
  return xs.reduce((a, b) => Math.max(a, Math.abs(b)), 0);
}

/** Fixed-point rendering; '-' for a missing or non-finite value. */
export function fix(x: number | null | undefined, digits: number): string {
  return x === null || x === undefined || !Number.isFinite(x) ? '-' : x.toFixed(digits);
}

/** A fraction as percent with sign, e.g. 0.00123 -> '+0.123 %'. */
export function pct(x: number | null | undefined, digits = 3): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return '-';
  return `${x >= 0 ? '+' : ''}${(x * 100).toFixed(digits)} %`;
}

export function passFail(ok: boolean): string {
  return ok ? 'met' : '**missed**';
}

/** Counts of an engine's run() calls and the wall time spent inside them. */
export interface EngineCounter {
  calls: number;
  ms: number;
}

/** Wraps an engine so that every run() is counted and timed (the wrapped engine does the work). */
export function instrument(engine: SimEngine): { engine: SimEngine; counter: EngineCounter } {
  const counter: EngineCounter = { calls: 0, ms: 0 };
  const wrapped: SimEngine = {
    name: engine.name,
    version: () => engine.version(),
    async run(job) {
      const t0 = performance.now();
      try {
        return await engine.run(job);
      } finally {
        counter.calls += 1;
        counter.ms += performance.now() - t0;
      }
    },
    close: () => engine.close(),
  };
  return { engine: wrapped, counter };
}

/** Samples the process RSS (worker threads included) every `periodMs` until stopped; returns the peak in bytes. */
export function sampleRss(periodMs = 50): { stop(): number } {
  let peak = process.memoryUsage().rss;
  const timer = setInterval(() => {
    peak = Math.max(peak, process.memoryUsage().rss);
  }, periodMs);
  return {
    stop() {
      clearInterval(timer);
      return Math.max(peak, process.memoryUsage().rss);
    },
  };
}

export const MB = 1024 * 1024;
