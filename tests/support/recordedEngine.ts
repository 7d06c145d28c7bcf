import { createHash } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { gunzipSync, gzipSync } from 'node:zlib';
import { createNgspiceEngine } from '../../src/engine/native.js';
import { parseRaw } from '../../src/engine/rawfile.js';
import { plotVectors } from '../../src/engine/result.js';
import type { SimEngine, SimJob, SimResult } from '../../src/engine/types.js';

/**
 * A SimEngine that replays real simulator output recorded earlier with the system ngspice, so the
 * study orchestrator can be tested without an engine. Each run is stored as the raw file ngspice
 * wrote (gzipped) plus its outcome (ok, failure, diagnostics); replay parses the raw file with the
 * project's own parser, as the native engine does. Runs are keyed by job id and their order within
 * that id, so a change of deck text that keeps the circuit replays the same output.
 */

/** One recorded run. */
export interface RecordedRun {
  id: string;
  /** 0-based order of this run among the runs with the same id. */
  n: number;
  /** sha256 of the deck text that produced it (for the record; replay does not require a match). */
  deck: string;
  /** File name of the gzipped raw file in the recording folder, or null when none was written. */
  raw: string | null;
  ok: boolean;
  failure?: SimResult['failure'];
  partial: boolean;
  diagnostics: SimResult['diagnostics'];
}

/** The recording folder's index. */
export interface Recording {
  engine: { name: 'ngspice'; version: string };
  runs: RecordedRun[];
}

const sha = (s: string) => createHash('sha256').update(s).digest('hex');

/** Wraps the system ngspice and writes every run into `dir` (index.json + <id>.<n>.raw.gz). */
export function recordingEngine(dir: string): SimEngine & { save(): void } {
  const inner = createNgspiceEngine({ keepDir: true });
  const runs: RecordedRun[] = [];
  const count = new Map<string, number>();
  let version = '';
  mkdirSync(dir, { recursive: true });
  return {
    name: 'ngspice',
    async version() { return (version = await inner.version()); },
    async run(job: SimJob) {
      const r = await inner.run(job);
      const n = count.get(job.id) ?? 0;
      count.set(job.id, n + 1);
      let raw: string | null = null;
      try {
        const bytes = readFileSync(join(r.workDir!, 'out.raw'));
        raw = `${job.id}.${n}.raw.gz`;
        writeFileSync(join(dir, raw), gzipSync(bytes, { level: 9 }));
      } catch { /* no raw file written */ }
      runs.push({ id: job.id, n, deck: sha(job.deck), raw, ok: r.ok, ...(r.failure ? { failure: r.failure } : {}), partial: r.partial, diagnostics: r.diagnostics });
      return r;
    },
    close: () => inner.close(),
    save() {
      writeFileSync(join(dir, 'index.json'), JSON.stringify({ engine: { name: 'ngspice', version }, runs } satisfies Recording, null, 1) + '\n');
    },
  };
}

/**
 * Replays a recording. `substitute` maps a job id to another recorded id whose runs answer it (e.g.
 * a recorded failure). A job beyond the recording fails the test with a message saying so.
 */
export function replayEngine(dir: string, substitute: Record<string, string> = {}): SimEngine & { jobs: string[] } {
  const rec = JSON.parse(readFileSync(join(dir, 'index.json'), 'utf8')) as Recording;
  const count = new Map<string, number>();
  const jobs: string[] = [];
  return {
    name: 'ngspice',
    jobs,
    async version() { return rec.engine.version; },
    async run(job: SimJob): Promise<SimResult> {
      jobs.push(job.id);
      const id = substitute[job.id] ?? job.id;
      const own = rec.runs.filter((r) => r.id === id);
      const n = count.get(job.id) ?? 0;
      count.set(job.id, n + 1);
      // a substitute answers every run with its last recorded one (e.g. each rung of the retry ladder)
      const r = substitute[job.id] ? own[Math.min(n, own.length - 1)] : own[n];
      if (!r) throw new Error(`recording in ${dir} has ${own.length} runs of ${id}; the study asked for run ${n + 1} (re-record: see the test's header)`);
      let vectors: SimResult['vectors'] = {};
      if (r.ok && r.raw) {
        const plots = parseRaw(new Uint8Array(gunzipSync(readFileSync(join(dir, r.raw)))));
        vectors = plotVectors(plots[plots.length - 1]!);
      }
      return { id: job.id, ok: r.ok, ...(r.failure ? { failure: r.failure } : {}), partial: r.partial, vectors, diagnostics: r.diagnostics, wallMs: 0 };
    },
    async close() {},
  };
}
