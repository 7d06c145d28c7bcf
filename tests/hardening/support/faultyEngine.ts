/**
 * Fault injection around a real SimEngine: the runs of one corner get a rewritten deck (and, if
 * given, their own time limit); everything else passes through unchanged. The engine underneath is
 * the real one, so what is tested is how it and the study handle a deck that misbehaves.
 */
import type { SimEngine, SimJob } from '../../../src/engine/types.js';

/** Makes a deck simulate 10 s of circuit time (minutes of work) while saving only the last 10 ms. */
export const lengthenDeck = (deck: string): string => deck.replace(/^\.tran .*$/m, '.tran 1e-7 10 9.99 1e-7 uic');

/** Adds a POLY controlled source: the wasm build has no XSPICE, and ngspice stops with a fatal error. */
export const polyDeck = (deck: string): string => deck.replace(/^\.end\s*$/m, 'Epoly pz 0 POLY(1) out 0 0 1\nRpz pz 0 1k\n.end');

export function faultyEngine(inner: SimEngine, corner: string, deck: (d: string) => string, patch: Partial<SimJob> = {}): SimEngine & { hits: number } {
  const e = {
    name: inner.name,
    hits: 0,
    version: () => inner.version(),
    close: () => inner.close(),
    run(job: SimJob) {
      if (job.id !== corner) return inner.run(job);
      e.hits++;
      return inner.run({ ...job, ...patch, deck: deck(job.deck) });
    },
  };
  return e;
}
